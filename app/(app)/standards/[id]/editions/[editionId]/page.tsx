import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { ComparePicker } from "@/components/standards/compare-picker";
import { PublishButton, RetireButton, StartDraftButton } from "@/components/standards/edition-actions";
import { EDITION_STATUS_LABELS, EDITION_STATUS_TONES } from "@/components/standards/labels";
import { LineForm } from "@/components/standards/line-form";
import { LinesTable } from "@/components/standards/lines-table";
import { RolloutPanel } from "@/components/standards/rollout-panel";
import { Caution, Card, CardBody, CardHeader, EmptyState, PageHeader, StatusPill } from "@/components/ui";
import { db } from "@/db/client";
import { rolloutCandidates } from "@/db/standards";
import { getEdition } from "@/lib/commands/standards";
import { AppError } from "@/lib/server/errors";
import { execute } from "@/lib/server/operation";
import { requireStandardsReader } from "../../../guard";
import { Instant } from "@/components/providers/time-zone";

export const metadata: Metadata = { title: "Edition" };

export default async function EditionPage({ params }: { params: Promise<{ id: string; editionId: string }> }) {
  const { id, editionId } = await params;
  const user = await requireStandardsReader();
  const data = await execute(getEdition, user, { id: editionId }).catch((error: unknown) => {
    if (error instanceof AppError && (error.code === "not_found" || error.code === "validation_failed")) notFound();
    throw error;
  });
  if (data.standard.id !== id) notFound();
  const { edition, standard, lines } = data;
  const canManage = user.ability.can("manage", "Standard");
  const draft = edition.status === "draft";
  const editable = draft && canManage;
  const otherDraft = data.siblings.find((e) => e.status === "draft" && e.id !== edition.id);
  const vehicles = canManage && edition.status === "published" ? await rolloutCandidates(db(), user.orgId) : [];
  const others = lines.map((l) => ({ id: l.id, code: l.code, title: l.title }));

  return (
    <div className="flex flex-col gap-6">
      <PageHeader
        eyebrow={
          <Link href={`/standards/${standard.id}`} className="hover:underline">
            {standard.name}
          </Link>
        }
        title={
          <span className="inline-flex flex-wrap items-center gap-3">
            Edition {edition.number}
            <StatusPill tone={EDITION_STATUS_TONES[edition.status]} data-testid="edition-status">
              {EDITION_STATUS_LABELS[edition.status]}
            </StatusPill>
          </span>
        }
        question={draft ? "What should this edition ask of every vehicle before it is published?" : "What does this edition ask of every vehicle on it?"}
        actions={
          canManage ? (
            <>
              {draft && <PublishButton standardId={standard.id} editionId={edition.id} number={edition.number} />}
              {edition.status === "published" && !otherDraft && <StartDraftButton standardId={standard.id} editionId={edition.id} number={edition.number} />}
              {edition.status === "published" && <RetireButton standardId={standard.id} editionId={edition.id} number={edition.number} />}
            </>
          ) : undefined
        }
      />
      <p className="text-sm text-muted">
        {lines.length} lines · {data.vehicleCount} {data.vehicleCount === 1 ? "vehicle" : "vehicles"} on this edition
        {edition.publishedAt ? (
          <>
            {" · published "}
            <Instant at={edition.publishedAt} show="day" />
          </>
        ) : null}
        {edition.notes ? ` · ${edition.notes}` : ""}
      </p>
      {!draft && (
        <p className="rounded-md border-l-4 border-info bg-info-soft px-3 py-2 text-sm font-medium text-info-ink">
          A {EDITION_STATUS_LABELS[edition.status].toLowerCase()} edition never changes.
          {otherDraft ? (
            <>
              {" "}
              Changes go into{" "}
              <Link className="underline" href={`/standards/${standard.id}/editions/${otherDraft.id}`}>
                draft edition {otherDraft.number}
              </Link>
              .
            </>
          ) : (
            " Start a new draft to make changes."
          )}
        </p>
      )}
      <Caution text="Criteria here are this organisation's standard. Tyre sizes, lifts, spring ratings and added mass still fall under local rules: have them signed off by an authorised vehicle engineer and weigh the fitted vehicle on a certified weighbridge." />
      {data.warnings.length > 0 && (
        <Card>
          <CardHeader title="Steps the build order may miss" description="Common practice; check these before publishing." />
          <CardBody>
            <ul className="list-disc pl-5 text-sm">
              {data.warnings.map((w) => (
                <li key={`${w.code}-${w.lineId}`}>{w.message}</li>
              ))}
            </ul>
          </CardBody>
        </Card>
      )}
      {data.siblings.length > 1 && <ComparePicker standardId={standard.id} editions={data.siblings} {...comparePair(data.siblings, edition.number)} />}
      {lines.length === 0 ? (
        <EmptyState title="No lines yet">{editable ? "Add the first line below." : "This edition asks for nothing yet."}</EmptyState>
      ) : (
        <LinesTable standardId={standard.id} editionId={edition.id} lines={lines} editable={editable} />
      )}
      {editable && (
        <Card>
          <CardHeader title="Add a line" description="Every field of a line; criteria are what a fitment must measure up to." />
          <CardBody>
            <LineForm standardId={standard.id} editionId={edition.id} others={others} />
          </CardBody>
        </Card>
      )}
      {canManage && edition.status === "published" && (
        <Card>
          <CardHeader title="Roll out to vehicles" description={`Assign edition ${edition.number} to chosen vehicles. The preview shows the new short lines, estimated cost and added mass first; nothing changes until you confirm.`} />
          <CardBody>
            <RolloutPanel standardId={standard.id} editionId={edition.id} editionNumber={edition.number} vehicles={vehicles} />
          </CardBody>
        </Card>
      )}
    </div>
  );
}

/** This edition against the one before it, or (for the first) against the one after it. */
function comparePair(siblings: { id: string; number: number }[], number: number) {
  const sorted = [...siblings].sort((x, y) => x.number - y.number);
  const at = sorted.findIndex((e) => e.number === number);
  const before = sorted[at - 1];
  const here = sorted[at];
  const after = sorted[at + 1];
  return before ? { a: before.id, b: here?.id } : { a: here?.id, b: after?.id };
}
