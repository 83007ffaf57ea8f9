import { InputError, requireFinite } from "@/lib/errors";

/** Standard metric conductor cross-sections, mm². */
export const METRIC_SIZES_MM2 = [
  0.5, 0.75, 1, 1.5, 2.5, 4, 6, 10, 16, 25, 35, 50, 70, 95, 120,
] as const;

/**
 * AWG diameter by the ASTM B258 formula: d = 0.127 × 92^((36 − n)/39) mm.
 * Gauges 1/0 … 4/0 are n = 0, −1, −2, −3.
 */
export function awgDiameterMm(gauge: number): number {
  requireFinite("gauge", gauge);
  if (!Number.isInteger(gauge) || gauge < -3 || gauge > 40) {
    throw new InputError("gauge", "gauge must be a whole AWG number from 40 down to -3 (4/0)");
  }
  return 0.127 * Math.pow(92, (36 - gauge) / 39);
}

/** Cross-section of a solid round conductor of that gauge, mm². */
export function awgAreaMm2(gauge: number): number {
  const d = awgDiameterMm(gauge);
  return (Math.PI * d * d) / 4;
}

/** How a gauge is written: 4 → "4 AWG", 0 → "1/0 AWG", −3 → "4/0 AWG". */
export function awgLabel(gauge: number): string {
  awgDiameterMm(gauge);
  return gauge <= 0 ? `${1 - gauge}/0 AWG` : `${gauge} AWG`;
}

/** AWG gauges offered for vehicle wiring, thinnest first. */
export const AWG_GAUGES = [20, 18, 16, 14, 12, 10, 8, 6, 4, 2, 1, 0, -1, -2, -3] as const;

export type SizeSeries = "metric" | "awg";

export interface ConductorSize {
  label: string;
  areaMm2: number;
}

/** The sizes of a series, thinnest first. */
export function conductorSizes(series: SizeSeries = "metric"): ConductorSize[] {
  if (series === "awg") {
    return AWG_GAUGES.map((gauge) => ({ label: awgLabel(gauge), areaMm2: awgAreaMm2(gauge) }));
  }
  if (series !== "metric") throw new InputError("sizeSeries", 'sizeSeries must be "metric" or "awg"');
  return METRIC_SIZES_MM2.map((areaMm2) => ({ label: `${areaMm2} mm²`, areaMm2 }));
}

/**
 * The thinnest size of the series at or above `minAreaMm2`, or undefined when even the
 * largest is too small. A relative tolerance of 1e-9 keeps an exact fit from being bumped up
 * by floating-point noise.
 */
export function nextSizeAtOrAbove(minAreaMm2: number, series: SizeSeries = "metric"): ConductorSize | undefined {
  requireFinite("minAreaMm2", minAreaMm2);
  return conductorSizes(series).find((size) => size.areaMm2 >= minAreaMm2 * (1 - 1e-9));
}
