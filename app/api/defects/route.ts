import { listDefectsQuery, submitDefect } from "@/lib/commands/defects";
import { AppError } from "@/lib/server/errors";
import { queryParams, readJson, routeHandler } from "@/lib/server/route";

/** Defects the caller may see: ?state=open|reported|…&severity=&vehicleId=&page=&pageSize= */
export const GET = routeHandler(listDefectsQuery, (request) => queryParams(request));

/**
 * A defect report, as JSON or as multipart form data with `photos` files. Idempotent on
 * `clientId`: the first arrival answers 201, a repeat 200 with the report already held.
 */
export const POST = routeHandler(submitDefect, async (request) => {
  const type = request.headers.get("content-type") ?? "";
  if (type.startsWith("multipart/form-data")) {
    const form = await request.formData().catch(() => {
      throw new AppError("bad_request", "The form data could not be read");
    });
    const fields: Record<string, unknown> = {};
    for (const [key, value] of form.entries()) if (typeof value === "string" && key !== "photos") fields[key] = value;
    return { ...fields, photos: form.getAll("photos").filter((v) => typeof v !== "string") };
  }
  const body = await readJson(request);
  if (typeof body !== "object" || body === null || Array.isArray(body)) throw new AppError("bad_request", "The request body must be a JSON object");
  return body;
}, { respond: (result) => Response.json(result, { status: result.created ? 201 : 200 }) });
