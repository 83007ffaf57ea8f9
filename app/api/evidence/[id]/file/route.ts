import { evidenceFile } from "@/lib/commands/evidence";
import { fileResponse } from "@/lib/server/files";
import { routeHandler } from "@/lib/server/route";

/** The evidence file, only to users allowed to see its job; never a public address. */
export const GET = routeHandler(evidenceFile, (_request, params) => ({ id: params.id }), {
  respond: (file) =>
    fileResponse({ body: file.bytes, contentType: file.contentType, filename: file.filename, disposition: "inline", sha256: file.sha256 }),
});
