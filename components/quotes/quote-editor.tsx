"use client";

import { useMemo, useState } from "react";
import { saveQuoteAction } from "@/app/(app)/quotes/actions";
import { FormStatus } from "@/components/forms/form-status";
import { useFormAction } from "@/components/forms/use-form-action";
import { Button, Field, Input, Select, Table, TBody, Td, TFoot, Th, THead, Tr, Textarea } from "@/components/ui";
import { formatCents, parseMoneyToCents, quoteTotals, type GstMethod, type QuoteLineInput } from "@/lib/money";

type Kind = "part" | "labour" | "other";
type Row = { kind: Kind; description: string; quantity: string; price: string; taxable: boolean; lineKey: string };

export type EditorLine = {
  kind: Kind;
  description: string;
  quantity: number;
  unitPriceCents: number;
  hours: number | null;
  rateCents: number | null;
  taxable: boolean;
  lineKey: string | null;
};

const dollars = (cents: number) => (cents / 100).toFixed(2);

function toRow(l: EditorLine): Row {
  return l.kind === "labour"
    ? { kind: "labour", description: l.description, quantity: String(l.hours ?? l.quantity), price: dollars(l.rateCents ?? l.unitPriceCents), taxable: l.taxable, lineKey: l.lineKey ?? "" }
    : { kind: l.kind, description: l.description, quantity: String(l.quantity), price: dollars(l.unitPriceCents), taxable: l.taxable, lineKey: l.lineKey ?? "" };
}

const blank = (lineKey = ""): Row => ({ kind: "part", description: "", quantity: "1", price: "", taxable: true, lineKey });

/** Each row read into cents, or the first problem in words. */
function readRow(row: Row, index: number): { line?: QuoteLineInput & { lineKey: string | null }; error?: string } {
  const qty = Number(row.quantity);
  if (!row.quantity.trim() || !Number.isFinite(qty) || qty < 0) return { error: `Line ${index + 1}: ${row.kind === "labour" ? "hours" : "quantity"} must be a number, not negative` };
  let cents: number;
  try {
    cents = parseMoneyToCents(row.price || "0", "price");
  } catch {
    return { error: `Line ${index + 1}: the price must be dollars and cents, such as 1,234.50` };
  }
  const lineKey = row.lineKey || null;
  return row.kind === "labour"
    ? { line: { kind: "labour", description: row.description, hours: qty, rateCents: Math.max(0, cents), taxable: row.taxable, lineKey } }
    : { line: { kind: row.kind, description: row.description, quantity: qty, unitPriceCents: cents, taxable: row.taxable, lineKey } };
}

/**
 * The contractor's quote editor: lines of parts, labour (hours × rate) and other costs, each
 * taxable or not and optionally answering a spec line of the job; totals with GST worked out as
 * the server will, with the rounding method said in words.
 */
