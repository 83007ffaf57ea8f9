"use client";

import { keepPreviousData, useQuery } from "@tanstack/react-query";
import {
  flexRender,
  getCoreRowModel,
  useReactTable,
  type ColumnDef,
  type RowSelectionState,
  type SortingState,
  type Updater,
  type VisibilityState,
} from "@tanstack/react-table";
import Link from "next/link";
import { usePathname, useRouter, useSearchParams } from "next/navigation";
import { startTransition, useCallback, useEffect, useMemo, useOptimistic, useState } from "react";
import {
  Button,
  Checkbox,
  Dialog,
  DialogContent,
  DialogDescription,
  DialogHeader,
  DialogTitle,
  DialogTrigger,
  EmptyState,
  Field,
  FormMessage,
  Input,
  pageItems,
  Quantity,
  Select,
  Skeleton,
  Spinner,
  StatusPill,
  Table,
  TBody,
  Td,
  Th,
  THead,
  Tr,
  cn,
} from "@/components/ui";
import type { VehicleState } from "@/db/schema";
import { BulkActions, type BulkOptions } from "./bulk-actions";
import {
  apiQuery,
  columnsParam,
  DEFAULT_COLUMNS,
  FIELD_COLUMNS,
  hasFilters,
  PAGE_SIZES,
  readRegisterParams,
  REGISTER_COLUMNS,
  REGISTER_SORTS,
  withChanges,
  type RegisterColumn,
  type RegisterFilter,
} from "./register-params";
import { VARIANCE_LABELS, VariancePill, type VarianceStatusValue } from "./variance-pill";
import { VEHICLE_STATE_LABELS, VehicleStatePill } from "./vehicle-state";
import { Instant } from "@/components/providers/time-zone";
import { formatCalendarDay } from "@/lib/format/dates";

/** A row of GET /api/vehicles, as JSON (dates are ISO strings). */
export type RegisterItem = {
  id: string;
  fleetNumber: string;
  vin: string | null;
  registration: string | null;
  registrationExpiry: string | null;
  state: VehicleState;
  odometerKm: number | null;
  buildYear: number | null;
  costCentre: string | null;
  updatedAt: string;
  platform: { id: string; make: string; model: string; variant: string; ratingsMissing: boolean };
  depot: { id: string; name: string; code: string } | null;
  edition: {
    id: string;
    number: number;
    status: string;
    standardId: string;
    standardName: string;
  } | null;
  variance: VarianceStatusValue;
  drivers: { id: string; name: string }[];
};
type RegisterPage = {
  items: RegisterItem[];
  page: number;
  pageSize: number;
  total: number;
  pageCount: number;
};

export type RegisterOptions = {
  depots: { id: string; name: string; code: string }[];
  platforms: { id: string; name: string }[];
  editions: {
    id: string;
    number: number;
    status: string;
    standardId: string;
    standardName: string;
  }[];
  standards: { id: string; name: string }[];
};

const COLUMN_LABELS: Record<RegisterColumn, string> = {
  fleetNumber: "Fleet no.",
  registration: "Registration",
  vin: "VIN",
  platform: "Platform",
  depot: "Depot",
  state: "State",
  variance: "Standard met",
  standard: "Standard",
  odometerKm: "Odometer",
  costCentre: "Cost centre",
  drivers: "Drivers",
  registrationExpiry: "Rego expiry",
  buildYear: "Built",
  updatedAt: "Updated",
};
const NUMERIC: ReadonlySet<string> = new Set(["odometerKm", "buildYear"]);
const SORTABLE: ReadonlySet<string> = new Set(REGISTER_SORTS);

async function fetchPage(query: string): Promise<RegisterPage> {
  const response = await fetch(`/api/vehicles?${query}`, {
    headers: { accept: "application/json" },
  });
  const json = (await response.json().catch(() => null)) as
    (RegisterPage & { error?: { message?: string } }) | null;
  if (!response.ok) throw new Error(json?.error?.message ?? "The register could not be loaded.");
  return json as RegisterPage;
}

