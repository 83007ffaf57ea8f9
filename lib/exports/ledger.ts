import { InputError } from "@/lib/errors";
import { CATEGORY_LABELS, KIND_LABELS, SOURCE_LABELS, type CostCategory, type CostKind, type CostSource } from "./labels";
import { checkTable, type ExportCell, type ExportColumn, type ExportTable } from "./table";

/** One booked cost as the ledger shows it. */
export type LedgerEntry = {
  id: string;
  /** The day the cost was incurred (UTC midnight of that day). */
  incurredOn: Date;
  fleetNumber: string | null;
  costCentre: string;
  depotName: string | null;
  category: CostCategory;
  kind: CostKind;
  source: CostSource;
  description: string;
  reference: string | null;
  amountExGstCents: number;
  gstCents: number;
};

export type LedgerTotals = {
  entries: number;
  exGstCents: number;
  gstCents: number;
  totalCents: number;
  capitalExGstCents: number;
  operatingExGstCents: number;
};

function cents(field: string, value: number): number {
  if (!Number.isSafeInteger(value)) throw new InputError(field, `${field} must be a whole number of cents`);
  return value;
}

/** Sums of a set of ledger entries, in integer cents (never rounded: every amount is whole cents). */
export function ledgerTotals(entries: readonly LedgerEntry[]): LedgerTotals {
  if (!Array.isArray(entries as unknown)) throw new InputError("entries", "entries must be a list");
  const totals: LedgerTotals = { entries: 0, exGstCents: 0, gstCents: 0, totalCents: 0, capitalExGstCents: 0, operatingExGstCents: 0 };
  entries.forEach((e, i) => {
    const ex = cents(`entries.${i}.amountExGstCents`, e.amountExGstCents);
    const gst = cents(`entries.${i}.gstCents`, e.gstCents);
    totals.entries += 1;
    totals.exGstCents += ex;
    totals.gstCents += gst;
    totals.totalCents += ex + gst;
    if (e.kind === "capital") totals.capitalExGstCents += ex;
    else totals.operatingExGstCents += ex;
  });
  return totals;
}

export const LEDGER_COLUMNS: ExportColumn[] = [
  { header: "Date", kind: "date", widthChars: 12 },
  { header: "Fleet no.", kind: "text", widthChars: 11 },
  { header: "Cost centre", kind: "text", widthChars: 16 },
  { header: "Depot", kind: "text", widthChars: 18 },
  { header: "Category", kind: "text", widthChars: 22 },
  { header: "Capital or operating", kind: "text", widthChars: 12 },
  { header: "Description", kind: "text", widthChars: 44 },
  { header: "Reference", kind: "text", widthChars: 16 },
  { header: "Source", kind: "text", widthChars: 16 },
  { header: "Ex GST ($)", kind: "money", widthChars: 14 },
  { header: "GST ($)", kind: "money", widthChars: 12 },
  { header: "Total incl. GST ($)", kind: "money", widthChars: 16 },
];

/** The cells of one ledger entry, in LEDGER_COLUMNS order. */
export function ledgerRow(e: LedgerEntry): ExportCell[] {
  return [
    e.incurredOn,
    e.fleetNumber,
    e.costCentre,
    e.depotName,
    CATEGORY_LABELS[e.category] ?? e.category,
    KIND_LABELS[e.kind] ?? e.kind,
    e.description,
    e.reference,
    SOURCE_LABELS[e.source] ?? e.source,
    e.amountExGstCents,
    e.gstCents,
    e.amountExGstCents + e.gstCents,
  ];
}

/** The filtered ledger as an export table: a header, one row per entry and a totals row. */
export function ledgerTable(entries: readonly LedgerEntry[]): ExportTable {
  const totals = ledgerTotals(entries);
  const totalsRow: ExportCell[] = LEDGER_COLUMNS.map(() => null);
  totalsRow[6] = `Total of ${totals.entries} ${totals.entries === 1 ? "entry" : "entries"}`;
  totalsRow[9] = totals.exGstCents;
  totalsRow[10] = totals.gstCents;
  totalsRow[11] = totals.totalCents;
  return checkTable({ sheetName: "Cost ledger", columns: LEDGER_COLUMNS, rows: entries.map(ledgerRow), totals: totalsRow });
}
