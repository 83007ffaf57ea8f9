import { InputError, requireFinite, requireNonNegative, requirePositive } from "../errors";
import { fmt, worstSeverity, type Finding } from "./findings";
import type { RuleSet } from "./ruleSet";

export interface LiftCheckInput {
  /** Suspension ride-height increase. */
  suspensionLiftMm: number;
  /** New tyre diameter minus the largest diameter the maker specifies (negative = smaller). */
  tyreDiameterIncreaseMm: number;
  /** The suspension travel as built, for the "share of travel" limit. */
  originalTravelMm?: number;
  /** Diameter of the largest tyre the maker specifies, for a percentage diameter limit. */
  baseTyreDiameterMm?: number;
  /** How much wider the wheel track is than the maker's maximum. */
  wheelTrackIncreaseMm?: number;
  wheelSpacersFitted?: boolean;
}

export interface LiftCheckResult {
  ruleSetId: string;
  ruleSetName: string;
  note: string;
  suspensionLiftMm: number;
  /** Lift from tyres: half the diameter increase (the axle rises by the change in radius). */
  tyreLiftMm: number;
  combinedLiftMm: number;
  /** True when some limit without certification is exceeded. */
  needsCertification: boolean;
  /** False when the lift is above the most the rule set allows even with certification. */
  certifiable: boolean;
  findings: Finding[];
}

// Limits are compared with a small allowance so that 50.000000001 mm from float arithmetic
// does not fail a 50 mm limit.
const EPS = 1e-9;

function share(fraction: number): string {
  if (Math.abs(fraction - 1 / 3) < 1e-6) return "a third";
  if (Math.abs(fraction - 1 / 2) < 1e-6) return "half";
  if (Math.abs(fraction - 1 / 4) < 1e-6) return "a quarter";
  return `${fmt(fraction * 100, 1)} %`;
}

/** Tyre lift: the axle centre rises by the change in rolling radius, half the diameter change. */
export function tyreLiftMm(tyreDiameterIncreaseMm: number): number {
  return requireFinite("tyreDiameterIncreaseMm", tyreDiameterIncreaseMm) / 2;
}

/** Checks the tyre diameter increase against the rule set's mm and % limits. */
export function tyreDiameterFindings(
  input: { tyreDiameterIncreaseMm: number; baseTyreDiameterMm?: number },
  rules: RuleSet,
): Finding[] {
  const inc = requireFinite("tyreDiameterIncreaseMm", input.tyreDiameterIncreaseMm);
  if (input.baseTyreDiameterMm !== undefined) requirePositive("baseTyreDiameterMm", input.baseTyreDiameterMm);
  const out: Finding[] = [];
  if (rules.tyreDiameterIncreaseMaxMm !== undefined) {
    const max = rules.tyreDiameterIncreaseMaxMm;
    out.push(
      inc <= max + EPS
        ? {
            code: "tyre-diameter-mm",
            severity: "ok",
            message: `Tyre diameter increase ${fmt(inc, 1)} mm is within the ${fmt(max)} mm limit.`,
          }
        : {
            code: "tyre-diameter-mm",
            severity: "exceeds",
            message: `Tyre diameter increase ${fmt(inc, 1)} mm is above the ${fmt(max)} mm limit without certification.`,
          },
    );
  }
  if (rules.tyreDiameterIncreaseMaxPct !== undefined) {
    const max = rules.tyreDiameterIncreaseMaxPct;
    if (input.baseTyreDiameterMm === undefined) {
      out.push({
        code: "tyre-diameter-pct",
        severity: "check",
        message: `The largest tyre the maker specifies is not known: the increase must be no more than ${fmt(max, 1)} % of its diameter.`,
      });
    } else {
      const pct = (inc / input.baseTyreDiameterMm) * 100;
      out.push(
        pct <= max + EPS
          ? {
              code: "tyre-diameter-pct",
              severity: "ok",
              message: `Tyre diameter increase ${fmt(pct, 2)} % is within the ${fmt(max, 1)} % limit.`,
            }
          : {
              code: "tyre-diameter-pct",
              severity: "exceeds",
              message: `Tyre diameter increase ${fmt(pct, 2)} % is above the ${fmt(max, 1)} % limit without certification.`,
            },
      );
    }
  }
  return out;
}

/**
 * Lift check against a rule set: tyre lift is half the diameter increase, combined lift is
 * suspension lift plus tyre lift, and each limit gives a finding.
 */
