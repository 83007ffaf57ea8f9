import { readDefectPhoto } from "@/lib/commands/defects";
import { fileResponse } from "@/lib/server/files";
import { routeHandler } from "@/lib/server/route";

/** A photo, only to users allowed to see its defect; never a public address. */
export const GET = routeHandler(readDefectPhoto, (_request, params) => ({ id: params.id, photoId: params.photoId }), {
  respond: (photo) =>
    fileResponse({ body: photo.bytes, contentType: photo.contentType, filename: photo.filename, disposition: "inline", maxAgeSeconds: 86_400 }),
});
