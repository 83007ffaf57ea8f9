"use client";

import { Bar, BarChart, CartesianGrid, Legend, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";
import { Table, TBody, Td, TFoot, Th, THead, Tr } from "@/components/ui";
import { ChartFigure } from "./chart-figure";
import { legendProps } from "./legend";
import { dollarsOf, shortDollars } from "./format";
import { TONES } from "./palette";

export type BudgetBar = { costCentre: string; budgetCents: number; actualCents: number };

const CHART_ID = "budget-actual";

/** Budget (hatched) against actual spend (solid) for each cost centre, with the table. */
export function BudgetActualChart({ rows, period }: { rows: BudgetBar[]; period: string }) {
  const data = rows.map((r) => ({ costCentre: r.costCentre, budget: r.budgetCents / 100, actual: r.actualCents / 100 }));
  const total = (key: "budgetCents" | "actualCents") => rows.reduce((s, r) => s + r[key], 0);
  const used = (r: BudgetBar) => (r.budgetCents > 0 ? Math.round((r.actualCents / r.budgetCents) * 100) : 0);
  return (
    <ChartFigure
      testId="chart-budget-actual"
      title="Budget against actual, by cost centre"
      description={`For ${period}: each cost centre's budget (hatched bar) beside what it has spent before GST (solid bar).`}
      table={
        <Table label="Budget against actual, as a table">
          <THead>
            <Tr>
              <Th>Cost centre</Th>
              <Th numeric>Budget</Th>
              <Th numeric>Actual</Th>
              <Th numeric>Remaining</Th>
              <Th numeric>Used</Th>
            </Tr>
          </THead>
          <TBody>
            {rows.map((r) => (
              <Tr key={r.costCentre}>
                <Th scope="row">{r.costCentre}</Th>
                <Td numeric>{dollarsOf(r.budgetCents)}</Td>
                <Td numeric>{dollarsOf(r.actualCents)}</Td>
                <Td numeric>{dollarsOf(r.budgetCents - r.actualCents)}</Td>
                <Td numeric unit="%">
                  {used(r)}
                </Td>
              </Tr>
            ))}
          </TBody>
          <TFoot>
            <Tr>
              <Th scope="row">All cost centres</Th>
              <Td numeric>{dollarsOf(total("budgetCents"))}</Td>
              <Td numeric>{dollarsOf(total("actualCents"))}</Td>
              <Td numeric>{dollarsOf(total("budgetCents") - total("actualCents"))}</Td>
              <Td />
            </Tr>
          </TFoot>
        </Table>
      }
    >
      {rows.length === 0 ? (
        <p className="rounded-md border border-dashed border-line px-3 py-8 text-center text-muted">No budgets in this period.</p>
      ) : (
        <div className="w-full" style={{ height: Math.max(220, rows.length * 44 + 80) }}>
          <ResponsiveContainer width="100%" height="100%">
            <BarChart data={data} layout="vertical" margin={{ top: 8, right: 16, bottom: 8, left: 8 }} barGap={2} title="Budget against actual">
              <defs>
                <pattern id={`${CHART_ID}-hatch`} width="6" height="6" patternUnits="userSpaceOnUse" patternTransform="rotate(45)">
                  <rect width="6" height="6" fill="var(--color-night-100)" />
                  <rect width="2" height="6" fill="var(--color-night-500)" />
                </pattern>
              </defs>
              <CartesianGrid stroke={TONES.grid} horizontal={false} />
              <XAxis type="number" tickFormatter={shortDollars} tick={{ fill: TONES.muted, fontSize: 12 }} />
              <YAxis type="category" dataKey="costCentre" width={120} tick={{ fill: TONES.ink, fontSize: 12 }} />
              <Tooltip formatter={(value) => dollarsOf(Math.round(Number(value) * 100))} />
              <Legend {...legendProps} />
              <Bar dataKey="budget" name="Budget" fill={`url(#${CHART_ID}-hatch)`} stroke="var(--color-night-500)" isAnimationActive={false} />
              <Bar dataKey="actual" name="Actual (ex GST)" fill="var(--color-night-800)" isAnimationActive={false} />
            </BarChart>
          </ResponsiveContainer>
        </div>
      )}
    </ChartFigure>
  );
}
