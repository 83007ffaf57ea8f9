import type { DbOrTx } from "@/db/client";
import { outboxMessages } from "@/db/schema";
import type { RenderedMail } from "@/lib/mail/render";

/**
 * Puts a message in the outbox, in the caller's transaction: the mail exists exactly when the
 * change that causes it is committed, and a mail-server outage loses nothing.
 */
export async function enqueueMail(
  tx: DbOrTx,
  message: RenderedMail & { to: string; kind: string; orgId: string | null },
): Promise<void> {
  await tx.insert(outboxMessages).values({
    orgId: message.orgId,
    toAddress: message.to,
    subject: message.subject,
    textBody: message.text,
    htmlBody: message.html,
    kind: message.kind,
  });
}
