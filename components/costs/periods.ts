/** Named periods for the ledger's quick filters; days are YYYY-MM-DD (UTC calendar days). */

export type Period = { key: string; label: string; from: string; to: string };

const iso = (ms: number) => new Date(ms).toISOString().slice(0, 10);

/** 1 July of the financial year (July to June) that `date` falls in, as a UTC year number. */
export function financialYearOf(date: Date): number {
  return date.getUTCMonth() >= 6 ? date.getUTCFullYear() : date.getUTCFullYear() - 1;
}

/** "FY 2025–26" for the year starting 1 July 2025. */
export function financialYearLabel(startYear: number): string {
  return `FY ${startYear}–${String((startYear + 1) % 100).padStart(2, "0")}`;
}

export function financialYear(startYear: number): { from: string; to: string } {
  return { from: iso(Date.UTC(startYear, 6, 1)), to: iso(Date.UTC(startYear + 1, 5, 30)) };
}

export function quickPeriods(now: Date): Period[] {
  const y = now.getUTCFullYear();
  const m = now.getUTCMonth();
  const fy = financialYearOf(now);
  return [
    { key: "month", label: "This month", from: iso(Date.UTC(y, m, 1)), to: iso(Date.UTC(y, m + 1, 0)) },
    { key: "last-month", label: "Last month", from: iso(Date.UTC(y, m - 1, 1)), to: iso(Date.UTC(y, m, 0)) },
    { key: "quarter", label: "Last 3 months", from: iso(Date.UTC(y, m - 2, 1)), to: iso(Date.UTC(y, m + 1, 0)) },
    { key: "fy", label: `This financial year (${financialYearLabel(fy)})`, ...financialYear(fy) },
    { key: "last-fy", label: `Last financial year (${financialYearLabel(fy - 1)})`, ...financialYear(fy - 1) },
  ];
}

/** Every month YYYY-MM from the first to the last, inclusive. */
export function monthsBetween(first: string, last: string): string[] {
  const [fy, fm] = first.split("-").map(Number) as [number, number];
  const [ly, lm] = last.split("-").map(Number) as [number, number];
  const out: string[] = [];
  for (let y = fy, m = fm; y < ly || (y === ly && m <= lm); m === 12 ? ((m = 1), (y += 1)) : (m += 1)) {
    out.push(`${y}-${String(m).padStart(2, "0")}`);
    if (out.length > 240) break;
  }
  return out;
}

