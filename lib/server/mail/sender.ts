import { and, asc, eq, isNull, lte, or } from "drizzle-orm";
import nodemailer, { type Transporter } from "nodemailer";
import type { Database } from "@/db/client";
import { outboxMessages } from "@/db/schema";
import { env } from "@/lib/env";
import { isDead, retryDelayMs } from "@/lib/mail/backoff";

export type MailTransport = Pick<Transporter, "sendMail">;

export function smtpTransport(): MailTransport {
  const e = env();
  return nodemailer.createTransport({
    host: e.SMTP_HOST,
    port: e.SMTP_PORT,
    secure: e.SMTP_SECURE,
    auth: e.SMTP_USER ? { user: e.SMTP_USER, pass: e.SMTP_PASSWORD ?? "" } : undefined,
    // The local stand-in has no TLS; real providers negotiate STARTTLS on their own.
    ignoreTLS: e.SMTP_HOST === "127.0.0.1" || e.SMTP_HOST === "localhost",
    connectionTimeout: 5000,
    greetingTimeout: 5000,
    socketTimeout: 10000,
  });
}

const LOCK_MS = 60_000;

export type DeliveryReport = { sent: number; failed: number; dead: number };

/**
 * Delivers the messages that are due. Each message is claimed with a short lock first, so two
 * senders (two app servers) never deliver one message twice.
 */
export async function deliverDue(
  db: Database,
  transport: MailTransport,
  options: { now?: Date; batch?: number; from?: string } = {},
): Promise<DeliveryReport> {
  const now = options.now ?? new Date();
  const from = options.from ?? env().MAIL_FROM;
  const due = await db
    .select({ id: outboxMessages.id })
    .from(outboxMessages)
    .where(
      and(
        eq(outboxMessages.status, "pending"),
        lte(outboxMessages.nextAttemptAt, now),
        or(isNull(outboxMessages.lockedUntil), lte(outboxMessages.lockedUntil, now)),
      ),
    )
    .orderBy(asc(outboxMessages.nextAttemptAt))
    .limit(options.batch ?? 20);

  const report: DeliveryReport = { sent: 0, failed: 0, dead: 0 };
  for (const { id } of due) {
    const [claimed] = await db
      .update(outboxMessages)
      .set({ lockedUntil: new Date(now.getTime() + LOCK_MS) })
      .where(
        and(
          eq(outboxMessages.id, id),
          eq(outboxMessages.status, "pending"),
          or(isNull(outboxMessages.lockedUntil), lte(outboxMessages.lockedUntil, now)),
        ),
      )
      .returning();
    if (!claimed) continue;
    try {
      await transport.sendMail({
        from,
        to: claimed.toAddress,
        subject: claimed.subject,
        text: claimed.textBody,
        html: claimed.htmlBody,
        headers: { "X-Rigline-Message": claimed.id, "X-Rigline-Kind": claimed.kind },
      });
      await db
        .update(outboxMessages)
        .set({ status: "sent", sentAt: new Date(), attempts: claimed.attempts + 1, lockedUntil: null, lastError: null })
        .where(eq(outboxMessages.id, id));
      report.sent++;
    } catch (error) {
      const attempts = claimed.attempts + 1;
      const dead = isDead(attempts);
      await db
        .update(outboxMessages)
        .set({
          attempts,
          status: dead ? "dead" : "pending",
          nextAttemptAt: new Date(now.getTime() + retryDelayMs(attempts)),
          lockedUntil: null,
          lastError: String((error as Error)?.message ?? error).slice(0, 500),
        })
        .where(eq(outboxMessages.id, id));
      if (dead) report.dead++;
      else report.failed++;
    }
  }
  return report;
}

const globalForSender = globalThis as unknown as { riglineSender?: { timer: NodeJS.Timeout; kick: () => void } };

/** Starts the in-process sender loop (once per process). */
export function startOutboxSender(db: () => Database, intervalMs: number): void {
  if (globalForSender.riglineSender) return;
  let running = false;
  const transport = smtpTransport();
  const tick = async () => {
    if (running) return;
    running = true;
    try {
      await deliverDue(db(), transport);
    } catch (error) {
      console.error("[rigline] outbox sender", error);
    } finally {
      running = false;
    }
  };
  const timer = setInterval(tick, intervalMs);
  timer.unref();
  globalForSender.riglineSender = { timer, kick: () => void tick() };
}

/** Asks the sender to look at the outbox now (after a commit that enqueued mail). */
export function kickOutboxSender(): void {
  globalForSender.riglineSender?.kick();
}
