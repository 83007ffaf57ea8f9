/**
 * What to do with a queued report after a send attempt, and when to try again. Pure, so the
 * rules are tested without a browser.
 *
 * - 200/201: the server holds the report (201 new, 200 a repeat of the same device id): done.
 * - 401: nobody is signed in on this phone any more; keep it until someone signs in again.
 * - 408, 429 and 5xx, or no answer at all: the network or the server is down; try again later,
 *   waiting longer each time (10 s, 20 s, 40 s … at most 10 minutes).
 * - any other 4xx: the server refused the report itself (it names why); trying again would be
 *   refused again, so it waits for the driver to look at it.
 */

export type SendOutcome =
  | { kind: "sent" }
  | { kind: "signed_out" }
  | { kind: "retry"; reason: string }
  | { kind: "refused"; reason: string };

export const FIRST_RETRY_MS = 10_000;
export const MAX_RETRY_MS = 10 * 60_000;

/** Outcome of one attempt: `status` null when no answer came (offline, connection dropped). */
export function classifyAttempt(status: number | null, message?: string | null): SendOutcome {
  if (status === null) return { kind: "retry", reason: "No signal" };
  if (status === 200 || status === 201) return { kind: "sent" };
  if (status === 401) return { kind: "signed_out" };
  if (status === 408 || status === 429 || status >= 500) return { kind: "retry", reason: message || `The server answered ${status}` };
  if (status >= 400) return { kind: "refused", reason: message || `The server refused it (${status})` };
  return { kind: "retry", reason: `Unexpected answer ${status}` };
}

/** Milliseconds to wait before attempt number `attempts + 1` (after `attempts` failures). */
export function retryDelayMs(attempts: number): number {
  if (!Number.isInteger(attempts) || attempts < 1) return 0;
  return Math.min(MAX_RETRY_MS, FIRST_RETRY_MS * 2 ** Math.min(attempts - 1, 20));
}

/** Whether a queued item is due for another attempt now. */
export function isDue(item: { nextAttemptAt: number; status: string }, nowMs: number, force = false): boolean {
  if (item.status === "refused") return false;
  return force || item.nextAttemptAt <= nowMs;
}
