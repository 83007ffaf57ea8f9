/**
 * The register's state as it lives in the URL: page, sort, filters, search and chosen columns.
 * Pure (no React), so the page, the API call and the column chooser read it the same way.
 */

export const REGISTER_SORTS = ["fleetNumber", "registration", "platform", "depot", "state", "odometerKm", "updatedAt"] as const;
export type RegisterSort = (typeof REGISTER_SORTS)[number];

export const REGISTER_FILTERS = ["depotId", "platformId", "state", "editionId", "standardId", "variance", "readiness"] as const;
export type RegisterFilter = (typeof REGISTER_FILTERS)[number];

/** Every column the register can show, in display order; fleet number is always shown. */
export const REGISTER_COLUMNS = [
  "fleetNumber",
  "registration",
  "vin",
  "platform",
  "depot",
  "state",
  "variance",
  "standard",
  "odometerKm",
  "costCentre",
  "drivers",
  "registrationExpiry",
  "buildYear",
  "updatedAt",
] as const;
export type RegisterColumn = (typeof REGISTER_COLUMNS)[number];

export const DEFAULT_COLUMNS: readonly RegisterColumn[] = ["fleetNumber", "registration", "platform", "depot", "state", "variance", "odometerKm"];
/** Drivers and contractors do not work with standards or cost centres; they see fewer columns. */
export const FIELD_COLUMNS: readonly RegisterColumn[] = ["fleetNumber", "registration", "platform", "depot", "state"];

export const PAGE_SIZES = [10, 25, 50, 100] as const;
export const DEFAULT_PAGE_SIZE = 25;

export type RegisterParams = {
  page: number;
  pageSize: number;
  sort: RegisterSort;
  dir: "asc" | "desc";
  q: string;
  filters: Partial<Record<RegisterFilter, string>>;
  columns: RegisterColumn[];
};

type Readable = { get(name: string): string | null };

const positiveInt = (text: string | null, fallback: number) => {
  const n = Number(text);
  return Number.isInteger(n) && n >= 1 ? n : fallback;
};

/** Reads the register's state from URL search params; anything unknown falls back to the default. */
export function readRegisterParams(search: Readable, defaults: readonly RegisterColumn[] = DEFAULT_COLUMNS): RegisterParams {
  const sort = search.get("sort");
  const pageSize = positiveInt(search.get("pageSize"), DEFAULT_PAGE_SIZE);
  const filters: Partial<Record<RegisterFilter, string>> = {};
  for (const f of REGISTER_FILTERS) {
    const v = search.get(f);
    if (v) filters[f] = v;
  }
  const cols = search.get("cols");
  const chosen = cols === null ? [...defaults] : cols.split(",").filter((c): c is RegisterColumn => (REGISTER_COLUMNS as readonly string[]).includes(c));
  const columns = REGISTER_COLUMNS.filter((c) => c === "fleetNumber" || chosen.includes(c));
  return {
    page: positiveInt(search.get("page"), 1),
    pageSize: (PAGE_SIZES as readonly number[]).includes(pageSize) ? pageSize : DEFAULT_PAGE_SIZE,
    sort: (REGISTER_SORTS as readonly string[]).includes(sort ?? "") ? (sort as RegisterSort) : "fleetNumber",
    dir: search.get("dir") === "desc" ? "desc" : "asc",
    q: search.get("q") ?? "",
    filters,
    columns,
  };
}

/** The query string of GET /api/vehicles for these params (columns are the page's business, not the API's). */
export function apiQuery(p: RegisterParams): string {
  const out = new URLSearchParams();
  out.set("page", String(p.page));
  out.set("pageSize", String(p.pageSize));
  out.set("sort", p.sort);
  out.set("dir", p.dir);
  for (const f of REGISTER_FILTERS) {
    const v = p.filters[f];
    if (v) out.set(f, v);
  }
  if (p.q.trim()) out.set("q", p.q.trim());
  return out.toString();
}

/**
 * The page's own query string after a change: defaults are left out so a plain /vehicles stays
 * plain. `null` or "" removes a parameter.
 */
export function withChanges(current: string, changes: Record<string, string | null>, defaults: readonly RegisterColumn[] = DEFAULT_COLUMNS): string {
  const next = new URLSearchParams(current);
  for (const [key, value] of Object.entries(changes)) {
    if (value === null || value === "") next.delete(key);
    else next.set(key, value);
  }
  if (next.get("page") === "1") next.delete("page");
  if (next.get("pageSize") === String(DEFAULT_PAGE_SIZE)) next.delete("pageSize");
  if (next.get("sort") === "fleetNumber") next.delete("sort");
  if (next.get("dir") === "asc") next.delete("dir");
  if (next.get("cols") === columnsParam(defaults)) next.delete("cols");
  return next.toString();
}

export function columnsParam(columns: readonly RegisterColumn[]): string {
  return REGISTER_COLUMNS.filter((c) => columns.includes(c)).join(",");
}

export function hasFilters(p: RegisterParams): boolean {
  return p.q.trim() !== "" || Object.keys(p.filters).length > 0;
}
