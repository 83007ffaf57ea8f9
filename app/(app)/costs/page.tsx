import type { Metadata } from "next";
import Link from "next/link";
import { SpendByMonthChart } from "@/components/charts";
import { ExportLinks } from "@/components/costs/export-links";
import { LedgerFilters } from "@/components/costs/ledger-filters";
import { LedgerTable } from "@/components/costs/ledger-table";
import { LedgerTotals } from "@/components/costs/ledger-totals";
import { filterQuery, filterValues } from "@/components/costs/query";
import { spendSeries } from "@/components/costs/spend-series";
import { buttonClasses, Card, CardBody, CardHeader, EmptyState, FormMessage, PageHeader, Pagination } from "@/components/ui";
import { costListSchema, ledgerFilterOptions, ledgerSummary, listLedger } from "@/lib/commands/costs";
import { requirePermission } from "@/lib/server/guard";
import { execute } from "@/lib/server/operation";

export const metadata: Metadata = { title: "Costs" };

type SearchParams = Promise<Record<string, string | string[] | undefined>>;

export default async function CostsPage({ searchParams }: { searchParams: SearchParams }) {
  const user = await requirePermission("read", "Cost");
  const params = await searchParams;
  const requested = filterValues(params);
  const pageParam = Array.isArray(params.page) ? params.page[0] : params.page;
  // Filters that do not parse are dropped (and said so) rather than failing the page.
  const parsed = costListSchema.safeParse({ ...requested, page: pageParam ?? "1" });
  const values = parsed.success ? requested : {};
  const raw = { ...values, page: parsed.success ? (pageParam ?? "1") : "1" };
  const [ledger, summary, options] = await Promise.all([
    execute(listLedger, user, raw),
    execute(ledgerSummary, user, values),
    execute(ledgerFilterOptions, user, {}),
  ]);
  const canBook = user.ability.can("manage", "Cost");
  const { months, series } = spendSeries(summary.byMonth, values);
  return (
    <div className="flex flex-col gap-6">
      <PageHeader
        title="Costs"
        question="What has been spent, on which vehicles and cost centres?"
        actions={
          <>
            <ExportLinks values={values} />
            {canBook && (
              <Link href={`/costs/new${values.vehicleId ? `?vehicleId=${values.vehicleId}` : ""}`} className={buttonClasses({ variant: "primary" })}>
                Enter an invoice
              </Link>
            )}
          </>
        }
      />
      <nav aria-label="Cost views" className="flex gap-4 text-sm font-semibold">
        <span aria-current="page" className="border-b-4 border-accent pb-1">
          Ledger
        </span>
        <Link href="/budgets" className="pb-1 text-accent hover:underline">
          Budgets
        </Link>
        <Link href="/costs/trends" className="pb-1 text-accent hover:underline">
          Fleet over time
        </Link>
      </nav>
      {!parsed.success && (
        <FormMessage tone="error" data-testid="filter-error">
          Some filters could not be read ({parsed.error.issues.map((i) => i.message).join("; ")}), so all costs are shown.
        </FormMessage>
      )}
      <Card>
        <CardBody>
          <LedgerFilters values={values} options={options} now={new Date()} />
        </CardBody>
      </Card>
      <LedgerTotals totals={ledger.totals} />
      <Card>
        <CardBody>
          <SpendByMonthChart months={months} series={series} />
        </CardBody>
      </Card>
      <Card>
        <CardHeader
          title="Entries"
          description={ledger.total === 0 ? "No entries match." : `${ledger.total.toLocaleString("en-AU")} entries, newest first; page ${ledger.page} of ${ledger.pageCount}.`}
        />
        <CardBody className="flex flex-col gap-4">
          {ledger.items.length === 0 ? (
            <EmptyState title="No costs match these filters">Widen the period or clear a filter to see more.</EmptyState>
          ) : (
            <LedgerTable entries={ledger.items} />
          )}
          <Pagination page={ledger.page} pageCount={ledger.pageCount} hrefFor={(page) => `/costs${filterQuery(values, { page })}`} label="Ledger pages" />
        </CardBody>
      </Card>
    </div>
  );
}
