import type { SignedIn } from "@/lib/server/session";

/**
 * Calls a route handler as a given user. Test files that use this mock the session module:
 *
 *   vi.mock("@/lib/server/session", async (original) => ({
 *     ...(await original<typeof import("@/lib/server/session")>()),
 *     currentUser: async () => requestUser.current,
 *   }));
 */
export const requestUser: { current: SignedIn | null } = { current: null };

type Handler = (request: Request, context: { params: Promise<Record<string, string | string[]>> }) => Promise<Response>;

export async function callRoute(
  handler: Handler,
  options: { user: SignedIn | null; method?: string; url?: string; body?: unknown; params?: Record<string, string>; headers?: Record<string, string> },
): Promise<{ status: number; json: unknown; response: Response }> {
  requestUser.current = options.user;
  const init: RequestInit = { method: options.method ?? (options.body === undefined ? "GET" : "POST"), headers: options.headers };
  if (options.body !== undefined) {
    init.body = typeof options.body === "string" || options.body instanceof FormData ? (options.body as BodyInit) : JSON.stringify(options.body);
    if (!(options.body instanceof FormData)) init.headers = { "content-type": "application/json", ...options.headers };
  }
  const response = await handler(new Request(options.url ?? "http://localhost/api/test", init), { params: Promise.resolve(options.params ?? {}) });
  const type = response.headers.get("content-type") ?? "";
  const json = type.includes("json") ? await response.clone().json() : null;
  return { status: response.status, json, response };
}
