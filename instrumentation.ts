/** Runs once when a server process starts: validate the environment, start the mail sender. */
export async function register() {
  if (process.env.NEXT_RUNTIME !== "nodejs") return;
  const { env } = await import("./lib/env");
  const settings = env(); // throws with the bad variable named
  if (settings.OUTBOX_SENDER === "on") {
    const [{ db }, { startOutboxSender }] = await Promise.all([
      import("./db/client"),
      import("./lib/server/mail/sender"),
    ]);
    startOutboxSender(db, settings.OUTBOX_INTERVAL_MS);
  }
}
