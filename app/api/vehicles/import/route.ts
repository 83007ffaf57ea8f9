import { NextResponse } from "next/server";
import { DEFAULT_MAX_BYTES } from "@/imports";
import { importVehicleFile } from "@/lib/commands/imports";
import { AppError } from "@/lib/server/errors";
import { jsonError } from "@/lib/server/route";
import { currentUser } from "@/lib/server/session";

/** Room for the multipart framing and the mapping beside a file at the size limit. */
const FORM_OVERHEAD_BYTES = 256 * 1024;

/** The multipart fields as plain values; a body that is not a form reads as empty (422 after sign-in checks). */
async function readImportForm(request: Request): Promise<Record<string, unknown>> {
  const type = request.headers.get("content-type") ?? "";
  if (!type.toLowerCase().startsWith("multipart/form-data")) return {};
  try {
    const form = await request.formData();
    const out: Record<string, unknown> = {};
    for (const name of ["file", "mapping", "dryRun", "mode"]) {
      const value = form.get(name);
      if (value !== null) out[name] = value;
    }
    return out;
  } catch {
    throw new AppError("bad_request", "The upload could not be read; send it as multipart/form-data with a file field");
  }
}

/**
 * POST /api/vehicles/import — multipart: `file` (CSV or XLSX), optional `mapping` (JSON:
 * heading → field or null), `dryRun=1`, `mode=all_or_nothing|good_rows` (default all_or_nothing).
 */
export async function POST(request: Request): Promise<Response> {
  try {
    const length = Number(request.headers.get("content-length") ?? "0");
    if (Number.isFinite(length) && length > DEFAULT_MAX_BYTES + FORM_OVERHEAD_BYTES) {
      const limit = `${DEFAULT_MAX_BYTES / (1024 * 1024)} MB`;
      throw new AppError("payload_too_large", `The upload is larger than the ${limit} limit`, [{ field: "file", message: `Files up to ${limit} can be imported` }]);
    }
    const user = await currentUser();
    const result = await importVehicleFile(user, await readImportForm(request));
    return NextResponse.json(result, { status: 200 });
  } catch (error) {
    return jsonError(error);
  }
}
