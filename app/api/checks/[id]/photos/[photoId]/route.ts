import { readCheckPhoto } from "@/lib/commands/checks";
import { routeHandler } from "@/lib/server/route";

export const GET = routeHandler(readCheckPhoto, (_request, params) => ({ id: params.id, photoId: params.photoId }), {
  respond: (photo) =>
    new Response(new Uint8Array(photo.bytes), {
      headers: {
        "content-type": photo.contentType,
        "content-disposition": `inline; filename="${photo.filename.replace(/"/g, "")}"`,
        "cache-control": "private, max-age=86400",
      },
    }),
});