export function liftCheck(input: LiftCheckInput, rules: RuleSet): LiftCheckResult {
  const susp = requireNonNegative("suspensionLiftMm", input.suspensionLiftMm);
  const tyreLift = tyreLiftMm(input.tyreDiameterIncreaseMm);
  if (input.originalTravelMm !== undefined) requirePositive("originalTravelMm", input.originalTravelMm);
  if (input.wheelTrackIncreaseMm !== undefined) requireFinite("wheelTrackIncreaseMm", input.wheelTrackIncreaseMm);
  if (input.wheelSpacersFitted !== undefined && typeof input.wheelSpacersFitted !== "boolean") {
    throw new InputError("wheelSpacersFitted", "wheelSpacersFitted must be true or false");
  }
  const combined = susp + tyreLift;
  const findings: Finding[] = [];

  findings.push(
    susp <= rules.suspensionLiftMaxMm + EPS
      ? {
          code: "suspension-lift",
          severity: "ok",
          message: `Suspension lift ${fmt(susp)} mm is within the ${fmt(rules.suspensionLiftMaxMm)} mm limit.`,
        }
      : {
          code: "suspension-lift",
          severity: "exceeds",
          message: `Suspension lift ${fmt(susp)} mm is above the ${fmt(rules.suspensionLiftMaxMm)} mm limit without certification.`,
        },
  );

  const travelShare = share(rules.suspensionLiftMaxTravelFraction);
  if (input.originalTravelMm !== undefined) {
    const max = rules.suspensionLiftMaxTravelFraction * input.originalTravelMm;
    findings.push(
      susp <= max + EPS
        ? {
            code: "suspension-travel",
            severity: "ok",
            message: `Suspension lift is within ${travelShare} of the original ${fmt(input.originalTravelMm)} mm travel (${fmt(max)} mm).`,
          }
        : {
            code: "suspension-travel",
            severity: "exceeds",
            message: `Suspension lift is more than ${travelShare} of the original ${fmt(input.originalTravelMm)} mm travel (${fmt(max)} mm).`,
          },
    );
  } else if (susp > 0) {
    findings.push({
      code: "suspension-travel",
      severity: "check",
      message: `Original suspension travel not given: the lift must also be no more than ${travelShare} of it.`,
    });
  }

  findings.push(...tyreDiameterFindings(input, rules));

  findings.push(
    tyreLift <= rules.tyreLiftShareMaxMm + EPS
      ? {
          code: "tyre-lift",
          severity: "ok",
          message: `Lift from tyres ${fmt(tyreLift, 1)} mm is within the ${fmt(rules.tyreLiftShareMaxMm)} mm share allowed to tyres.`,
        }
      : {
          code: "tyre-lift",
          severity: "exceeds",
          message: `Lift from tyres ${fmt(tyreLift, 1)} mm is above the ${fmt(rules.tyreLiftShareMaxMm)} mm share allowed to tyres.`,
        },
  );

  const withinCombined = combined <= rules.combinedLiftMaxMm + EPS;
  findings.push(
    withinCombined
      ? {
          code: "combined-lift",
          severity: "ok",
          message: `Combined lift ${fmt(combined, 1)} mm is within the ${fmt(rules.combinedLiftMaxMm)} mm limit without certification.`,
        }
      : {
          code: "combined-lift",
          severity: "exceeds",
          message: `Combined lift ${fmt(combined, 1)} mm is above the ${fmt(rules.combinedLiftMaxMm)} mm limit: it needs certification by a licensed vehicle engineer.`,
        },
  );

  let certifiable = true;
  if (rules.maxCertifiedLiftMm !== undefined && combined > rules.maxCertifiedLiftMm + EPS) {
    certifiable = false;
    findings.push({
      code: "certified-lift",
      severity: "exceeds",
      message: `Combined lift ${fmt(combined, 1)} mm is above the ${fmt(rules.maxCertifiedLiftMm)} mm that can be certified at all.`,
    });
  }

  if (input.wheelTrackIncreaseMm !== undefined) {
    findings.push(
      input.wheelTrackIncreaseMm <= rules.wheelTrackIncreaseMaxMm + EPS
        ? {
            code: "wheel-track",
            severity: "ok",
            message: `Wheel track ${fmt(input.wheelTrackIncreaseMm)} mm wider than the maker's maximum is within the ${fmt(rules.wheelTrackIncreaseMaxMm)} mm limit.`,
          }
        : {
            code: "wheel-track",
            severity: "exceeds",
            message: `Wheel track ${fmt(input.wheelTrackIncreaseMm)} mm wider than the maker's maximum is above the ${fmt(rules.wheelTrackIncreaseMaxMm)} mm limit: it needs approval.`,
          },
    );
  }
  if (input.wheelSpacersFitted) {
    findings.push({
      code: "wheel-spacers",
      severity: "exceeds",
      message: "Wheel spacers are fitted: they need approval.",
    });
  }

  return {
    ruleSetId: rules.id,
    ruleSetName: rules.name,
    note: rules.note,
    suspensionLiftMm: susp,
    tyreLiftMm: tyreLift,
    combinedLiftMm: combined,
    needsCertification: worstSeverity(findings) === "exceeds",
    certifiable,
    findings,
  };
}
