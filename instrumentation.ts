/**
 * Runs once when a server process starts: validate the environment, start the mail sender and
 * the daily fleet snapshot (Node.js runtime only; the snapshot never while `next build` runs).
 */
export async function register() {
  if (process.env.NEXT_RUNTIME !== "nodejs") return;
  const { env } = await import("./lib/env");
  const settings = env(); // throws with the bad variable named
  const { db } = await import("./db/client");
  if (process.env.NEXT_PHASE !== "phase-production-build") {
    const { startSnapshotScheduler } = await import("./db/costs");
    startSnapshotScheduler(db); // once per process, guarded inside
  }
  if (settings.OUTBOX_SENDER === "on") {
    const { startOutboxSender } = await import("./lib/server/mail/sender");
    startOutboxSender(db, settings.OUTBOX_INTERVAL_MS);
  }
}
