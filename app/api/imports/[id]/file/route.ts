import { attachment, contentTypeOfFormat, getImportFile } from "@/lib/commands/imports";
import { routeHandler } from "@/lib/server/route";

/** GET /api/imports/{id}/file — the original uploaded file, exactly as it was received. */
export const GET = routeHandler(getImportFile, (_request, params) => ({ id: params.id }), {
  respond: (file) =>
    new Response(new Uint8Array(file.bytes), {
      headers: {
        // The type comes from what the file was read as, never from what the uploader claimed.
        "content-type": contentTypeOfFormat(file.format),
        "content-disposition": attachment(file.filename),
        "x-content-type-options": "nosniff",
        "cache-control": "private, no-store",
      },
    }),
});
