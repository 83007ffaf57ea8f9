import { listChecksQuery, submitCheck } from "@/lib/commands/checks";
import { AppError } from "@/lib/server/errors";
import { queryParams, readJson, routeHandler } from "@/lib/server/route";

/** Checks the caller may see: a driver their own, managers and admins the organisation's. */
export const GET = routeHandler(listChecksQuery, (request) => queryParams(request));

/**
 * A finished pre-trip check, as JSON or as multipart form data: the fields, `items` as a JSON
 * list of {key, result, note}, and photo files under `photos.<item key>`. Idempotent on
 * `clientId`: 201 the first time, 200 with the check already held on a repeat.
 */
export const POST = routeHandler(submitCheck, async (request) => {
  const type = request.headers.get("content-type") ?? "";
  if (type.startsWith("multipart/form-data")) {
    const form = await request.formData().catch(() => {
      throw new AppError("bad_request", "The form data could not be read");
    });
    const fields: Record<string, unknown> = {};
    const photos: Record<string, Blob[]> = {};
    for (const [key, value] of form.entries()) {
      if (key.startsWith("photos.")) {
        if (typeof value !== "string") (photos[key.slice("photos.".length)] ??= []).push(value);
      } else if (typeof value === "string") fields[key] = value;
    }
    let items: unknown = fields.items;
    if (typeof items === "string") {
      try {
        items = JSON.parse(items);
      } catch {
        throw new AppError("bad_request", "items must be a JSON list", [{ field: "items", message: "items must be a JSON list" }]);
      }
    }
    return { ...fields, items, photos };
  }
  const body = await readJson(request);
  if (typeof body !== "object" || body === null || Array.isArray(body)) throw new AppError("bad_request", "The request body must be a JSON object");
  return body;
}, { respond: (result) => Response.json(result, { status: result.created ? 201 : 200 }) });
