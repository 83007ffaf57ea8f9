import { weighbridgeTicketFile } from "@/lib/commands/mass";
import { fileResponse } from "@/lib/server/files";
import { routeHandler } from "@/lib/server/route";

/** A weighbridge ticket's file, only to users who may read the vehicle's tickets; never a public address. */
export const GET = routeHandler(weighbridgeTicketFile, (_request, params) => ({ id: String(params.id ?? ""), ticketId: String(params.ticketId ?? "") }), {
  respond: (file) => fileResponse({ body: file.bytes, contentType: file.contentType, filename: file.filename, sha256: file.sha256 }),
});
