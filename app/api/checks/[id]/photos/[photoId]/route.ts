import { readCheckPhoto } from "@/lib/commands/checks";
import { fileResponse } from "@/lib/server/files";
import { routeHandler } from "@/lib/server/route";

/** A photo, only to users allowed to see its check; never a public address. */
export const GET = routeHandler(readCheckPhoto, (_request, params) => ({ id: params.id, photoId: params.photoId }), {
  respond: (photo) =>
    fileResponse({ body: photo.bytes, contentType: photo.contentType, filename: photo.filename, disposition: "inline", maxAgeSeconds: 86_400 }),
});
