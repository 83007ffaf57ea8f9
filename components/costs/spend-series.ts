import type { SpendMonth, SpendSeries } from "@/components/charts";
import type { MonthCategorySpend } from "@/db/costs";
import { CATEGORY_LABELS, COST_CATEGORIES } from "@/lib/exports";
import { monthsBetween } from "./periods";

/**
 * Rows for the stacked spend chart: every month of the period (months with no spend show as
 * empty, not skipped), and one series per category that has any spend, in the standard's order.
 */
export function spendSeries(byMonth: MonthCategorySpend[], range: { from?: string | null; to?: string | null } = {}): { months: SpendMonth[]; series: SpendSeries[] } {
  const seen = [...new Set(byMonth.map((r) => r.month))].sort();
  const first = range.from ? range.from.slice(0, 7) : seen[0];
  const last = range.to ? range.to.slice(0, 7) : seen[seen.length - 1];
  if (!first || !last || first > last) return { months: [], series: [] };
  const cells = new Map<string, Record<string, number>>();
  for (const r of byMonth) {
    const row = cells.get(r.month) ?? {};
    row[r.category] = (row[r.category] ?? 0) + r.exGstCents;
    cells.set(r.month, row);
  }
  const used = new Set(byMonth.filter((r) => r.exGstCents !== 0).map((r) => r.category));
  const series = COST_CATEGORIES.filter((c) => used.has(c)).map((c) => ({ key: c, label: CATEGORY_LABELS[c] }));
  const months = monthsBetween(first, last).map((month) => ({ month, byCategoryCents: cells.get(month) ?? {} }));
  return { months, series };
}