function columnsFor(canManage: boolean, control: "md" | "lg"): ColumnDef<RegisterItem>[] {
  const select: ColumnDef<RegisterItem> = {
    id: "select",
    enableHiding: false,
    enableSorting: false,
    header: ({ table }) => (
      <input
        type="checkbox"
        className="size-5 cursor-pointer accent-accent align-middle"
        aria-label="Choose every vehicle on this page"
        checked={table.getIsAllPageRowsSelected()}
        ref={(el) => {
          if (el)
            el.indeterminate =
              table.getIsSomePageRowsSelected() && !table.getIsAllPageRowsSelected();
        }}
        onChange={table.getToggleAllPageRowsSelectedHandler()}
      />
    ),
    cell: ({ row }) => (
      <input
        type="checkbox"
        className="size-5 cursor-pointer accent-accent align-middle"
        aria-label={`Choose ${row.original.fleetNumber}`}
        checked={row.getIsSelected()}
        onChange={row.getToggleSelectedHandler()}
      />
    ),
  };
  const cols: ColumnDef<RegisterItem>[] = [
    {
      id: "fleetNumber",
      enableHiding: false,
      cell: ({ row }) => (
        <Link
          href={`/vehicles/${row.original.id}`}
          className={cn(
            "font-semibold text-accent underline-offset-4 hover:underline",
            control === "lg" && "inline-flex min-h-11 items-center text-base",
          )}
        >
          {row.original.fleetNumber}
        </Link>
      ),
    },
    { id: "registration", cell: ({ row }) => row.original.registration ?? <Muted /> },
    {
      id: "vin",
      cell: ({ row }) =>
        row.original.vin ? (
          <span className="font-mono text-xs">{row.original.vin}</span>
        ) : (
          <Muted />
        ),
    },
    {
      id: "platform",
      cell: ({ row }) => {
        const p = row.original.platform;
        return (
          <span>
            {p.make} {p.model} <span className="text-muted">{p.variant}</span>
            {p.ratingsMissing && (
              <span className="block text-xs font-semibold text-warn-ink">ratings missing</span>
            )}
          </span>
        );
      },
    },
    { id: "depot", cell: ({ row }) => row.original.depot?.name ?? <Muted /> },
    { id: "state", cell: ({ row }) => <VehicleStatePill state={row.original.state} size="sm" /> },
    {
      id: "variance",
      enableSorting: false,
      cell: ({ row }) => <VariancePill status={row.original.variance} />,
    },
    {
      id: "standard",
      enableSorting: false,
      cell: ({ row }) => {
        const e = row.original.edition;
        return e ? `${e.standardName} · ed. ${e.number}` : <Muted />;
      },
    },
    {
      id: "odometerKm",
      cell: ({ row }) =>
        row.original.odometerKm === null ? (
          <Muted />
        ) : (
          <Quantity value={row.original.odometerKm} unit="km" />
        ),
    },
    {
      id: "costCentre",
      enableSorting: false,
      cell: ({ row }) => row.original.costCentre ?? <Muted />,
    },
    {
      id: "drivers",
      enableSorting: false,
      cell: ({ row }) =>
        row.original.drivers.length ? (
          row.original.drivers.map((d) => d.name).join(", ")
        ) : (
          <Muted />
        ),
    },
    {
      id: "registrationExpiry",
      enableSorting: false,
      cell: ({ row }) => {
        const v = row.original.registrationExpiry;
        if (!v) return <Muted />;
        const d = new Date(v);
        return d.getTime() < Date.now() ? (
          <StatusPill tone="danger" size="sm">
            {`Expired ${formatCalendarDay(d)}`}
          </StatusPill>
        ) : (
          formatCalendarDay(d)
        );
      },
    },
    {
      id: "buildYear",
      enableSorting: false,
      cell: ({ row }) => row.original.buildYear ?? <Muted />,
    },
    { id: "updatedAt", cell: ({ row }) => <Instant at={row.original.updatedAt} /> },
  ];
  // Sorting runs on the server; TanStack only needs to know a column has a value to sort by.
  const sortValue: Record<string, (r: RegisterItem) => string | number | null> = {
    fleetNumber: (r) => r.fleetNumber,
    registration: (r) => r.registration,
    platform: (r) => `${r.platform.make} ${r.platform.model} ${r.platform.variant}`,
    depot: (r) => r.depot?.name ?? null,
    state: (r) => r.state,
    odometerKm: (r) => r.odometerKm,
    updatedAt: (r) => r.updatedAt,
  };
  for (const c of cols) {
    c.header = COLUMN_LABELS[c.id as RegisterColumn];
    const value = sortValue[c.id!];
    if (value) (c as ColumnDef<RegisterItem> & { accessorFn: typeof value }).accessorFn = value;
    if (c.enableSorting === undefined) c.enableSorting = SORTABLE.has(c.id!);
  }
  return canManage ? [select, ...cols] : cols;
}

