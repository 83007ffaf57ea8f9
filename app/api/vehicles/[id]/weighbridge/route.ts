import { listWeighbridgeQuery, recordWeighbridgeTicket, TICKET_FILE_MAX_BYTES } from "@/lib/commands/mass";
import { formDataToObject } from "@/lib/server/actions";
import { AppError } from "@/lib/server/errors";
import { readJson, routeHandler } from "@/lib/server/route";
import { formatBytes } from "@/lib/uploads";

/** Room for the ticket's other fields and the multipart framing around the file. */
const FORM_OVERHEAD_BYTES = 64 * 1024;

export const GET = routeHandler(listWeighbridgeQuery, (_request, params) => ({ id: String(params.id ?? "") }));

/**
 * Record a ticket: multipart/form-data with `weighedAt`, `ticketNumber`, `frontKg`, `rearKg`,
 * `grossKg`, optional `jobId` and optional `file` (PDF, JPEG, PNG or WebP); a JSON body without a
 * file is accepted too.
 */
export const POST = routeHandler(
  recordWeighbridgeTicket,
  async (request, params) => {
    const id = String(params.id ?? "");
    if ((request.headers.get("content-type") ?? "").includes("multipart/form-data")) {
      const declared = Number(request.headers.get("content-length") ?? "0");
      if (declared > TICKET_FILE_MAX_BYTES + FORM_OVERHEAD_BYTES) {
        throw new AppError("payload_too_large", `The upload is ${formatBytes(declared)}; the limit is ${formatBytes(TICKET_FILE_MAX_BYTES)}`, [
          { field: "file", message: "The file is too large" },
        ]);
      }
      let form: FormData;
      try {
        form = await request.formData();
      } catch {
        throw new AppError("bad_request", "The form could not be read");
      }
      return { ...formDataToObject(form), id };
    }
    const body = await readJson(request);
    return { ...(body && typeof body === "object" ? body : {}), id };
  },
  { status: 201 },
);
