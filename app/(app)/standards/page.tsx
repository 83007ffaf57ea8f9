import type { Metadata } from "next";
import Link from "next/link";
import { CreateStandardForm } from "@/components/standards/create-standard-form";
import { EDITION_STATUS_LABELS, EDITION_STATUS_TONES } from "@/components/standards/labels";
import { Card, CardBody, CardHeader, EmptyState, PageHeader, StatusPill, Table, TBody, Td, Th, THead, Tr } from "@/components/ui";
import { listStandardsQuery } from "@/lib/commands/standards";
import { execute } from "@/lib/server/operation";
import { requireStandardsReader } from "./guard";
import { Instant } from "@/components/providers/time-zone";

export const metadata: Metadata = { title: "Standards" };

export default async function StandardsPage() {
  const user = await requireStandardsReader();
  const { items } = await execute(listStandardsQuery, user, {});
  const canManage = user.ability.can("manage", "Standard");
  return (
    <div className="flex flex-col gap-6">
      <PageHeader title="Fit-out standards" question="What must every vehicle carry, and which edition is in force?" />
      {items.length === 0 ? (
        <EmptyState title="No standard yet">Create the organisation&apos;s first fit-out standard below, then add its lines.</EmptyState>
      ) : (
        <Table label="Standards">
          <THead>
            <Tr>
              <Th>Standard</Th>
              <Th>In force</Th>
              <Th>Draft</Th>
              <Th numeric>Vehicles on it</Th>
              <Th numeric>Editions</Th>
            </Tr>
          </THead>
          <TBody>
            {items.map((s) => {
              const published = s.editions.find((e) => e.status === "published");
              const draft = s.editions.find((e) => e.status === "draft");
              const vehicles = s.editions.reduce((n, e) => n + e.vehicleCount, 0);
              return (
                <Tr key={s.id}>
                  <Td>
                    <Link href={`/standards/${s.id}`} className="font-semibold text-accent underline-offset-4 hover:underline">
                      {s.name}
                    </Link>
                    {s.description && <div className="text-sm text-muted">{s.description}</div>}
                  </Td>
                  <Td>
                    {published ? (
                      <Link href={`/standards/${s.id}/editions/${published.id}`} className="inline-flex items-center gap-2 hover:underline">
                        <StatusPill tone={EDITION_STATUS_TONES.published} size="sm">
                          {EDITION_STATUS_LABELS.published}
                        </StatusPill>
                        Edition {published.number} · {published.lineCount} lines · since <Instant at={published.publishedAt} show="day" />
                      </Link>
                    ) : (
                      <span className="text-muted">Nothing published yet</span>
                    )}
                  </Td>
                  <Td>
                    {draft ? (
                      <Link href={`/standards/${s.id}/editions/${draft.id}`} className="inline-flex items-center gap-2 hover:underline">
                        <StatusPill tone={EDITION_STATUS_TONES.draft} size="sm">
                          {EDITION_STATUS_LABELS.draft}
                        </StatusPill>
                        Edition {draft.number} · {draft.lineCount} lines
                      </Link>
                    ) : (
                      <span className="text-muted">—</span>
                    )}
                  </Td>
                  <Td numeric>{vehicles}</Td>
                  <Td numeric>{s.editions.length}</Td>
                </Tr>
              );
            })}
          </TBody>
        </Table>
      )}
      {canManage && (
        <Card>
          <CardHeader title="New standard" description="It starts with a draft edition 1: add its lines, then publish it and roll it out to vehicles." />
          <CardBody>
            <CreateStandardForm />
          </CardBody>
        </Card>
      )}
    </div>
  );
}
