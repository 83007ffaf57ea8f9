import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { Card, CardBody, CardHeader, EmptyState, PageHeader } from "@/components/ui";
import { readDevMailbox } from "@/lib/commands/mailbox";
import { isProduction } from "@/lib/env";
import { requirePermission } from "@/lib/server/guard";
import { execute } from "@/lib/server/operation";

export const metadata: Metadata = { title: "Mailbox" };

export default async function MailboxPage() {
  if (isProduction()) notFound();
  const user = await requirePermission("read", "DevMailbox");
  const messages = await execute(readDevMailbox, user, {});
  return (
    <div className="flex flex-col gap-6">
      <PageHeader
        eyebrow="Development only"
        title="Mailbox"
        question="Which e-mails did Rigline send? (Caught by the local mail stand-in; never shown in production.)"
      />
      {messages.length === 0 ? (
        <EmptyState title="No mail yet">Invite someone or ask for a password reset; the message appears here.</EmptyState>
      ) : (
        messages.map((m) => (
          <Card key={m.id} data-testid="mailbox-message">
            <CardHeader title={m.subject} description={`To ${m.toAddress} · ${m.receivedAt.toLocaleString("en-AU")}`} as="h2" />
            <CardBody>
              <pre className="whitespace-pre-wrap font-sans text-sm">{m.textBody}</pre>
            </CardBody>
          </Card>
        ))
      )}
    </div>
  );
}
