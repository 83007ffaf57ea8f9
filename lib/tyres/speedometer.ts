import { InputError, requireFinite, requirePositive } from "../errors";

// Speedometer accuracy (UN Regulation 39 ¶5.3, as adopted for light vehicles):
//   0 ≤ V1 − V2 ≤ 0.1 × V2 + 4 km/h, V1 indicated, V2 true. It may read high, never low.
const EPS = 1e-9;

/** True when a speedometer showing `indicatedKmh` at a true `trueKmh` meets the accuracy rule. */
export function speedometerCompliant(indicatedKmh: number, trueKmh: number): boolean {
  requireFinite("indicatedKmh", indicatedKmh);
  requireFinite("trueKmh", trueKmh);
  const over = indicatedKmh - trueKmh;
  return over >= -EPS && over <= 0.1 * trueKmh + 4 + EPS;
}

/** The indicated speeds allowed at a true speed. */
export function allowedIndicatedRangeKmh(trueKmh: number): { minKmh: number; maxKmh: number } {
  requirePositive("trueKmh", trueKmh);
  return { minKmh: trueKmh, maxKmh: 1.1 * trueKmh + 4 };
}

/** The true speeds a compliant speedometer can be showing at an indicated speed. */
export function trueSpeedRangeForIndicatedKmh(indicatedKmh: number): { minKmh: number; maxKmh: number } {
  requirePositive("indicatedKmh", indicatedKmh);
  return { minKmh: Math.max(0, (indicatedKmh - 4) / 1.1), maxKmh: indicatedKmh };
}

export interface SpeedometerRow {
  indicatedKmh: number;
  /** True speed at this indication on the old tyres. */
  trueOldKmh: number;
  /** True speed at this indication on the new tyres (the wheel turns at the same rate). */
  trueNewKmh: number;
  /** V1 − V2 on the new tyres: negative means it reads low. */
  readsHighKmh: number;
  /** Most it may read high at that true speed: 0.1 × V2 + 4. */
  allowedHighKmh: number;
  compliantOld: boolean;
  compliant: boolean;
}

export const DEFAULT_SPEEDS_KMH: readonly number[] = Object.freeze([40, 60, 80, 100, 110, 130]);

/**
 * Speedometer rows after a tyre change. `speedoReadsHighPct` is how far the speedometer read above
 * the true speed on the old tyres, as a share of the indicated speed (reading 100 at a true 95 is
 * 5 %). The speedometer counts wheel turns, so the true speed scales with the diameter ratio.
 */
export function speedometerRows(input: {
  diameterRatio: number;
  speedoReadsHighPct?: number;
  speedsKmh?: readonly number[];
}): SpeedometerRow[] {
  const ratio = requirePositive("diameterRatio", input.diameterRatio);
  const pct = input.speedoReadsHighPct ?? 0;
  requireFinite("speedoReadsHighPct", pct);
  if (pct < -20 || pct > 50) {
    throw new InputError("speedoReadsHighPct", "speedoReadsHighPct must be between -20 and 50 (% of the indicated speed)");
  }
  const speeds = input.speedsKmh ?? DEFAULT_SPEEDS_KMH;
  if (!Array.isArray(speeds) || speeds.length === 0 || speeds.length > 30) {
    throw new InputError("speedsKmh", "speedsKmh must list 1 to 30 indicated speeds");
  }
  return speeds.map((v1, i) => {
    const field = `speedsKmh.${i}`;
    requirePositive(field, v1);
    if (v1 > 400) throw new InputError(field, `${field} must be at most 400 km/h`);
    const trueOld = v1 * (1 - pct / 100);
    const trueNew = trueOld * ratio;
    return {
      indicatedKmh: v1,
      trueOldKmh: trueOld,
      trueNewKmh: trueNew,
      readsHighKmh: v1 - trueNew,
      allowedHighKmh: 0.1 * trueNew + 4,
      compliantOld: speedometerCompliant(v1, trueOld),
      compliant: speedometerCompliant(v1, trueNew),
    };
  });
}
