import type { Metadata } from "next";
import Link from "next/link";
import { CreateTokenForm, RevokeTokenButton } from "@/components/tokens/token-forms";
import { Card, CardBody, CardHeader, EmptyState, PageHeader, StatusPill, Table, TBody, Td, Th, THead, Tr } from "@/components/ui";
import { listApiTokens } from "@/lib/commands/tokens";
import { appUrl } from "@/lib/commands/links";
import { ROLE_LABELS } from "@/lib/permissions";
import { requirePermission } from "@/lib/server/guard";
import { execute } from "@/lib/server/operation";
import { formatDayTime } from "@/lib/format/dates";

export const metadata: Metadata = { title: "API tokens" };


export default async function TokensPage() {
  const user = await requirePermission("manage", "ApiToken");
  const { items } = await execute(listApiTokens, user, {});
  const origin = appUrl("").replace(/\/$/, "");
  return (
    <div className="flex flex-col gap-6">
      <PageHeader
        eyebrow={<Link href="/profile" className="text-accent hover:underline">Profile</Link>}
        title="API tokens"
        question="Which systems can act for me, and can I stop them?"
      />
      <Card>
        <CardHeader
          title="Create a token"
          description={`A token acts as you, with your role (${ROLE_LABELS[user.role].toLowerCase()}) and nothing more; it stops working when you revoke it or your account is deactivated. Only a fingerprint of it is stored.`}
        />
        <CardBody>
          <CreateTokenForm origin={origin} />
        </CardBody>
      </Card>
      <Card>
        <CardHeader title="Your tokens" description="The first characters of each token, so you can tell them apart." />
        <CardBody>
          {items.length === 0 ? (
            <EmptyState title="No tokens yet">Create one for each system that should pull data from Rigline.</EmptyState>
          ) : (
            <Table label="Your API tokens" data-testid="token-table">
              <THead>
                <Tr>
                  <Th>Name</Th>
                  <Th>Starts with</Th>
                  <Th>Created</Th>
                  <Th>Last used</Th>
                  <Th>State</Th>
                  <Th numeric>
                    <span className="sr-only">Action</span>
                  </Th>
                </Tr>
              </THead>
              <TBody>
                {items.map((t) => (
                  <Tr key={t.id} data-testid="token-row">
                    <Th scope="row">{t.name}</Th>
                    <Td>
                      <code className="font-mono text-sm">{t.prefix}…</code>
                    </Td>
                    <Td className="whitespace-nowrap">{formatDayTime(t.createdAt, user.timeZone)}</Td>
                    <Td className="whitespace-nowrap">{t.lastUsedAt ? formatDayTime(t.lastUsedAt, user.timeZone) : "Never"}</Td>
                    <Td>
                      {t.revokedAt ? (
                        <StatusPill tone="neutral" size="sm">
                          Revoked {formatDayTime(t.revokedAt, user.timeZone)}
                        </StatusPill>
                      ) : (
                        <StatusPill tone="ok" size="sm">
                          Active
                        </StatusPill>
                      )}
                    </Td>
                    <Td numeric>{!t.revokedAt && <RevokeTokenButton id={t.id} name={t.name} />}</Td>
                  </Tr>
                ))}
              </TBody>
            </Table>
          )}
        </CardBody>
      </Card>
    </div>
  );
}
