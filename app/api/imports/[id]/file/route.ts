import { contentTypeOfFormat, getImportFile } from "@/lib/commands/imports";
import { fileResponse } from "@/lib/server/files";
import { routeHandler } from "@/lib/server/route";

/** GET /api/imports/{id}/file — the original uploaded file, exactly as it was received. */
export const GET = routeHandler(getImportFile, (_request, params) => ({ id: params.id }), {
  // The type comes from what the file was read as, never from what the uploader claimed.
  respond: (file) => fileResponse({ body: file.bytes, contentType: contentTypeOfFormat(file.format), filename: file.filename }),
});
