import { AppError } from "@/lib/server/errors";
import { readJson } from "@/lib/server/route";

/** A JSON object body merged with the route's id (the id in the path always wins). */
export async function bodyWithId(request: Request, params: Record<string, string | string[]>, idField = "id") {
  const body = await readJson(request);
  if (typeof body !== "object" || body === null || Array.isArray(body)) throw new AppError("bad_request", "The request body must be a JSON object");
  return { ...body, [idField]: params.id };
}
