import { requireNonNegative, requirePositive } from "@/lib/errors";
import { copperResistivityOhmMm2PerM, REFERENCE_TEMPERATURE_C } from "./copper";

export interface VoltageDropInput {
  currentA: number;
  lengthOneWayM: number;
  areaMm2: number;
  systemV: number;
  /** Conductor temperature; 20 °C when not given. */
  temperatureC?: number;
}

export interface VoltageDropResult {
  /** Resistance of the whole loop (out and back), Ω. */
  loopResistanceOhm: number;
  dropV: number;
  /** Drop as a share of the system voltage, per cent. */
  dropPct: number;
}

/** Two-wire DC drop: V = I × ρ × 2L / A (the return conductor is as long as the feed). */
export function voltageDrop(input: VoltageDropInput): VoltageDropResult {
  requireNonNegative("currentA", input.currentA);
  requirePositive("lengthOneWayM", input.lengthOneWayM);
  requirePositive("areaMm2", input.areaMm2);
  requirePositive("systemV", input.systemV);
  const rho = copperResistivityOhmMm2PerM(input.temperatureC ?? REFERENCE_TEMPERATURE_C);
  const loopResistanceOhm = (rho * 2 * input.lengthOneWayM) / input.areaMm2;
  const dropV = input.currentA * loopResistanceOhm;
  return { loopResistanceOhm, dropV, dropPct: (dropV / input.systemV) * 100 };
}

/** The smallest cross-section that keeps the two-wire drop at or under `maxDropPct`: A = I ρ 2L / ΔV. */
export function minAreaForDropMm2(input: {
  currentA: number;
  lengthOneWayM: number;
  systemV: number;
  maxDropPct: number;
  temperatureC?: number;
}): number {
  requireNonNegative("currentA", input.currentA);
  requirePositive("lengthOneWayM", input.lengthOneWayM);
  requirePositive("systemV", input.systemV);
  requirePositive("maxDropPct", input.maxDropPct);
  const rho = copperResistivityOhmMm2PerM(input.temperatureC ?? REFERENCE_TEMPERATURE_C);
  const allowedDropV = (input.maxDropPct / 100) * input.systemV;
  return (input.currentA * rho * 2 * input.lengthOneWayM) / allowedDropV;
}
