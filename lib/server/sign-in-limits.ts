import type { Limit } from "@/db/rate-limit";

/** Failed sign-ins allowed per window before the form says to wait. */
export const SIGN_IN_LIMITS: { perEmail: Limit; perClient: Limit } = {
  perEmail: { max: 5, windowMs: 15 * 60_000 },
  perClient: { max: 30, windowMs: 15 * 60_000 },
};

/** The client's address as the proxy in front of the app reports it. */
export function clientKey(request: Request | undefined): string {
  const forwarded = request?.headers.get("x-forwarded-for")?.split(",")[0]?.trim();
  return forwarded || request?.headers.get("x-real-ip") || "unknown";
}
