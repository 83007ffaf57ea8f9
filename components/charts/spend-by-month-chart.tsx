"use client";

import { Bar, BarChart, CartesianGrid, Legend, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";
import { Table, TBody, Td, TFoot, Th, THead, Tr } from "@/components/ui";
import { ChartFigure } from "./chart-figure";
import { legendProps } from "./legend";
import { dollarsOf, monthLabel, shortDollars } from "./format";
import { seriesFill } from "./palette";
import { SeriesPatterns, Swatch } from "./patterns";

export type SpendMonth = { month: string; byCategoryCents: Record<string, number> };
export type SpendSeries = { key: string; label: string };

const CHART_ID = "spend-by-month";

/** Ex-GST spend per month, stacked by category, with the same figures as a table. */
export function SpendByMonthChart({ months, series, title = "Spend by month", description }: { months: SpendMonth[]; series: SpendSeries[]; title?: string; description?: string }) {
  const data = months.map((m) => {
    const row: Record<string, number | string> = { month: monthLabel(m.month) };
    for (const s of series) row[s.key] = (m.byCategoryCents[s.key] ?? 0) / 100;
    return row;
  });
  const monthTotal = (m: SpendMonth) => series.reduce((sum, s) => sum + (m.byCategoryCents[s.key] ?? 0), 0);
  const seriesTotal = (key: string) => months.reduce((sum, m) => sum + (m.byCategoryCents[key] ?? 0), 0);
  const grand = months.reduce((sum, m) => sum + monthTotal(m), 0);
  return (
    <ChartFigure
      testId="chart-spend-by-month"
      title={title}
      description={description ?? "Spend before GST in each month of the period, stacked by category. Credits lower a month's bar."}
      table={
        <Table label={`${title}, as a table`}>
          <THead>
            <Tr>
              <Th scope="col">Category</Th>
              {months.map((m) => (
                <Th key={m.month} numeric>
                  {monthLabel(m.month)}
                </Th>
              ))}
              <Th numeric>Total</Th>
            </Tr>
          </THead>
          <TBody>
            {series.map((s, i) => (
              <Tr key={s.key}>
                <Th scope="row">
                  <span className="inline-flex items-center gap-2">
                    <Swatch chartId={CHART_ID} index={i} fill={seriesFill(CHART_ID, i)} />
                    {s.label}
                  </span>
                </Th>
                {months.map((m) => (
                  <Td key={m.month} numeric>
                    {dollarsOf(m.byCategoryCents[s.key] ?? 0)}
                  </Td>
                ))}
                <Td numeric className="font-semibold">
                  {dollarsOf(seriesTotal(s.key))}
                </Td>
              </Tr>
            ))}
          </TBody>
          <TFoot>
            <Tr>
              <Th scope="row">All categories</Th>
              {months.map((m) => (
                <Td key={m.month} numeric>
                  {dollarsOf(monthTotal(m))}
                </Td>
              ))}
              <Td numeric data-testid="spend-table-total">
                {dollarsOf(grand)}
              </Td>
            </Tr>
          </TFoot>
        </Table>
      }
    >
      {months.length === 0 ? (
        <p className="rounded-md border border-dashed border-line px-3 py-8 text-center text-muted">No spend in this period.</p>
      ) : (
        <div className="h-80 w-full">
          <ResponsiveContainer width="100%" height="100%">
            <BarChart data={data} margin={{ top: 8, right: 8, bottom: 8, left: 8 }} title={title}>
              <SeriesPatterns chartId={CHART_ID} count={series.length} />
              <CartesianGrid stroke="var(--color-sand-200)" vertical={false} />
              <XAxis dataKey="month" tick={{ fill: "var(--color-sand-700)", fontSize: 12 }} />
              <YAxis tickFormatter={shortDollars} tick={{ fill: "var(--color-sand-700)", fontSize: 12 }} width={64} />
              <Tooltip formatter={(value) => dollarsOf(Math.round(Number(value) * 100))} />
              <Legend {...legendProps} />
              {series.map((s, i) => (
                <Bar key={s.key} dataKey={s.key} name={s.label} stackId="spend" fill={seriesFill(CHART_ID, i)} stroke="var(--color-surface-raised)" strokeWidth={0.5} isAnimationActive={false} />
              ))}
            </BarChart>
          </ResponsiveContainer>
        </div>
      )}
    </ChartFigure>
  );
}
