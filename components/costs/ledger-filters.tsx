import Link from "next/link";
import { Button, Field, Input, Select } from "@/components/ui";
import { CATEGORY_LABELS, COST_CATEGORIES, KIND_LABELS, COST_KINDS, SOURCE_LABELS, COST_SOURCES } from "@/lib/exports";
import { quickPeriods } from "./periods";
import { filterQuery, type FilterValues } from "./query";

type Options = { costCentres: string[]; depots: { id: string; name: string }[]; vehicles: { id: string; fleetNumber: string }[] };

/**
 * The ledger filters: a plain GET form, so the state lives in the URL (shareable, back button
 * works, no script needed), with quick links for the usual periods.
 */
export function LedgerFilters({ values, options, now, action = "/costs" }: { values: FilterValues; options: Options; now: Date; action?: string }) {
  const periods = quickPeriods(now);
  return (
    <form method="get" action={action} className="flex flex-col gap-3" aria-label="Filter the ledger" role="search">
      <div className="flex flex-wrap items-center gap-x-3 gap-y-1 text-sm">
        <span className="font-semibold text-muted">Period:</span>
        {periods.map((p) => {
          const active = values.from === p.from && values.to === p.to;
          return (
            <Link
              key={p.key}
              href={`${action}${filterQuery({ ...values, from: p.from, to: p.to })}`}
              aria-current={active ? "true" : undefined}
              className={active ? "rounded bg-accent-soft px-2 py-1 font-semibold text-accent-ink" : "rounded px-2 py-1 font-semibold text-accent underline-offset-4 hover:underline"}
            >
              {p.label}
            </Link>
          );
        })}
        <Link href={`${action}${filterQuery({ ...values, from: undefined, to: undefined })}`} className="rounded px-2 py-1 font-semibold text-accent underline-offset-4 hover:underline">
          All dates
        </Link>
      </div>
      <div className="grid grid-cols-2 items-end gap-3 md:grid-cols-4">
        <Field label="From" id="filter-from">
          <Input type="date" name="from" defaultValue={values.from ?? ""} />
        </Field>
        <Field label="To" id="filter-to">
          <Input type="date" name="to" defaultValue={values.to ?? ""} />
        </Field>
        <Field label="Cost centre" id="filter-cost-centre">
          <Select name="costCentre" defaultValue={values.costCentre ?? ""}>
            <option value="">All cost centres</option>
            {options.costCentres.map((c) => (
              <option key={c} value={c}>
                {c}
              </option>
            ))}
          </Select>
        </Field>
        <Field label="Depot" id="filter-depot">
          <Select name="depotId" defaultValue={values.depotId ?? ""}>
            <option value="">All depots</option>
            {options.depots.map((d) => (
              <option key={d.id} value={d.id}>
                {d.name}
              </option>
            ))}
          </Select>
        </Field>
        <Field label="Vehicle" id="filter-vehicle">
          <Select name="vehicleId" defaultValue={values.vehicleId ?? ""}>
            <option value="">All vehicles</option>
            {options.vehicles.map((v) => (
              <option key={v.id} value={v.id}>
                {v.fleetNumber}
              </option>
            ))}
          </Select>
        </Field>
        <Field label="Category" id="filter-category">
          <Select name="category" defaultValue={values.category ?? ""}>
            <option value="">All categories</option>
            {COST_CATEGORIES.map((c) => (
              <option key={c} value={c}>
                {CATEGORY_LABELS[c]}
              </option>
            ))}
          </Select>
        </Field>
        <Field label="Capital or operating" id="filter-kind">
          <Select name="kind" defaultValue={values.kind ?? ""}>
            <option value="">Both</option>
            {COST_KINDS.map((k) => (
              <option key={k} value={k}>
                {KIND_LABELS[k]}
              </option>
            ))}
          </Select>
        </Field>
        <Field label="Source" id="filter-source">
          <Select name="source" defaultValue={values.source ?? ""}>
            <option value="">All sources</option>
            {COST_SOURCES.map((s) => (
              <option key={s} value={s}>
                {SOURCE_LABELS[s]}
              </option>
            ))}
          </Select>
        </Field>
      </div>
      <div className="flex flex-wrap items-center gap-3">
        <Button type="submit">Show costs</Button>
        <Link href={action} className="text-sm font-semibold text-accent underline-offset-4 hover:underline">
          Clear filters
        </Link>
      </div>
    </form>
  );
}
