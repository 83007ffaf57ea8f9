import type { Metadata } from "next";
import Link from "next/link";
import { BudgetActualChart } from "@/components/charts";
import { dollarsOf } from "@/components/charts/format";
import { BudgetForm, BudgetRowActions } from "@/components/costs/budget-forms";
import { financialYear, financialYearLabel, financialYearOf } from "@/components/costs/periods";
import { Card, CardBody, CardHeader, EmptyState, PageHeader, StatusPill, Table, TBody, Td, TFoot, Th, THead, Tr, type StatusTone } from "@/components/ui";
import { ledgerFilterOptions, listBudgets } from "@/lib/commands/costs";
import { isoDay } from "@/lib/exports";
import { requirePermission } from "@/lib/server/guard";
import { execute } from "@/lib/server/operation";
import { formatCalendarDay } from "@/lib/format/dates";

export const metadata: Metadata = { title: "Budgets" };

/** Our words for how a budget stands; near the limit from 90 % used. */
function standing(budgetCents: number, actualCents: number): { tone: StatusTone; word: string } {
  if (actualCents > budgetCents) return { tone: "danger", word: "Over budget" };
  if (actualCents >= budgetCents * 0.9) return { tone: "warn", word: "Near the limit" };
  return { tone: "ok", word: "Within budget" };
}

export default async function BudgetsPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const user = await requirePermission("read", "Cost");
  const params = await searchParams;
  const current = financialYearOf(new Date());
  const asked = Number(Array.isArray(params.fy) ? params.fy[0] : params.fy);
  const year = Number.isInteger(asked) && asked >= 2000 && asked <= current + 5 ? asked : current;
  const period = financialYear(year);
  const [{ items, totals }, options] = await Promise.all([
    execute(listBudgets, user, { from: period.from, to: period.to }),
    execute(ledgerFilterOptions, user, {}),
  ]);
  const canManage = user.ability.can("manage", "Cost");
  const years = [current - 1, current, current + 1];
  const over = items.filter((b) => b.actualCents > b.budgetCents).length;
  return (
    <div className="flex flex-col gap-6">
      <PageHeader
        title="Budgets"
        question="How is spend running against budget in each cost centre?"
        actions={
          <p className="text-sm text-muted" data-testid="budget-headline">
            {items.length === 0 ? "No budgets set" : `${dollarsOf(totals.actualCents)} of ${dollarsOf(totals.budgetCents)} spent; ${over} of ${items.length} cost centres over budget`}
          </p>
        }
      />
      <nav aria-label="Cost views" className="flex gap-4 text-sm font-semibold">
        <Link href="/costs" className="pb-1 text-accent hover:underline">
          Ledger
        </Link>
        <span aria-current="page" className="border-b-4 border-accent pb-1">
          Budgets
        </span>
        <Link href="/costs/trends" className="pb-1 text-accent hover:underline">
          Fleet over time
        </Link>
      </nav>
      <nav aria-label="Financial year" className="flex flex-wrap gap-2 text-sm">
        {years.map((y) => (
          <Link
            key={y}
            href={`/budgets?fy=${y}`}
            aria-current={y === year ? "page" : undefined}
            className={y === year ? "rounded bg-accent-soft px-3 py-1.5 font-semibold text-accent-ink" : "rounded px-3 py-1.5 font-semibold text-accent hover:underline"}
          >
            {financialYearLabel(y)}
          </Link>
        ))}
      </nav>
      <Card>
        <CardBody>
          <BudgetActualChart rows={items.map((b) => ({ costCentre: b.costCentre, budgetCents: b.budgetCents, actualCents: b.actualCents }))} period={`${financialYearLabel(year)} (1 July to 30 June)`} />
        </CardBody>
      </Card>
      <Card>
        <CardHeader title={`Budgets overlapping ${financialYearLabel(year)}`} description="Actual is spend before GST booked to the cost centre within the budget's own period." />
        <CardBody>
          {items.length === 0 ? (
            <EmptyState title="No budgets for this year">{canManage ? "Add one below." : "Finance sets the budgets."}</EmptyState>
          ) : (
            <Table label="Budgets against actual" data-testid="budget-table">
              <THead>
                <Tr>
                  <Th>Cost centre</Th>
                  <Th>Period</Th>
                  <Th numeric>Budget</Th>
                  <Th numeric>Actual</Th>
                  <Th numeric>Remaining</Th>
                  <Th>Standing</Th>
                  {canManage && <Th numeric>Change</Th>}
                </Tr>
              </THead>
              <TBody>
                {items.map((b) => {
                  const s = standing(b.budgetCents, b.actualCents);
                  return (
                    <Tr key={b.id} data-testid="budget-row">
                      <Th scope="row">
                        <Link href={`/costs?costCentre=${encodeURIComponent(b.costCentre)}&from=${isoDay(b.periodStart)}&to=${isoDay(b.periodEnd)}`} className="text-accent underline-offset-4 hover:underline">
                          {b.costCentre}
                        </Link>
                      </Th>
                      <Td className="whitespace-nowrap">
                        {formatCalendarDay(b.periodStart)} – {formatCalendarDay(b.periodEnd)}
                      </Td>
                      <Td numeric>{dollarsOf(b.budgetCents)}</Td>
                      <Td numeric>{dollarsOf(b.actualCents)}</Td>
                      <Td numeric className={b.remainingCents < 0 ? "font-semibold text-danger" : undefined}>
                        {dollarsOf(b.remainingCents)}
                      </Td>
                      <Td>
                        <StatusPill tone={s.tone} size="sm">
                          {s.word}
                        </StatusPill>
                      </Td>
                      {canManage && (
                        <Td numeric>
                          <BudgetRowActions
                            budget={{ id: b.id, costCentre: b.costCentre, periodStart: isoDay(b.periodStart), periodEnd: isoDay(b.periodEnd), amount: (b.budgetCents / 100).toFixed(2) }}
                          />
                        </Td>
                      )}
                    </Tr>
                  );
                })}
              </TBody>
              <TFoot>
                <Tr>
                  <Th scope="row">All cost centres</Th>
                  <Td />
                  <Td numeric>{dollarsOf(totals.budgetCents)}</Td>
                  <Td numeric>{dollarsOf(totals.actualCents)}</Td>
                  <Td numeric>{dollarsOf(totals.remainingCents)}</Td>
                  <Td />
                  {canManage && <Td />}
                </Tr>
              </TFoot>
            </Table>
          )}
        </CardBody>
      </Card>
      {canManage && (
        <Card>
          <CardHeader title="Add a budget" description="One budget per cost centre and period; periods of one cost centre may not overlap. A financial year runs 1 July to 30 June." />
          <CardBody>
            <BudgetForm costCentres={options.costCentres} periodStart={period.from} periodEnd={period.to} />
          </CardBody>
        </Card>
      )}
    </div>
  );
}