function Muted() {
  return <span className="text-muted">—</span>;
}

/**
 * The vehicle register: a server-paged table whose page, sort, filters, search and columns live
 * in the URL, so a reload or a shared link shows the same view.
 */
export function VehicleRegister({
  options,
  canManage,
  mine,
}: {
  options: RegisterOptions;
  canManage: boolean;
  mine: boolean;
}) {
  const router = useRouter();
  const pathname = usePathname();
  const searchParams = useSearchParams();
  // The URL is the state; while a replace is on its way the table already shows the change.
  const [urlSearch, setOptimisticSearch] = useOptimistic(searchParams.toString());
  const defaults = mine ? FIELD_COLUMNS : DEFAULT_COLUMNS;
  const params = useMemo(
    () => readRegisterParams(new URLSearchParams(urlSearch), defaults),
    [urlSearch, defaults],
  );
  const query = apiQuery(params);
  const control = mine ? "lg" : "md";

  const [rowSelection, setRowSelection] = useState<RowSelectionState>({});
  const [search, setSearch] = useState(params.q);

  const replace = useCallback(
    (changes: Record<string, string | null>) => {
      const qs = withChanges(urlSearch, changes, defaults);
      startTransition(() => {
        setOptimisticSearch(qs);
        router.replace(qs ? `${pathname}?${qs}` : pathname, { scroll: false });
      });
    },
    [router, pathname, urlSearch, setOptimisticSearch, defaults],
  );
  /** A new filter or search starts at page 1 with nothing chosen. */
  const refilter = useCallback(
    (changes: Record<string, string | null>) => {
      setRowSelection({});
      replace({ ...changes, page: null });
    },
    [replace],
  );

  // Search as the user types, once they pause.
  useEffect(() => {
    if (search.trim() === params.q.trim()) return;
    const timer = setTimeout(() => refilter({ q: search.trim() || null }), 350);
    return () => clearTimeout(timer);
  }, [search, params.q, refilter]);

  const { data, error, isPending, isFetching, refetch } = useQuery({
    queryKey: ["vehicles", query],
    queryFn: () => fetchPage(query),
    placeholderData: keepPreviousData,
  });

  const columns = useMemo(() => columnsFor(canManage, control), [canManage, control]);
  const sorting: SortingState = [{ id: params.sort, desc: params.dir === "desc" }];
  const columnVisibility: VisibilityState = Object.fromEntries(
    REGISTER_COLUMNS.map((c) => [c, params.columns.includes(c)]),
  );

  // TanStack Table keeps no state of its own here: the URL holds sorting, paging and columns.
  // eslint-disable-next-line react-hooks/incompatible-library
  const table = useReactTable({
    data: data?.items ?? [],
    columns,
    getCoreRowModel: getCoreRowModel(),
    getRowId: (row) => row.id,
    manualPagination: true,
    manualSorting: true,
    manualFiltering: true,
    enableMultiSort: false,
    enableSortingRemoval: false,
    sortDescFirst: false,
    enableRowSelection: canManage,
    rowCount: data?.total ?? 0,
    state: {
      sorting,
      columnVisibility,
      rowSelection,
      pagination: { pageIndex: params.page - 1, pageSize: params.pageSize },
    },
    onSortingChange: (updater: Updater<SortingState>) => {
      const next = typeof updater === "function" ? updater(sorting) : updater;
      const first = next[0];
      replace({ sort: first?.id ?? null, dir: first?.desc ? "desc" : null, page: null });
    },
    onColumnVisibilityChange: (updater: Updater<VisibilityState>) => {
      const next = typeof updater === "function" ? updater(columnVisibility) : updater;
      const chosen = REGISTER_COLUMNS.filter((c) => c === "fleetNumber" || next[c]);
      replace({ cols: columnsParam(chosen) });
    },
    onRowSelectionChange: setRowSelection,
  });

  const selectedIds = Object.keys(rowSelection).filter((k) => rowSelection[k]);
  const filtered = hasFilters(params);
  const setFilter = (name: RegisterFilter) => (e: { target: { value: string } }) =>
    refilter({ [name]: e.target.value || null });
  const clearAll = () => {
    setSearch("");
    refilter(
      Object.fromEntries([["q", null], ...Object.keys(params.filters).map((f) => [f, null])]),
    );
  };

  const bulkOptions: BulkOptions = {
    depots: options.depots,
    editions: options.editions
      .filter((e) => e.status === "published")
      .map((e) => ({ id: e.id, label: `${e.standardName}, edition ${e.number}` })),
  };

  const page = data?.page ?? params.page;
  const pageCount = data?.pageCount ?? 0;
  const first = data && data.total > 0 ? (page - 1) * data.pageSize + 1 : 0;
  const last = data ? Math.min(data.total, page * data.pageSize) : 0;

  return (
    <div className="flex flex-col gap-4">
      <search
        aria-label="Find vehicles"
        className={cn(
          "grid grid-cols-1 gap-3",
          mine ? "sm:grid-cols-2" : "sm:grid-cols-2 lg:grid-cols-4",
        )}
      >
        <Field
          label="Search fleet no., VIN or registration"
          className={mine ? "" : "lg:col-span-2"}
        >
          <Input
            type="search"
            size={control}
            value={search}
            onChange={(e) => setSearch(e.target.value)}
            autoComplete="off"
            spellCheck={false}
          />
        </Field>
        <Field label="State">
          <Select size={control} value={params.filters.state ?? ""} onChange={setFilter("state")}>
            <option value="">Any state</option>
            {(Object.keys(VEHICLE_STATE_LABELS) as VehicleState[]).map((s) => (
              <option key={s} value={s}>
                {VEHICLE_STATE_LABELS[s]}
              </option>
            ))}
          </Select>
        </Field>
        {!mine && (
          <>
            <Field label="Depot">
              <Select value={params.filters.depotId ?? ""} onChange={setFilter("depotId")}>
                <option value="">All depots</option>
                {options.depots.map((d) => (
                  <option key={d.id} value={d.id}>
                    {d.name}
                  </option>
                ))}
              </Select>
            </Field>
            <Field label="Platform">
              <Select value={params.filters.platformId ?? ""} onChange={setFilter("platformId")}>
                <option value="">All platforms</option>
                {options.platforms.map((p) => (
                  <option key={p.id} value={p.id}>
                    {p.name}
                  </option>
                ))}
              </Select>
            </Field>
            <Field label="Standard">
              <Select value={params.filters.standardId ?? ""} onChange={setFilter("standardId")}>
                <option value="">Any standard</option>
                {options.standards.map((s) => (
                  <option key={s.id} value={s.id}>
                    {s.name}
                  </option>
                ))}
              </Select>
            </Field>
            <Field label="Edition">
              <Select value={params.filters.editionId ?? ""} onChange={setFilter("editionId")}>
                <option value="">Any edition</option>
                {options.editions.map((e) => (
                  <option key={e.id} value={e.id}>
                    {`${e.standardName}, edition ${e.number}${e.status === "published" ? "" : ` (${e.status})`}`}
                  </option>
                ))}
              </Select>
            </Field>
            <Field label="Standard met">
              <Select value={params.filters.variance ?? ""} onChange={setFilter("variance")}>
                <option value="">Any</option>
                {(Object.keys(VARIANCE_LABELS) as VarianceStatusValue[]).map((v) => (
                  <option key={v} value={v}>
                    {VARIANCE_LABELS[v]}
                  </option>
                ))}
              </Select>
            </Field>
            <Field label="Trip readiness">
              <Select value={params.filters.readiness ?? ""} onChange={setFilter("readiness")}>
                <option value="">Any</option>
                <option value="ready">Ready for remote duty</option>
                <option value="limited">Limited (town and graded roads)</option>
                <option value="not_ready">Not ready</option>
              </Select>
            </Field>
          </>
        )}
      </search>

      <div className="flex flex-wrap items-center justify-between gap-3">
        <p className="text-sm text-muted" aria-live="polite" data-testid="register-count">
          {data
            ? data.total === 0
              ? "No vehicles"
              : `Showing ${first}–${last} of ${data.total} vehicle${data.total === 1 ? "" : "s"}`
            : "Loading vehicles…"}
          {isFetching && data && (
            <span className="ml-2 inline-flex items-center gap-1">
              <Spinner size="sm" /> updating
            </span>
          )}
        </p>
        <div className="flex flex-wrap items-center gap-2">
          {filtered && (
            <Button variant="ghost" size="sm" onClick={clearAll}>
              Clear filters
            </Button>
          )}
          {!mine && <ColumnChooser table={table} />}
        </div>
      </div>

      {canManage && selectedIds.length > 0 && (
        <BulkActions
          selectedIds={selectedIds}
          options={bulkOptions}
          onDone={() => setRowSelection({})}
        />
      )}

      {error && !data ? (
        <FormMessage tone="error">
          {error.message}{" "}
          <Button variant="link" size="sm" onClick={() => void refetch()}>
            Try again
          </Button>
        </FormMessage>
      ) : isPending ? (
        <div className="flex flex-col gap-2" aria-busy="true" aria-label="Loading vehicles">
          {Array.from({ length: 6 }, (_, i) => (
            <Skeleton key={i} className="h-9 w-full" />
          ))}
        </div>
      ) : data && data.total === 0 ? (
        <EmptyState
          title={filtered ? "No vehicles match" : mine ? "No vehicles to show" : "No vehicles yet"}
          action={
            filtered ? (
              <Button variant="secondary" onClick={clearAll}>
                Clear filters
              </Button>
            ) : undefined
          }
        >
          {filtered
            ? "Nothing in the register matches this search and these filters."
            : mine
              ? "No vehicle is assigned to you yet."
              : "Add vehicles one by one or import the register from a spreadsheet."}
        </EmptyState>
      ) : (
        <>
          {mine && data && (
            // On a phone, a driver's few vehicles read better as cards with big targets.
            <ul className="flex flex-col gap-3 sm:hidden" aria-label="My vehicles">
              {data.items.map((v) => (
                <li key={v.id}>
                  <Link
                    href={`/vehicles/${v.id}`}
                    className="flex min-h-16 flex-col gap-1 rounded-lg border border-line bg-surface-raised px-4 py-3 hover:border-accent"
                  >
                    <span className="flex items-center justify-between gap-3">
                      <span className="text-lg font-bold text-accent">{v.fleetNumber}</span>
                      <VehicleStatePill state={v.state} />
                    </span>
                    <span className="text-base">
                      {v.registration ?? "No registration"} · {v.platform.make} {v.platform.model}
                    </span>
                    {v.depot && <span className="text-sm text-muted">{v.depot.name}</span>}
                  </Link>
                </li>
              ))}
            </ul>
          )}
          <Table
            label="Vehicles"
            density={mine ? "comfortable" : "compact"}
            aria-busy={isFetching || undefined}
            wrapperClassName={mine ? "hidden sm:block" : undefined}
          >
            <THead>
              {table.getHeaderGroups().map((group) => (
                <Tr key={group.id}>
                  {group.headers.map((header) => {
                    const column = header.column;
                    const sorted = column.getIsSorted();
                    return (
                      <Th
                        key={header.id}
                        numeric={NUMERIC.has(column.id)}
                        className={column.id === "select" ? "w-10" : undefined}
                        sort={
                          column.getCanSort()
                            ? sorted === "asc"
                              ? "ascending"
                              : sorted === "desc"
                                ? "descending"
                                : "none"
                            : undefined
                        }
                        onSort={column.getCanSort() ? column.getToggleSortingHandler() : undefined}
                      >
                        {flexRender(column.columnDef.header, header.getContext())}
                      </Th>
                    );
                  })}
                </Tr>
              ))}
            </THead>
            <TBody>
              {table.getRowModel().rows.map((row) => (
                <Tr key={row.id} selected={row.getIsSelected()}>
                  {row.getVisibleCells().map((cell) => (
                    <Td key={cell.id} numeric={NUMERIC.has(cell.column.id)}>
                      {flexRender(cell.column.columnDef.cell, cell.getContext())}
                    </Td>
                  ))}
                </Tr>
              ))}
            </TBody>
          </Table>
        </>
      )}

      {data && data.total > 0 && (
        <div className="flex flex-wrap items-center justify-between gap-3">
          <Pager
            page={page}
            pageCount={pageCount}
            onPage={(p) => replace({ page: String(p) })}
            size={control}
          />
          <label className="flex items-center gap-2 text-sm">
            Rows per page
            <Select
              size="sm"
              wrapperClassName="w-20"
              value={String(params.pageSize)}
              onChange={(e) => replace({ pageSize: e.target.value, page: null })}
            >
              {PAGE_SIZES.map((n) => (
                <option key={n} value={n}>
                  {n}
                </option>
              ))}
            </Select>
          </label>
        </div>
      )}
    </div>
  );
}