export function QuoteEditor({
  quote,
  jobLines,
  method,
}: {
  quote: { id: string; jobId: string; version: number; validUntil: string; notes: string; lines: EditorLine[] };
  jobLines: { lineKey: string; description: string }[];
  method: GstMethod;
}) {
  const { state, formAction, errorOf, valueOf, pending } = useFormAction(saveQuoteAction);
  const [rows, setRows] = useState<Row[]>(() => (quote.lines.length ? quote.lines.map(toRow) : jobLines.map((l) => ({ ...blank(l.lineKey), description: l.description }))));
  const read = useMemo(() => rows.map(readRow), [rows]);
  const problems = read.filter((r) => r.error).map((r) => r.error!);
  const totals = useMemo(() => {
    if (problems.length) return null;
    try {
      return quoteTotals(read.map((r) => r.line!), method);
    } catch {
      return null;
    }
  }, [read, problems.length, method]);
  const payload = JSON.stringify(read.map((r) => r.line).filter(Boolean));
  const update = (i: number, patch: Partial<Row>) => setRows((all) => all.map((r, j) => (j === i ? { ...r, ...patch } : r)));

  return (
    <form action={formAction} aria-label="Quote" className="flex flex-col gap-4" noValidate>
      <input type="hidden" name="id" value={quote.id} />
      <input type="hidden" name="jobId" value={quote.jobId} />
      <input type="hidden" name="version" value={quote.version} />
      <input type="hidden" name="lines" value={payload} />
      <Table label="Quote lines" density="compact">
        <THead>
          <Tr>
            <Th>Kind</Th>
            <Th>Description</Th>
            <Th>Answers spec line</Th>
            <Th numeric>Qty / hours</Th>
            <Th numeric>Unit price / rate ($, excl. GST)</Th>
            <Th>Taxable</Th>
            <Th numeric>Amount</Th>
            <Th>
              <span className="sr-only">Remove</span>
            </Th>
          </Tr>
        </THead>
        <TBody>
          {rows.map((row, i) => {
            const priced = totals?.lines[i];
            return (
              <Tr key={i} data-testid="quote-line">
                <Td>
                  <Select size="md" className="min-w-32" aria-label={`Line ${i + 1} kind`} value={row.kind} onChange={(e) => update(i, { kind: e.target.value as Kind })}>
                    <option value="part">Part</option>
                    <option value="labour">Labour</option>
                    <option value="other">Other</option>
                  </Select>
                </Td>
                <Td>
                  <Input size="md" aria-label={`Line ${i + 1} description`} value={row.description} onChange={(e) => update(i, { description: e.target.value })} />
                  {errorOf(`lines.${i}.description`) && <p className="text-sm text-danger">{errorOf(`lines.${i}.description`)}</p>}
                </Td>
                <Td>
                  <Select size="md" aria-label={`Line ${i + 1} spec line`} value={row.lineKey} onChange={(e) => update(i, { lineKey: e.target.value })}>
                    <option value="">None</option>
                    {jobLines.map((l) => (
                      <option key={l.lineKey} value={l.lineKey}>
                        {l.description}
                      </option>
                    ))}
                  </Select>
                </Td>
                <Td numeric>
                  <Input size="md" htmlSize={6} inputMode="decimal" aria-label={`Line ${i + 1} ${row.kind === "labour" ? "hours" : "quantity"}`} value={row.quantity} onChange={(e) => update(i, { quantity: e.target.value })} />
                </Td>
                <Td numeric>
                  <Input size="md" htmlSize={9} inputMode="decimal" aria-label={`Line ${i + 1} ${row.kind === "labour" ? "hourly rate" : "unit price"}`} value={row.price} onChange={(e) => update(i, { price: e.target.value })} />
                </Td>
                <Td>
                  <input type="checkbox" className="size-5 accent-accent" aria-label={`Line ${i + 1} taxable`} checked={row.taxable} onChange={(e) => update(i, { taxable: e.target.checked })} />
                </Td>
                <Td numeric>{priced ? formatCents(priced.exGstCents) : "—"}</Td>
                <Td>
                  <Button type="button" variant="ghost" size="sm" onClick={() => setRows((all) => all.filter((_, j) => j !== i))} aria-label={`Remove line ${i + 1}`}>
                    Remove
                  </Button>
                </Td>
              </Tr>
            );
          })}
        </TBody>
        {totals && (
          <TFoot>
            <Tr>
              <Td colSpan={6}>Subtotal excl. GST</Td>
              <Td numeric data-testid="quote-subtotal">{formatCents(totals.totals.exGstCents)}</Td>
              <Td />
            </Tr>
            <Tr>
              <Td colSpan={6}>GST ({totals.gstRatePercent} %)</Td>
              <Td numeric data-testid="quote-gst">{formatCents(totals.totals.gstCents)}</Td>
              <Td />
            </Tr>
            <Tr>
              <Td colSpan={6} className="font-semibold">
                Total incl. GST
              </Td>
              <Td numeric className="font-semibold" data-testid="quote-total">
                {formatCents(totals.totals.inclGstCents)}
              </Td>
              <Td />
            </Tr>
          </TFoot>
        )}
      </Table>
      {problems.length > 0 && (
        <ul className="text-sm font-semibold text-danger">
          {problems.map((p) => (
            <li key={p}>{p}</li>
          ))}
        </ul>
      )}
      {totals && <p className="text-sm text-muted" data-testid="gst-method">{totals.methodDescription}</p>}
      <div>
        <Button type="button" variant="secondary" size="sm" onClick={() => setRows((all) => [...all, blank()])}>
          Add a line
        </Button>
      </div>
      <div className="grid grid-cols-1 gap-4 md:grid-cols-2">
        <Field label="Valid until" error={errorOf("validUntil")} id="quote-valid-until" required>
          <Input name="validUntil" type="date" defaultValue={valueOf("validUntil", quote.validUntil)} />
        </Field>
        <Field label="Notes for the fleet manager" error={errorOf("notes")} id="quote-notes">
          <Textarea name="notes" rows={2} defaultValue={valueOf("notes", quote.notes)} />
        </Field>
      </div>
      <div className="flex flex-wrap gap-3">
        <Button type="submit" name="intent" value="save" variant="secondary" disabled={pending || problems.length > 0} loading={pending}>
          Save draft
        </Button>
        <Button type="submit" name="intent" value="submit" disabled={pending || problems.length > 0 || rows.length === 0}>
          Save and submit
        </Button>
      </div>
      <FormStatus state={state} testId="quote-status" />
    </form>
  );
}
