import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { ComparePicker } from "@/components/standards/compare-picker";
import { StartDraftButton } from "@/components/standards/edition-actions";
import { EDITION_STATUS_LABELS, EDITION_STATUS_TONES } from "@/components/standards/labels";
import { Card, CardBody, CardHeader, PageHeader, StatusPill, Table, TBody, Td, Th, THead, Tr } from "@/components/ui";
import { getStandard } from "@/lib/commands/standards";
import { AppError } from "@/lib/server/errors";
import { execute } from "@/lib/server/operation";
import { requireStandardsReader } from "../guard";
import { Instant } from "@/components/providers/time-zone";

export const metadata: Metadata = { title: "Standard" };

export default async function StandardPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const user = await requireStandardsReader();
  const standard = await execute(getStandard, user, { id }).catch((error: unknown) => {
    if (error instanceof AppError && (error.code === "not_found" || error.code === "validation_failed")) notFound();
    throw error;
  });
  const canManage = user.ability.can("manage", "Standard");
  const draft = standard.editions.find((e) => e.status === "draft");
  const latest = standard.editions.find((e) => e.status === "published") ?? standard.editions[0];
  return (
    <div className="flex flex-col gap-6">
      <PageHeader
        eyebrow={<Link href="/standards" className="hover:underline">Standards</Link>}
        title={standard.name}
        question="Which edition is in force, what changed, and what is being drafted?"
        actions={canManage && !draft && latest ? <StartDraftButton standardId={standard.id} editionId={latest.id} number={latest.number} /> : undefined}
      />
      {standard.description && <p className="max-w-3xl text-muted">{standard.description}</p>}
      <Table label="Editions">
        <THead>
          <Tr>
            <Th>Edition</Th>
            <Th>Status</Th>
            <Th numeric>Lines</Th>
            <Th numeric>Vehicles</Th>
            <Th>Published</Th>
            <Th>Notes</Th>
          </Tr>
        </THead>
        <TBody>
          {standard.editions.map((e) => (
            <Tr key={e.id}>
              <Td>
                <Link href={`/standards/${standard.id}/editions/${e.id}`} className="font-semibold text-accent underline-offset-4 hover:underline">
                  Edition {e.number}
                </Link>
              </Td>
              <Td>
                <StatusPill tone={EDITION_STATUS_TONES[e.status]} size="sm">
                  {EDITION_STATUS_LABELS[e.status]}
                </StatusPill>
              </Td>
              <Td numeric>{e.lineCount}</Td>
              <Td numeric>{e.vehicleCount}</Td>
              <Td>
                {e.publishedAt ? (
                  <>
                    <Instant at={e.publishedAt} show="day" />
                    {e.publishedByName ? ` by ${e.publishedByName}` : ""}
                  </>
                ) : (
                  <span className="text-muted">—</span>
                )}
              </Td>
              <Td className="max-w-md text-sm">{e.notes}</Td>
            </Tr>
          ))}
        </TBody>
      </Table>
      {standard.editions.length > 1 && (
        <Card>
          <CardHeader title="Compare editions" description="Line by line: what was added, removed or changed, with each change before and after." />
          <CardBody>
            <ComparePicker standardId={standard.id} editions={standard.editions} />
          </CardBody>
        </Card>
      )}
    </div>
  );
}
