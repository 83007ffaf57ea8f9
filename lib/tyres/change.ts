import { InputError, requireFinite, requireNonNegative, requirePositive } from "../errors";
import { liftCheck, worstSeverity, type Finding, type LiftCheckResult, type RuleSet, type Severity } from "../rules";
import { isKnownLoadIndex, LOAD_INDEX_KG, SPEED_SYMBOL_KMH } from "./loadIndex";
import { parseTyreSize, type TyreSize } from "./size";
import { speedometerRows, type SpeedometerRow } from "./speedometer";

export interface TyreChangeInput {
  /** The size fitted now. */
  from: string;
  /** The size proposed. */
  to: string;
  /** How far the speedometer read high on the old tyres, % of indicated (see speedometerRows). */
  speedoReadsHighPct?: number;
  /** Indicated speeds to tabulate (default 40, 60, 80, 100, 110, 130). */
  speedsKmh?: number[];
  /** The vehicle's top speed, for the speed symbol check. */
  topSpeedKmh?: number;
  /** Axle ratings to check the new tyres' load capacity against. */
  axleRatings?: { frontKg: number; rearKg: number };
  /** Tyres on the rear axle: 2, or 4 for dual wheels (then the dual load index applies). */
  rearTyreCount?: 2 | 4;
  /** Jurisdiction limits on diameter increase and lift. */
  rules?: RuleSet;
  /** Suspension lift fitted with the tyres, for the combined lift check (default 0). */
  suspensionLiftMm?: number;
  originalTravelMm?: number;
  /** The largest tyre the maker specifies: the base for diameter limits (default: `from`). */
  makerLargestSize?: string;
}

export interface AxleTyreCapacity {
  axle: "front" | "rear";
  tyres: number;
  loadIndex: number;
  perTyreKg: number;
  capacityKg: number;
  ratingKg: number;
  headroomKg: number;
  ok: boolean;
}

export interface TyreChangeResult {
  from: TyreSize;
  to: TyreSize;
  oldDiameterMm: number;
  newDiameterMm: number;
  diameterChangeMm: number;
  diameterChangePct: number;
  /** New diameter ÷ old diameter: the factor by which true speed rises at the same indication. */
  diameterRatio: number;
  /** Ground clearance gained under the axles: half the diameter change. */
  clearanceGainedMm: number;
  speedometer: SpeedometerRow[];
  axleCapacity: AxleTyreCapacity[];
  lift?: LiftCheckResult;
  findings: Finding[];
  worst: Severity;
}

const f0 = (x: number) => (Math.round(x) === 0 ? 0 : Math.round(x)).toString();
const f1 = (x: number) => (Math.abs(x) < 0.05 ? "0.0" : x.toFixed(1));
const f2 = (x: number) => (Math.abs(x) < 0.005 ? "0.00" : x.toFixed(2));

function speedoFinding(rows: SpeedometerRow[], readsHighGiven: boolean): Finding {
  const low = rows.find((r) => r.readsHighKmh < -1e-9);
  const assumption = readsHighGiven
    ? ""
    : " This assumes the speedometer was exact on the old tyres; give how far it read high to refine it.";
  if (low) {
    return {
      code: "speedometer",
      severity: "exceeds",
      message:
        `On the new tyres the speedometer reads low: at ${f0(low.indicatedKmh)} km/h indicated the true speed is ` +
        `${f1(low.trueNewKmh)} km/h. A speedometer may read high but never low: have it recalibrated.${assumption}`,
    };
  }
  const high = rows.find((r) => !r.compliant);
  if (high) {
    return {
      code: "speedometer",
      severity: "exceeds",
      message:
        `On the new tyres the speedometer reads too high: at ${f0(high.indicatedKmh)} km/h indicated the true speed is ` +
        `${f1(high.trueNewKmh)} km/h, more than the allowed ${f1(high.allowedHighKmh)} km/h over. Have it recalibrated.`,
    };
  }
  const most = Math.max(...rows.map((r) => r.readsHighKmh));
  return {
    code: "speedometer",
    severity: "ok",
    message: `Speedometer stays within the accuracy rule at every speed checked (reads high by up to ${f1(most)} km/h).${assumption}`,
  };
}

