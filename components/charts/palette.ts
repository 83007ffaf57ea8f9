/**
 * Series styles for charts, from Rigline's palette tokens. Neighbouring series differ in
 * lightness as well as hue, and every second one carries a stripe pattern, so series stay apart
 * for colour-blind readers and in greyscale print; legends and the table view name each one.
 */
export type SeriesStyle = { color: string; pattern: "solid" | "stripes" | "dots" };

export const SERIES: readonly SeriesStyle[] = [
  { color: "var(--color-night-700)", pattern: "solid" },
  { color: "var(--color-spinifex-400)", pattern: "solid" },
  { color: "var(--color-earth-600)", pattern: "stripes" },
  { color: "var(--color-saltbush-300)", pattern: "solid" },
  { color: "var(--color-night-400)", pattern: "stripes" },
  { color: "var(--color-earth-300)", pattern: "solid" },
  { color: "var(--color-saltbush-700)", pattern: "stripes" },
  { color: "var(--color-sand-400)", pattern: "dots" },
  { color: "var(--color-spinifex-700)", pattern: "stripes" },
  { color: "var(--color-night-200)", pattern: "dots" },
  { color: "var(--color-earth-800)", pattern: "solid" },
  { color: "var(--color-saltbush-500)", pattern: "dots" },
];

export function seriesStyle(index: number): SeriesStyle {
  return SERIES[index % SERIES.length]!;
}

/** The SVG fill for a series: its colour, or the pattern drawn over it. */
export function seriesFill(chartId: string, index: number): string {
  const style = seriesStyle(index);
  return style.pattern === "solid" ? style.color : `url(#${chartId}-p${index})`;
}

/** Tones with a fixed meaning in every chart. */
export const TONES = {
  good: "var(--color-saltbush-600)",
  caution: "var(--color-spinifex-400)",
  bad: "var(--color-earth-600)",
  plan: "var(--color-night-300)",
  ink: "var(--color-night-900)",
  grid: "var(--color-sand-200)",
  muted: "var(--color-sand-700)",
} as const;
