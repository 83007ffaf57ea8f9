import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { ActionForm } from "@/components/jobs/action-form";
import { dateInputValue, QuoteStatePill } from "@/components/jobs/status";
import { QuoteEditor } from "@/components/quotes/quote-editor";
import { Card, CardBody, CardHeader, PageHeader, Table, TBody, Td, TFoot, Th, THead, Tr } from "@/components/ui";
import { getQuote } from "@/lib/commands/quotes";
import { DECISION_LABELS, quoteMachine } from "@/lib/jobs";
import { formatCents } from "@/lib/money";
import { AppError } from "@/lib/server/errors";
import { requirePermission } from "@/lib/server/guard";
import { execute } from "@/lib/server/operation";
import { withdrawQuoteAction } from "../actions";
import { Instant } from "@/components/providers/time-zone";
import { formatCalendarDay } from "@/lib/format/dates";

export const metadata: Metadata = { title: "Quote" };

export default async function QuotePage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const user = await requirePermission("read", "Quote");
  const detail = await execute(getQuote, user, { id }).catch((error: unknown) => {
    if (error instanceof AppError && (error.code === "not_found" || error.code === "validation_failed")) notFound();
    throw error;
  });
  const { quote, job, lines, revisions, decisions, editable } = detail;
  const specLines = detail.jobLines.filter((l): l is typeof l & { lineKey: string } => Boolean(l.lineKey));
  const canWithdraw = user.role === "contractor" && user.firmId === quote.firmId && quoteMachine.check(quote.status, "withdrawn").allowed;
  const returned = decisions.filter((d) => d.decision === "return").at(-1);
  return (
    <div className="flex flex-col gap-6">
      <PageHeader
        eyebrow={
          <Link href={`/jobs/${job.id}`} className="hover:underline">
            Job {job.number} · {job.fleetNumber}
          </Link>
        }
        title={`Quote of ${detail.firmName}${quote.revision > 1 ? `, revision ${quote.revision}` : ""}`}
        question={editable ? "What will the work cost, and until when does the price hold?" : "What was quoted, and what was decided?"}
        actions={<QuoteStatePill state={quote.status} size="lg" />}
      />
      {quote.status === "returned" && returned?.reason && (
        <p className="rounded-md border border-warn/50 bg-warn-soft p-3 text-warn-ink" data-testid="returned-reason">
          Returned for changes by {returned.decidedByName}: “{returned.reason}”
        </p>
      )}
      <Card>
        <CardHeader title={job.title} description={editable ? "Prices excl. GST; GST is added as shown below." : undefined} />
        <CardBody>
          {editable ? (
            <QuoteEditor
              method={quote.gstMethod}
              jobLines={specLines.map((l) => ({ lineKey: l.lineKey, description: l.description }))}
              quote={{
                id: quote.id,
                jobId: job.id,
                version: quote.version,
                validUntil: dateInputValue(quote.validUntil),
                notes: quote.notes ?? "",
                lines: lines.map((l) => ({ kind: l.kind, description: l.description, quantity: l.quantity, unitPriceCents: l.unitPriceCents, hours: l.hours, rateCents: l.rateCents, taxable: l.taxable, lineKey: l.lineKey })),
              }}
            />
          ) : (
            <div className="flex flex-col gap-3">
              <Table label="Quote lines" density="compact">
                <THead>
                  <Tr>
                    <Th>Kind</Th>
                    <Th>Description</Th>
                    <Th>Spec line</Th>
                    <Th numeric>Qty / hours</Th>
                    <Th numeric>Unit price / rate</Th>
                    <Th numeric>Amount excl. GST</Th>
                    <Th numeric>GST</Th>
                  </Tr>
                </THead>
                <TBody>
                  {lines.map((l) => (
                    <Tr key={l.id}>
                      <Td>{l.kind === "labour" ? "Labour" : l.kind === "part" ? "Part" : "Other"}</Td>
                      <Td>{l.description}</Td>
                      <Td>{specLines.find((s) => s.lineKey === l.lineKey)?.description ?? "—"}</Td>
                      <Td numeric>{l.kind === "labour" ? `${l.hours} h` : l.quantity}</Td>
                      <Td numeric>{formatCents(l.kind === "labour" ? (l.rateCents ?? 0) : l.unitPriceCents)}</Td>
                      <Td numeric>{formatCents(l.amountCents)}</Td>
                      <Td numeric>{l.taxable ? formatCents(l.gstCents) : "GST-free"}</Td>
                    </Tr>
                  ))}
                </TBody>
                <TFoot>
                  <Tr>
                    <Td colSpan={5}>Subtotal excl. GST</Td>
                    <Td numeric>{formatCents(quote.subtotalCents)}</Td>
                    <Td />
                  </Tr>
                  <Tr>
                    <Td colSpan={5}>GST</Td>
                    <Td numeric>{formatCents(quote.gstCents)}</Td>
                    <Td />
                  </Tr>
                  <Tr>
                    <Td colSpan={5} className="font-semibold">
                      Total incl. GST
                    </Td>
                    <Td numeric className="font-semibold" data-testid="quote-total">
                      {formatCents(quote.totalCents)}
                    </Td>
                    <Td />
                  </Tr>
                </TFoot>
              </Table>
              <p className="text-sm text-muted">{detail.methodDescription}</p>
              <p className="text-sm">Valid until {formatCalendarDay(quote.validUntil)}{quote.notes ? ` · Notes: ${quote.notes}` : ""}</p>
            </div>
          )}
        </CardBody>
      </Card>
      {canWithdraw && (
        <Card>
          <CardHeader title="Withdraw" description="A withdrawn quote cannot be brought back." />
          <CardBody>
            <ActionForm action={withdrawQuoteAction} hidden={{ id: quote.id, jobId: job.id }} label="Withdraw the quote" variant="danger" reason={{ label: "Reason (optional)" }} testId="withdraw-quote" />
          </CardBody>
        </Card>
      )}
      {(decisions.length > 0 || revisions.length > 0) && (
        <Card>
          <CardHeader title="History" description="Every submitted revision is kept; decisions are final and recorded with who and why" />
          <CardBody>
            <ul className="flex flex-col gap-1 text-sm" data-testid="quote-history">
              {[
                ...revisions.map((r) => ({ at: r.createdAt, text: `Revision ${r.revision} submitted: ${formatCents(Number((r.snapshot as { totalCents?: number }).totalCents ?? 0))} incl. GST` })),
                ...decisions.map((d) => ({ at: d.decidedAt, text: `${DECISION_LABELS[d.decision]} by ${d.decidedByName}${d.reason ? `: “${d.reason}”` : ""}` })),
              ]
                .sort((a, b) => a.at.getTime() - b.at.getTime())
                .map((e, i) => (
                  <li key={i}>
                    <span className="text-muted"><Instant at={e.at} show="day" /></span> {e.text}
                  </li>
                ))}
            </ul>
          </CardBody>
        </Card>
      )}
    </div>
  );
}