function Pager({
  page,
  pageCount,
  onPage,
  size,
}: {
  page: number;
  pageCount: number;
  onPage: (page: number) => void;
  size: "md" | "lg";
}) {
  if (pageCount <= 1) return <span />;
  const button = size === "lg" ? "lg" : "sm";
  return (
    <nav aria-label="Pages of the register">
      <ul className="flex flex-wrap items-center gap-1">
        <li>
          <Button
            variant="ghost"
            size={button}
            disabled={page <= 1}
            onClick={() => onPage(page - 1)}
          >
            Previous
          </Button>
        </li>
        {pageItems(page, pageCount).map((item, i) =>
          item === "gap" ? (
            <li key={`gap-${i}`} aria-hidden="true" className="px-1 text-muted">
              …
            </li>
          ) : (
            <li key={item}>
              <Button
                variant={item === page ? "primary" : "ghost"}
                size={button}
                aria-current={item === page ? "page" : undefined}
                aria-label={`Page ${item}`}
                onClick={() => onPage(item)}
              >
                {item}
              </Button>
            </li>
          ),
        )}
        <li>
          <Button
            variant="ghost"
            size={button}
            disabled={page >= pageCount}
            onClick={() => onPage(page + 1)}
          >
            Next
          </Button>
        </li>
      </ul>
    </nav>
  );
}

function ColumnChooser({ table }: { table: ReturnType<typeof useReactTable<RegisterItem>> }) {
  const hideable = table.getAllLeafColumns().filter((c) => c.getCanHide());
  return (
    <Dialog>
      <DialogTrigger asChild>
        <Button variant="secondary" size="sm">
          Columns
        </Button>
      </DialogTrigger>
      <DialogContent size="sm">
        <DialogHeader>
          <DialogTitle>Columns</DialogTitle>
          <DialogDescription>
            Choose what the register shows. The choice stays in the page address.
          </DialogDescription>
        </DialogHeader>
        <div className="grid grid-cols-1">
          {hideable.map((column) => (
            <Checkbox
              key={column.id}
              label={COLUMN_LABELS[column.id as RegisterColumn]}
              checked={column.getIsVisible()}
              onChange={(e) => column.toggleVisibility(e.target.checked)}
            />
          ))}
        </div>
      </DialogContent>
    </Dialog>
  );
}
