import { lodgeEvidence } from "@/lib/commands/evidence";
import { formDataToObject } from "@/lib/server/actions";
import { AppError } from "@/lib/server/errors";
import { routeHandler } from "@/lib/server/route";
import { EVIDENCE_MAX_BYTES, formatBytes } from "@/lib/uploads";

/** Room for the form's other fields and the multipart framing around the file. */
const FORM_OVERHEAD_BYTES = 64 * 1024;

/**
 * Lodge evidence (multipart/form-data): `file`, `kind`, optional `lineKey`, `attr.<name>` measured
 * values, and for a weighbridge ticket `ticketNumber`, `weighedAt`, `frontKg`, `rearKg`, `grossKg`.
 */
export const POST = routeHandler(
  lodgeEvidence,
  async (request, params) => {
    const declared = Number(request.headers.get("content-length") ?? "0");
    if (declared > EVIDENCE_MAX_BYTES + FORM_OVERHEAD_BYTES) {
      throw new AppError("payload_too_large", `The upload is ${formatBytes(declared)}; the limit is ${formatBytes(EVIDENCE_MAX_BYTES)}`, [{ field: "file", message: "The file is too large" }]);
    }
    if (!(request.headers.get("content-type") ?? "").includes("multipart/form-data")) {
      throw new AppError("unsupported_media_type", "Send the evidence as multipart/form-data with a file field");
    }
    let form: FormData;
    try {
      form = await request.formData();
    } catch {
      throw new AppError("bad_request", "The form could not be read");
    }
    return { ...formDataToObject(form), jobId: params.id };
  },
  { status: 201 },
);
