import { dollarsOf } from "@/components/charts/format";
import type { CostTotals } from "@/db/costs";

/** The totals of everything the filters match. */
export function LedgerTotals({ totals }: { totals: CostTotals }) {
  const items: [string, string, string][] = [
    ["Entries", totals.entries.toLocaleString("en-AU"), "entries"],
    ["Ex GST", dollarsOf(totals.exGstCents), "ex-gst"],
    ["GST", dollarsOf(totals.gstCents), "gst"],
    ["Total incl. GST", dollarsOf(totals.totalCents), "total"],
    ["Capital (ex GST)", dollarsOf(totals.capitalExGstCents), "capital"],
    ["Operating (ex GST)", dollarsOf(totals.operatingExGstCents), "operating"],
  ];
  return (
    <dl className="grid grid-cols-2 gap-3 sm:grid-cols-3 lg:grid-cols-6" aria-label="Totals of the costs shown">
      {items.map(([label, value, key]) => (
        <div key={key} className="flex flex-col gap-0.5 rounded-lg border border-line bg-surface-raised px-3 py-2">
          <dt className="text-sm font-semibold text-muted">{label}</dt>
          <dd className="text-xl font-bold tabular-nums" data-testid={`total-${key}`}>
            {value}
          </dd>
        </div>
      ))}
    </dl>
  );
}
