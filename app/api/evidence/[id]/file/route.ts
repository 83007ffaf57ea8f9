import { evidenceFile } from "@/lib/commands/evidence";
import { routeHandler } from "@/lib/server/route";

/** The evidence file, only to users allowed to see its job; never a public address. */
export const GET = routeHandler(evidenceFile, (_request, params) => ({ id: params.id }), {
  respond: (file) =>
    new Response(new Uint8Array(file.bytes), {
      status: 200,
      headers: {
        "content-type": file.contentType,
        "content-length": String(file.bytes.length),
        "content-disposition": `inline; filename="${file.filename.replace(/[^A-Za-z0-9._ -]/g, "_")}"`,
        "cache-control": "private, no-store",
        "x-content-type-options": "nosniff",
        "content-security-policy": "default-src 'none'; img-src 'self'; style-src 'unsafe-inline'; sandbox",
        etag: `"${file.sha256}"`,
      },
    }),
});