function capacityFor(
  axle: "front" | "rear",
  tyres: number,
  size: TyreSize,
  ratingKg: number,
  findings: Finding[],
): AxleTyreCapacity | undefined {
  const index = tyres === 4 ? size.loadIndexDual : size.loadIndexSingle;
  const which = tyres === 4 ? "dual" : "single";
  if (index === undefined) {
    findings.push({
      code: `load-${axle}`,
      severity: "check",
      message: `The new size gives no ${which} load index: check the tyres carry the ${f0(ratingKg)} kg ${axle} axle rating.`,
    });
    return undefined;
  }
  if (!isKnownLoadIndex(index)) {
    findings.push({
      code: `load-${axle}`,
      severity: "check",
      message: `Load index ${index} is outside the table Rigline carries: check its load against the ${f0(ratingKg)} kg ${axle} axle rating.`,
    });
    return undefined;
  }
  const perTyreKg = LOAD_INDEX_KG[index] ?? 0;
  const capacityKg = perTyreKg * tyres;
  const ok = capacityKg >= ratingKg;
  findings.push({
    code: `load-${axle}`,
    severity: ok ? "ok" : "exceeds",
    message: ok
      ? `${axle === "front" ? "Front" : "Rear"} tyres carry ${f0(capacityKg)} kg (${tyres} × ${f0(perTyreKg)} kg, load index ${index}), at least the ${f0(ratingKg)} kg axle rating.`
      : `${axle === "front" ? "Front" : "Rear"} tyres carry only ${f0(capacityKg)} kg (${tyres} × ${f0(perTyreKg)} kg, load index ${index}), less than the ${f0(ratingKg)} kg axle rating.`,
  });
  return { axle, tyres, loadIndex: index, perTyreKg, capacityKg, ratingKg, headroomKg: capacityKg - ratingKg, ok };
}

/**
 * What a tyre change does: diameters and their change, clearance gained, speedometer error at
 * common speeds against the accuracy rule, load and speed adequacy, and a rule set's limits.
 */
