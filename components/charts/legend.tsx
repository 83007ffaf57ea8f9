import type { ReactNode } from "react";

/** Legend settings shared by every chart: series in drawing order, names in ink (not in the series colour). */
export const legendProps = {
  itemSorter: null,
  wrapperStyle: { fontSize: 12 },
  formatter: (value: ReactNode) => <span style={{ color: "var(--color-ink)" }}>{value}</span>,
} as const;
