import { AppError } from "@/lib/server/errors";
import { jsonError } from "@/lib/server/route";

export const dynamic = "force-dynamic";

/**
 * Benchmark-only: the bare route `npm run bench` measures the register API against. It answers
 * a precomputed JSON body of `?bytes=` bytes — what a route handler costs with no session, no
 * database and no serialisation — and is 404 unless the server was started with
 * RIGLINE_BENCH_ROUTES=1, which only the benchmark sets.
 */
const MAX_BYTES = 1_000_000;
/** The last body built: the benchmark asks for one size many times. */
let cached: { bytes: number; body: Uint8Array } | undefined;

function bodyOf(bytes: number): Uint8Array {
  if (cached?.bytes !== bytes) {
    // {"padding":"xxx…"} of exactly `bytes` bytes (ASCII, so characters are bytes).
    const frame = JSON.stringify({ padding: "" }).length;
    cached = { bytes, body: new TextEncoder().encode(JSON.stringify({ padding: "x".repeat(bytes - frame) })) };
  }
  return cached.body;
}

export function GET(request: Request): Response {
  if (process.env.RIGLINE_BENCH_ROUTES !== "1") return jsonError(new AppError("not_found", "Not found"));
  const raw = new URL(request.url).searchParams.get("bytes") ?? "";
  const bytes = /^\d{1,7}$/.test(raw) ? Number(raw) : NaN;
  if (!(bytes >= 16 && bytes <= MAX_BYTES)) {
    const message = `bytes must be a whole number from 16 to ${MAX_BYTES}`;
    return jsonError(new AppError("validation_failed", message, [{ field: "bytes", message }]));
  }
  return new Response(bodyOf(bytes) as BodyInit, { headers: { "content-type": "application/json" } });
}
