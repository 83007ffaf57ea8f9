/** The ledger's filters as they travel in the URL (plain strings; "" or absent means any). */
export const FILTER_KEYS = ["from", "to", "costCentre", "depotId", "vehicleId", "category", "kind", "source"] as const;
export type FilterKey = (typeof FILTER_KEYS)[number];
export type FilterValues = Partial<Record<FilterKey, string>>;

/** First value of each known filter from a page's searchParams. */
export function filterValues(params: Record<string, string | string[] | undefined>): FilterValues {
  const out: FilterValues = {};
  for (const key of FILTER_KEYS) {
    const value = params[key];
    const first = Array.isArray(value) ? value[0] : value;
    if (first) out[key] = first;
  }
  return out;
}

/** A query string of the filters that are set, with extra values added or replaced. */
export function filterQuery(values: FilterValues, extra: Record<string, string | number | undefined> = {}): string {
  const query = new URLSearchParams();
  for (const key of FILTER_KEYS) if (values[key]) query.set(key, values[key]!);
  for (const [key, value] of Object.entries(extra)) if (value !== undefined && value !== "") query.set(key, String(value));
  const text = query.toString();
  return text ? `?${text}` : "";
}
