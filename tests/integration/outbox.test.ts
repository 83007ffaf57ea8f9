import { eq } from "drizzle-orm";
import { createServer } from "node:net";
import nodemailer from "nodemailer";
import { describe, expect, it } from "vitest";
import { outboxMessages } from "@/db/schema";
import { renderMail } from "@/lib/mail/render";
import { MAX_ATTEMPTS, retryDelayMs } from "@/lib/mail/backoff";
import { enqueueMail } from "@/lib/server/mail/outbox";
import { deliverDue } from "@/lib/server/mail/sender";
import { startSmtpStandIn, type CaughtMail } from "@/lib/server/mail/standin";
import { useTestDatabase } from "../helpers/db";

const database = await useTestDatabase({ seed: false });

async function freePort(): Promise<number> {
  return new Promise((resolve) => {
    const server = createServer();
    server.listen(0, "127.0.0.1", () => {
      const address = server.address();
      server.close(() => resolve(typeof address === "object" && address ? address.port : 0));
    });
  });
}

describe("outbox", () => {
  it("keeps a message while SMTP is down, retries with back-off, and delivers once it is back", async () => {
    const port = await freePort();
    const transport = nodemailer.createTransport({ host: "127.0.0.1", port, ignoreTLS: true, connectionTimeout: 1000 });
    await enqueueMail(database, {
      orgId: null,
      to: "someone@mirrabel-health.example",
      kind: "test",
      ...renderMail({ subject: "Outbox check", heading: "Hello", paragraphs: ["Body line"] }),
    });

    // SMTP is down: the attempt fails, the message stays pending with its next try pushed back.
    const t0 = new Date();
    const first = await deliverDue(database, transport, { now: t0, from: "Rigline <no-reply@rigline.example>" });
    expect(first).toEqual({ sent: 0, failed: 1, dead: 0 });
    let [row] = await database.select().from(outboxMessages);
    expect(row?.status).toBe("pending");
    expect(row?.attempts).toBe(1);
    expect(row?.nextAttemptAt.getTime()).toBe(t0.getTime() + retryDelayMs(1));
    expect(row?.lastError).toBeTruthy();

    // Not due yet: nothing happens.
    expect(await deliverDue(database, transport, { now: new Date(t0.getTime() + 1000) })).toEqual({ sent: 0, failed: 0, dead: 0 });

    // SMTP comes back: the next due attempt delivers exactly once.
    const caught: CaughtMail[] = [];
    const smtp = await startSmtpStandIn({ port, store: async (m) => void caught.push(m) });
    try {
      const later = new Date(t0.getTime() + retryDelayMs(1) + 1);
      expect(await deliverDue(database, transport, { now: later })).toEqual({ sent: 1, failed: 0, dead: 0 });
      expect(await deliverDue(database, transport, { now: new Date(later.getTime() + 3_600_000) })).toEqual({ sent: 0, failed: 0, dead: 0 });
    } finally {
      await smtp.close();
    }
    [row] = await database.select().from(outboxMessages);
    expect(row?.status).toBe("sent");
    expect(caught).toHaveLength(1);
    expect(caught[0]?.subject).toBe("Outbox check");
    expect(caught[0]?.text).toContain("Body line");
    expect(caught[0]?.html).toContain("Body line");
  });

  it("gives up after the last attempt and marks the message dead", async () => {
    const port = await freePort();
    const transport = nodemailer.createTransport({ host: "127.0.0.1", port, ignoreTLS: true, connectionTimeout: 500 });
    await database.delete(outboxMessages);
    await enqueueMail(database, { orgId: null, to: "x@y.example", kind: "test", ...renderMail({ subject: "s", heading: "h", paragraphs: [] }) });
    let now = new Date();
    for (let i = 0; i < MAX_ATTEMPTS; i++) {
      await deliverDue(database, transport, { now });
      now = new Date(now.getTime() + retryDelayMs(i + 1) + 1);
    }
    const [row] = await database.select().from(outboxMessages).where(eq(outboxMessages.toAddress, "x@y.example"));
    expect(row?.status).toBe("dead");
    expect(row?.attempts).toBe(MAX_ATTEMPTS);
  });

  it("backs off threefold from ten seconds, capped at one hour", () => {
    expect([1, 2, 3, 4].map(retryDelayMs)).toEqual([10_000, 30_000, 90_000, 270_000]);
    expect(retryDelayMs(20)).toBe(3_600_000);
  });
});
