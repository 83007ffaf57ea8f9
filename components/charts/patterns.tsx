import { SERIES } from "./palette";

/** Pattern fills for the striped and dotted series (place inside the chart's <svg>). */
export function SeriesPatterns({ chartId, count }: { chartId: string; count: number }) {
  return (
    <defs>
      {SERIES.slice(0, count).map((style, index) =>
        style.pattern === "solid" ? null : (
          <pattern key={index} id={`${chartId}-p${index}`} width="6" height="6" patternUnits="userSpaceOnUse" patternTransform={style.pattern === "stripes" ? "rotate(45)" : undefined}>
            <rect width="6" height="6" fill={style.color} />
            {style.pattern === "stripes" ? <rect width="2" height="6" fill="white" fillOpacity="0.55" /> : <circle cx="3" cy="3" r="1.2" fill="white" fillOpacity="0.7" />}
          </pattern>
        ),
      )}
    </defs>
  );
}

/** One swatch as the legend and table show it: the series' fill in a small square. */
export function Swatch({ chartId, index, fill }: { chartId: string; index: number; fill: string }) {
  const style = SERIES[index % SERIES.length]!;
  return (
    <svg width="14" height="14" viewBox="0 0 14 14" aria-hidden="true" focusable="false" className="shrink-0 rounded-sm border border-line-strong">
      {style.pattern !== "solid" && (
        <defs>
          <pattern id={`${chartId}-sw${index}`} width="6" height="6" patternUnits="userSpaceOnUse" patternTransform={style.pattern === "stripes" ? "rotate(45)" : undefined}>
            <rect width="6" height="6" fill={style.color} />
            {style.pattern === "stripes" ? <rect width="2" height="6" fill="white" fillOpacity="0.55" /> : <circle cx="3" cy="3" r="1.2" fill="white" fillOpacity="0.7" />}
          </pattern>
        </defs>
      )}
      <rect width="14" height="14" fill={style.pattern === "solid" ? fill : `url(#${chartId}-sw${index})`} />
    </svg>
  );
}
