import { decideQuoteAction } from "@/app/(app)/quotes/actions";
import { ActionForm } from "@/components/jobs/action-form";
import { QuoteStatePill } from "@/components/jobs/status";
import { Table, TBody, Td, Th, THead, Tr } from "@/components/ui";
import type { QuoteState } from "@/lib/jobs";
import { formatCents } from "@/lib/money";
import { formatCalendarDay } from "@/lib/format/dates";

type CompareQuote = {
  id: string;
  firmName: string;
  status: QuoteState;
  revision: number;
  version: number;
  validUntil: string | null;
  expired: boolean;
  subtotalCents: number;
  gstCents: number;
  totalCents: number;
  byLine: Record<string, number>;
  otherCents: number;
  lastReason: string | null;
};

/** Difference from the standard cost, said with its sign. */
function against(amount: number, standard: number) {
  if (standard === 0) return null;
  const diff = amount - standard;
  if (diff === 0) return "at standard";
  return `${diff > 0 ? "+" : "−"}${formatCents(Math.abs(diff))} vs standard`;
}

/** Submitted quotes side by side: per spec line against its standard cost, totals, validity, decisions. */
export function QuoteCompare({
  jobId,
  jobState,
  canDecide,
  specLines,
  quotes,
}: {
  jobId: string;
  jobState: string;
  canDecide: boolean;
  specLines: { lineKey: string; description: string; standardCostCents: number }[];
  quotes: CompareQuote[];
}) {
  const shown = quotes.filter((q) => q.status !== "draft");
  const drafts = quotes.length - shown.length;
  // Once one quote is accepted or waits for finance, no other can be accepted beside it.
  const taken = shown.find((q) => q.status === "accepted" || q.status === "awaiting_finance");
  const lowest = Math.min(...shown.filter((q) => ["submitted", "awaiting_finance", "accepted"].includes(q.status)).map((q) => q.totalCents));
  return (
    <div className="flex flex-col gap-4">
      <Table label="Quotes side by side" density="compact" data-testid="quote-compare">
        <THead>
          <Tr>
            <Th>Line</Th>
            <Th numeric>Standard cost</Th>
            {shown.map((q) => (
              <Th key={q.id} numeric>
                {q.firmName}
                {q.revision > 1 ? ` (rev. ${q.revision})` : ""}
              </Th>
            ))}
          </Tr>
        </THead>
        <TBody>
          {specLines.map((l) => (
            <Tr key={l.lineKey}>
              <Td>{l.description}</Td>
              <Td numeric>{formatCents(l.standardCostCents)}</Td>
              {shown.map((q) => {
                const amount = q.byLine[l.lineKey] ?? 0;
                const words = amount ? against(amount, l.standardCostCents) : null;
                return (
                  <Td key={q.id} numeric>
                    {amount ? formatCents(amount) : <span className="text-muted">not quoted</span>}
                    {words && <div className="text-xs text-muted">{words}</div>}
                  </Td>
                );
              })}
            </Tr>
          ))}
          <Tr>
            <Td>Other lines (labour, parts not tied to a spec line)</Td>
            <Td numeric>—</Td>
            {shown.map((q) => (
              <Td key={q.id} numeric>
                {formatCents(q.otherCents)}
              </Td>
            ))}
          </Tr>
          <Tr>
            <Td>Subtotal excl. GST</Td>
            <Td numeric>{formatCents(specLines.reduce((n, l) => n + l.standardCostCents, 0))}</Td>
            {shown.map((q) => (
              <Td key={q.id} numeric>
                {formatCents(q.subtotalCents)}
              </Td>
            ))}
          </Tr>
          <Tr>
            <Td>GST</Td>
            <Td numeric>—</Td>
            {shown.map((q) => (
              <Td key={q.id} numeric>
                {formatCents(q.gstCents)}
              </Td>
            ))}
          </Tr>
          <Tr>
            <Td className="font-semibold">Total incl. GST</Td>
            <Td numeric>—</Td>
            {shown.map((q) => (
              <Td key={q.id} numeric className="font-semibold" data-testid="compare-total">
                {formatCents(q.totalCents)}
                {q.totalCents === lowest && shown.length > 1 && <div className="text-xs font-normal text-muted">lowest</div>}
              </Td>
            ))}
          </Tr>
          <Tr>
            <Td>Valid until</Td>
            <Td numeric>—</Td>
            {shown.map((q) => (
              <Td key={q.id} numeric className={q.expired ? "font-semibold text-danger" : undefined}>
                {formatCalendarDay(q.validUntil)}
                {q.expired ? " (lapsed)" : ""}
              </Td>
            ))}
          </Tr>
          <Tr>
            <Td>Status</Td>
            <Td numeric>—</Td>
            {shown.map((q) => (
              <Td key={q.id} numeric>
                <QuoteStatePill state={q.status} size="sm" />
                {q.lastReason && <div className="text-xs text-muted">“{q.lastReason}”</div>}
              </Td>
            ))}
          </Tr>
        </TBody>
      </Table>
      {drafts > 0 && <p className="text-sm text-muted">{drafts === 1 ? "One workshop is" : `${drafts} workshops are`} still drafting.</p>}
      {canDecide && jobState === "quoting" && (
        <div className="grid grid-cols-1 gap-6 lg:grid-cols-2">
          {shown
            .filter((q) => q.status === "submitted")
            .map((q) => (
              <section key={q.id} aria-label={`Decide the quote of ${q.firmName}`} className="flex flex-col gap-3 rounded-md border border-line p-4" data-testid="decide-quote">
                <h3 className="font-semibold">
                  {q.firmName}: {formatCents(q.totalCents)} incl. GST
                </h3>
                {taken ? (
                  <p className="text-sm text-muted">The quote of {taken.firmName} is {taken.status === "accepted" ? "accepted" : "waiting for finance"}; this one can be returned or declined.</p>
                ) : (
                  <ActionForm action={decideQuoteAction} hidden={{ id: q.id, jobId, version: q.version, decision: "accept" }} label={`Accept ${q.firmName}`} variant="primary" testId={`accept-${q.id}`} />
                )}
                <ActionForm
                  action={decideQuoteAction}
                  hidden={{ id: q.id, jobId, version: q.version, decision: "return" }}
                  label="Return for changes"
                  reason={{ label: "What should change", required: true }}
                  testId={`return-${q.id}`}
                  name={`Return the quote of ${q.firmName}`}
                />
                <ActionForm
                  action={decideQuoteAction}
                  hidden={{ id: q.id, jobId, version: q.version, decision: "decline" }}
                  label="Decline"
                  variant="danger"
                  reason={{ label: "Reason for declining", required: true }}
                  testId={`decline-${q.id}`}
                  name={`Decline the quote of ${q.firmName}`}
                />
              </section>
            ))}
        </div>
      )}
    </div>
  );
}
