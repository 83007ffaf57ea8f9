/**
 * Sends the phone's queued reports, one at a time (never two copies in flight from this phone),
 * when the network is back, on a timer, or when the driver presses "Send now". Browser only.
 */
import { listQueued, recordAttempt, wakeSignedOut, type QueuedReport } from "./queue";
import { classifyAttempt, isDue, type SendOutcome } from "./retry";

export type SendReply = { outcome: SendOutcome; status: number | null; body: unknown };

function formOf(item: QueuedReport): FormData {
  const form = new FormData();
  for (const [k, v] of Object.entries(item.fields)) form.set(k, v);
  for (const f of item.files) form.append(f.field, f.blob, f.name);
  return form;
}

/** One attempt at one report. */
export async function sendQueued(item: QueuedReport): Promise<SendReply> {
  let status: number | null = null;
  let body: unknown = null;
  try {
    const response = await fetch(item.url, { method: "POST", body: formOf(item), credentials: "same-origin", headers: { accept: "application/json" } });
    status = response.status;
    body = await response.json().catch(() => null);
  } catch {
    status = null;
  }
  const message = (body as { error?: { message?: string } } | null)?.error?.message ?? null;
  const outcome = classifyAttempt(status, message);
  await recordAttempt(item, outcome, Date.now());
  return { outcome, status, body };
}

let running: Promise<Map<string, SendReply>> | null = null;

/**
 * Sends every due report of this user, oldest first. While one flush runs, another call waits
 * for it (and the Web Locks API keeps two tabs of the same phone from sending at once).
 */
export function flushQueue(userId: string, options: { force?: boolean } = {}): Promise<Map<string, SendReply>> {
  if (running) return running;
  const work = async () => {
    const replies = new Map<string, SendReply>();
    if (typeof navigator !== "undefined" && navigator.onLine === false) return replies;
    await wakeSignedOut(userId);
    for (const item of await listQueued()) {
      if (item.userId !== userId || item.status === "signed_out" || !isDue(item, Date.now(), options.force)) continue;
      const reply = await sendQueued(item);
      replies.set(item.id, reply);
      // No signal or no session: the rest would fail the same way.
      if (reply.outcome.kind === "retry" && reply.status === null) break;
      if (reply.outcome.kind === "signed_out") break;
    }
    return replies;
  };
  const locks = typeof navigator !== "undefined" ? (navigator as Navigator & { locks?: LockManager }).locks : undefined;
  running = (locks ? (locks.request("rigline-outbox", work) as Promise<Map<string, SendReply>>) : work()).finally(() => {
    running = null;
  });
  return running;
}
