import { NextResponse } from "next/server";
import { openApiDocument } from "@/lib/openapi";
import { jsonError } from "@/lib/server/route";

let cached: unknown = null;

/** GET /api/openapi.json — the API's OpenAPI 3.1 document (public: it holds no data). */
export async function GET(): Promise<Response> {
  try {
    cached ??= openApiDocument();
    return NextResponse.json(cached, { headers: { "cache-control": "public, max-age=300" } });
  } catch (error) {
    return jsonError(error);
  }
}
