/**
 * Export benchmark: 10,000 invented ledger rows written as XLSX by Rigline's writer (typed cells,
 * neutralised text, formats, frozen header, totals) against the raw exceljs write of the same
 * rows in the same run. Target: at most 1.5 × the raw write. Also times the CSV writer.
 *
 *   npx tsx bench/export.ts
 */
import ExcelJS from "exceljs";
import { pathToFileURL } from "node:url";
import { COST_CATEGORIES, ledgerTable, tableToCsv, tableToXlsx, type LedgerEntry } from "@/lib/exports";

export const ROWS = 10_000;
export const TARGET_RATIO = 1.5;

/** Deterministic invented rows (a small linear congruential generator, not Math.random). */
export function benchEntries(count = ROWS): LedgerEntry[] {
  let seed = 20_260_301;
  const next = () => (seed = (seed * 1_103_515_245 + 12_345) % 2_147_483_648) / 2_147_483_648;
  return Array.from({ length: count }, (_, i) => {
    const ex = Math.round(next() * 500_000) + 100;
    return {
      id: `bench-${i}`,
      incurredOn: new Date(Date.UTC(2025, 6, 1) + Math.floor(next() * 365) * 86_400_000),
      fleetNumber: `RL-${String((i % 250) + 1).padStart(3, "0")}`,
      costCentre: `CC-${["OCW", "SPC", "TRJ"][i % 3]}-${["COR", "MAR", "YEN", "BRO"][i % 4]}`,
      depotName: ["Ochre Well", "Salt Pan Creek", "Tarrin Junction"][i % 3]!,
      category: COST_CATEGORIES[i % COST_CATEGORIES.length]!,
      kind: i % 3 === 0 ? "capital" : "operating",
      source: i % 5 === 0 ? "manual" : "job",
      description: i % 97 === 0 ? "=SUM(A1:A9)" : `Fit-out work order ${i}`,
      reference: `WO-${100_000 + i}`,
      amountExGstCents: ex,
      gstCents: Math.round(ex / 10),
    };
  });
}

/** The baseline: the same rows handed to exceljs as they come, with a plain header and nothing else. */
async function rawWrite(entries: LedgerEntry[]): Promise<number> {
  const workbook = new ExcelJS.Workbook();
  const sheet = workbook.addWorksheet("Cost ledger");
  sheet.addRow(["Date", "Fleet no.", "Cost centre", "Depot", "Category", "Kind", "Description", "Reference", "Source", "Ex GST", "GST", "Total"]);
  for (const e of entries) {
    sheet.addRow([
      e.incurredOn,
      e.fleetNumber,
      e.costCentre,
      e.depotName,
      e.category,
      e.kind,
      e.description,
      e.reference,
      e.source,
      e.amountExGstCents / 100,
      e.gstCents / 100,
      (e.amountExGstCents + e.gstCents) / 100,
    ]);
  }
  const buffer = await workbook.xlsx.writeBuffer();
  return (buffer as ArrayBuffer).byteLength;
}

async function timed<T>(work: () => Promise<T> | T): Promise<{ ms: number; result: T }> {
  const start = performance.now();
  const result = await work();
  return { ms: performance.now() - start, result };
}

export type ExportBenchResult = { rows: number; rawMs: number; riglineMs: number; csvMs: number; ratio: number; pass: boolean };

/** Runs the benchmark (best of a few rounds each, after a warm-up) and prints both times and the ratio. */
export async function run(rounds = 3): Promise<ExportBenchResult> {
  const entries = benchEntries();
  await rawWrite(entries.slice(0, 500));
  await tableToXlsx(ledgerTable(entries.slice(0, 500)));
  let rawMs = Infinity;
  let riglineMs = Infinity;
  let csvMs = Infinity;
  for (let i = 0; i < rounds; i++) {
    rawMs = Math.min(rawMs, (await timed(() => rawWrite(entries))).ms);
    riglineMs = Math.min(riglineMs, (await timed(() => tableToXlsx(ledgerTable(entries)))).ms);
    csvMs = Math.min(csvMs, (await timed(() => tableToCsv(ledgerTable(entries)))).ms);
  }
  const ratio = riglineMs / rawMs;
  const pass = ratio <= TARGET_RATIO;
  console.log(`export benchmark, ${ROWS.toLocaleString("en-AU")} ledger rows`);
  console.log(`  raw exceljs write (baseline)   ${rawMs.toFixed(0)} ms`);
  console.log(`  Rigline XLSX export            ${riglineMs.toFixed(0)} ms`);
  console.log(`  ratio                          ${ratio.toFixed(2)} × (target ≤ ${TARGET_RATIO} ×) ${pass ? "PASS" : "FAIL"}`);
  console.log(`  Rigline CSV export             ${csvMs.toFixed(0)} ms`);
  return { rows: ROWS, rawMs, riglineMs, csvMs, ratio, pass };
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? "").href) {
  const result = await run();
  process.exit(result.pass ? 0 : 1);
}
