import { weighbridgeTicketFile } from "@/lib/commands/mass";
import { routeHandler } from "@/lib/server/route";

/** A weighbridge ticket's file, only to users who may read the vehicle's tickets; never a public address. */
export const GET = routeHandler(weighbridgeTicketFile, (_request, params) => ({ id: String(params.id ?? ""), ticketId: String(params.ticketId ?? "") }), {
  respond: (file) =>
    new Response(new Uint8Array(file.bytes), {
      status: 200,
      headers: {
        "content-type": file.contentType,
        "content-length": String(file.bytes.length),
        "content-disposition": `attachment; filename="${file.filename.replace(/[^A-Za-z0-9._ -]/g, "_")}"`,
        "cache-control": "private, no-store",
        "x-content-type-options": "nosniff",
        "content-security-policy": "default-src 'none'; img-src 'self'; style-src 'unsafe-inline'; sandbox",
        etag: `"${file.sha256}"`,
      },
    }),
});
