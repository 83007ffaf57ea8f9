import type { VehicleVariance } from "@/lib/variance";
import { CRITICAL_CATEGORIES, DEFAULT_SOON_DAYS, type ExpiringItem, type ReadinessState, type TripReadinessInput, type VehicleState } from "./readiness";

/**
 * Trip readiness in brief: only what decides the state (ready, limited, not ready), without the
 * reasons. The rules are tripReadiness's own (see readiness.ts): the state turns on the most
 * severe finding, so a handful of counts and the earliest expiry are enough. Fleet counts and
 * the register's readiness filter judge thousands of vehicles from these few facts, read from
 * the variance summaries instead of every line; one vehicle's page keeps the full judgement.
 */
export type ReadinessFacts = {
  vehicleState: VehicleState;
  /** Open defects of severity "stop". */
  stopDefects: number;
  /** Open defects of severity "before_next_trip". */
  beforeTripDefects: number;
  /** Short or off-spec lines in the critical categories. */
  criticalGaps: number;
  /** Short, off-spec or unproven lines and must-not-fit items fitted (critical ones included). */
  limitingLines: number;
  /** The earliest expiry among everything on the vehicle that expires (null: nothing does). */
  earliestExpiry: Date | null;
};

const DAY_MS = 86_400_000;

/** Short or off-spec lines in the categories whose gaps keep a vehicle at the depot. */
export function criticalGapCount(variance: VehicleVariance | null | undefined): number {
  if (!variance) return 0;
  let n = 0;
  for (const line of variance.lines) if ((line.status === "short" || line.status === "off_spec") && CRITICAL_CATEGORIES.has(line.category)) n++;
  return n;
}

/** The earliest of the items' expiry dates, or null for none. */
export function earliestExpiry(items: readonly ExpiringItem[]): Date | null {
  let earliest: Date | null = null;
  for (const item of items) if (earliest === null || item.expiresAt.getTime() < earliest.getTime()) earliest = item.expiresAt;
  return earliest;
}

/** The facts of a full readiness input (what the summaries store, computed from the full input). */
export function readinessFactsOf(input: TripReadinessInput): ReadinessFacts {
  const summary = input.variance?.summary;
  return {
    vehicleState: input.vehicleState,
    stopDefects: input.openDefects.filter((d) => d.severity === "stop").length,
    beforeTripDefects: input.openDefects.filter((d) => d.severity === "before_next_trip").length,
    criticalGaps: criticalGapCount(input.variance),
    limitingLines: summary ? summary.short + summary.offSpec + summary.unproven + summary.prohibitedFitted : 0,
    earliestExpiry: earliestExpiry(input.expiringItems),
  };
}

/**
 * The first instant after `now` at which time alone could turn the state: the earliest expiry
 * coming within the look-ahead, or passing. Null when nothing is due.
 */
export function nextReadinessChange(facts: Pick<ReadinessFacts, "earliestExpiry">, now: Date, soonDays = DEFAULT_SOON_DAYS): number | null {
  if (facts.earliestExpiry === null) return null;
  const expiry = facts.earliestExpiry.getTime();
  const nowMs = now.getTime();
  // readinessStateOf: limited once leftMs <= soonDays, not ready once leftMs <= 0; the state
  // turns at the first millisecond each holds.
  for (const at of [expiry - soonDays * DAY_MS, expiry]) if (at > nowMs) return at;
  return null;
}

/** The readiness state from its facts at `now`: the same state tripReadiness gives. */
export function readinessStateOf(facts: ReadinessFacts, now: Date, soonDays = DEFAULT_SOON_DAYS): ReadinessState {
  const leftMs = facts.earliestExpiry === null ? Infinity : facts.earliestExpiry.getTime() - now.getTime();
  if (facts.vehicleState === "grounded" || facts.vehicleState === "retired" || facts.stopDefects > 0 || facts.criticalGaps > 0 || leftMs <= 0) {
    return "not_ready";
  }
  if (facts.vehicleState === "in_fitout" || facts.beforeTripDefects > 0 || facts.limitingLines > 0 || leftMs <= soonDays * DAY_MS) return "limited";
  return "ready";
}
