/**
 * Puts a report in the phone's outbox and tries to send it at once. Every report goes through
 * the outbox, with signal or without, so a dropped connection halfway never loses one.
 * Browser only.
 */
import { enqueue, listQueued, removeQueued, type QueuedFile, type QueuedReport } from "./queue";
import { flushQueue } from "./send";

export type SubmitResult =
  | { state: "sent"; body: unknown }
  | { state: "queued"; reason: string | null }
  | { state: "refused"; message: string; fieldErrors: Record<string, string> };

export async function submitReport(report: {
  id: string;
  kind: QueuedReport["kind"];
  userId: string;
  url: string;
  fields: Record<string, string>;
  files: QueuedFile[];
  label: string;
}): Promise<SubmitResult> {
  await enqueue(report);
  if (typeof navigator !== "undefined" && navigator.onLine === false) return { state: "queued", reason: "No signal" };
  let replies = await flushQueue(report.userId, { force: true });
  // A flush already under way when this was queued may not have included it.
  if (!replies.has(report.id) && (await listQueued()).some((i) => i.id === report.id)) replies = await flushQueue(report.userId, { force: true });
  const reply = replies.get(report.id);
  if (!reply) {
    const still = (await listQueued()).find((i) => i.id === report.id);
    return still ? { state: "queued", reason: still.lastError } : { state: "sent", body: null };
  }
  switch (reply.outcome.kind) {
    case "sent":
      return { state: "sent", body: reply.body };
    case "refused": {
      // Nothing was stored: take it back out of the outbox so the driver can put it right.
      await removeQueued(report.id);
      const details = ((reply.body as { error?: { details?: { field?: string; message: string }[] } } | null)?.error?.details ?? []);
      const fieldErrors: Record<string, string> = {};
      for (const d of details) if (d.field && !fieldErrors[d.field]) fieldErrors[d.field] = d.message;
      return { state: "refused", message: reply.outcome.reason, fieldErrors };
    }
    case "signed_out":
      return { state: "queued", reason: "Sign in again to send it" };
    case "retry":
      return { state: "queued", reason: reply.outcome.reason };
  }
}