export function tyreChange(input: TyreChangeInput): TyreChangeResult {
  const from = parseTyreSize(input.from, "from");
  const to = parseTyreSize(input.to, "to");
  if (input.topSpeedKmh !== undefined) requirePositive("topSpeedKmh", input.topSpeedKmh);
  if (input.suspensionLiftMm !== undefined) requireNonNegative("suspensionLiftMm", input.suspensionLiftMm);
  const rearTyres = input.rearTyreCount ?? 2;
  if (rearTyres !== 2 && rearTyres !== 4) throw new InputError("rearTyreCount", "rearTyreCount must be 2 or 4");

  const oldD = from.overallDiameterMm;
  const newD = to.overallDiameterMm;
  const changeMm = newD - oldD;
  const ratio = newD / oldD;
  const findings: Finding[] = [];

  findings.push({
    code: "diameter",
    severity: "ok",
    message:
      changeMm === 0
        ? `Same overall diameter (${f1(newD)} mm).`
        : `Overall diameter ${f1(oldD)} → ${f1(newD)} mm (${changeMm > 0 ? "+" : ""}${f1(changeMm)} mm, ` +
          `${changeMm > 0 ? "+" : ""}${f2((ratio - 1) * 100)} %); ground clearance ${changeMm > 0 ? "rises" : "falls"} by ${f1(Math.abs(changeMm / 2))} mm.`,
  });

  const speedometer = speedometerRows({
    diameterRatio: ratio,
    speedoReadsHighPct: input.speedoReadsHighPct,
    speedsKmh: input.speedsKmh,
  });
  findings.push(speedoFinding(speedometer, input.speedoReadsHighPct !== undefined));

  const axleCapacity: AxleTyreCapacity[] = [];
  if (input.axleRatings) {
    const front = requirePositive("axleRatings.frontKg", input.axleRatings.frontKg);
    const rear = requirePositive("axleRatings.rearKg", input.axleRatings.rearKg);
    const a = capacityFor("front", 2, to, front, findings);
    const b = capacityFor("rear", rearTyres, to, rear, findings);
    if (a) axleCapacity.push(a);
    if (b) axleCapacity.push(b);
  }
  if (from.loadIndexSingle !== undefined && to.loadIndexSingle !== undefined && to.loadIndexSingle < from.loadIndexSingle) {
    findings.push({
      code: "load-index-lower",
      severity: "check",
      message: `The new tyres have a lower load index than the old (${to.loadIndexSingle} against ${from.loadIndexSingle}).`,
    });
  }
  if ((from.service === "LT") !== (to.service === "LT")) {
    findings.push({
      code: "load-construction",
      severity: "check",
      message: "One size is a light-truck (LT) tyre and the other is not: their load ratings can differ even at the same size, so compare the load indexes.",
    });
  }

  if (to.speedSymbol === undefined) {
    findings.push({
      code: "speed-symbol",
      severity: "check",
      message: "The new size gives no speed symbol: check it is rated for the vehicle's top speed.",
    });
  } else {
    const newKmh = SPEED_SYMBOL_KMH[to.speedSymbol];
    if (input.topSpeedKmh !== undefined) {
      const ok = newKmh >= input.topSpeedKmh;
      findings.push({
        code: "speed-symbol",
        severity: ok ? "ok" : "exceeds",
        message: ok
          ? `Speed symbol ${to.speedSymbol} (${newKmh} km/h) covers the ${f0(input.topSpeedKmh)} km/h top speed.`
          : `Speed symbol ${to.speedSymbol} (${newKmh} km/h) is below the ${f0(input.topSpeedKmh)} km/h top speed.`,
      });
    } else if (from.speedSymbol !== undefined && newKmh < SPEED_SYMBOL_KMH[from.speedSymbol]) {
      findings.push({
        code: "speed-symbol",
        severity: "check",
        message: `Speed symbol ${to.speedSymbol} (${newKmh} km/h) is lower than the old ${from.speedSymbol} (${SPEED_SYMBOL_KMH[from.speedSymbol]} km/h): check it covers the top speed.`,
      });
    } else {
      findings.push({
        code: "speed-symbol",
        severity: "ok",
        message: `Speed symbol ${to.speedSymbol} (${newKmh} km/h)${from.speedSymbol ? ` is no lower than the old ${from.speedSymbol}` : ""}.`,
      });
    }
  }

  let lift: LiftCheckResult | undefined;
  if (input.rules) {
    const base = input.makerLargestSize === undefined ? from : parseTyreSize(input.makerLargestSize, "makerLargestSize");
    if (input.makerLargestSize === undefined) {
      findings.push({
        code: "diameter-base",
        severity: "check",
        message: "Diameter limits count from the largest tyre the maker specifies; the old size was used for that here.",
      });
    }
    lift = liftCheck(
      {
        suspensionLiftMm: input.suspensionLiftMm ?? 0,
        tyreDiameterIncreaseMm: requireFinite("to", newD - base.overallDiameterMm),
        baseTyreDiameterMm: base.overallDiameterMm,
        ...(input.originalTravelMm === undefined ? {} : { originalTravelMm: input.originalTravelMm }),
      },
      input.rules,
    );
    findings.push(...lift.findings);
  }

  return {
    from,
    to,
    oldDiameterMm: oldD,
    newDiameterMm: newD,
    diameterChangeMm: changeMm,
    diameterChangePct: (ratio - 1) * 100,
    diameterRatio: ratio,
    clearanceGainedMm: changeMm / 2,
    speedometer,
    axleCapacity,
    ...(lift ? { lift } : {}),
    findings,
    worst: worstSeverity(findings),
  };
}
