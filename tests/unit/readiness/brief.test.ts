import { describe, expect, it } from "vitest";
import { tripReadiness, VEHICLE_STATES, type ExpiringItem, type OpenDefect, type TripReadinessInput } from "@/lib/readiness";
import { criticalGapCount, earliestExpiry, nextReadinessChange, readinessFactsOf, readinessStateOf } from "@/lib/readiness/brief";
import { vehicleVariance, type EditionLine, type Fitment } from "@/lib/variance";
import { NOW, daysFromNow, fitment, line } from "../variance/fixtures";

// Rigline rules (our own readiness rules, lib/readiness/readiness.ts); no external source. The
// brief must give the state the full judgement gives: every combination below is checked
// against tripReadiness itself, none is typed in by hand.

const lines: EditionLine[] = [
  line({ id: "s1", code: "SA-01", category: "safety", title: "Fire extinguisher" }),
  line({ id: "c1", code: "CM-01", category: "communications", title: "UHF radio", criteria: [{ attribute: "powerW", label: "Transmit power", unit: "W", op: "gte", value: 5 }], evidenceNeeded: ["photo"] }),
  line({ id: "t1", code: "ST-01", category: "storage", title: "Cargo drawers", criteria: [{ attribute: "drawers", label: "Drawers", unit: "", op: "gte", value: 2 }] }),
  line({ id: "n1", code: "LR-09", category: "lighting_roof", title: "Roof-top tent", requirement: "must_not_fit" }),
];
const photo = [{ kind: "photo" as const, status: "accepted" as const }];
const good: Fitment[] = [
  fitment({ id: "fs1", lineId: "s1" }),
  fitment({ id: "fc1", lineId: "c1", attributes: { powerW: 5 }, evidence: photo }),
  fitment({ id: "ft1", lineId: "t1", attributes: { drawers: 2 } }),
];
const swap = (id: string, replacement?: Fitment) => [...good.filter((f) => f.id !== id), ...(replacement ? [replacement] : [])];
const judged = (fitments: Fitment[]) => vehicleVariance({ lines, fitments, concessions: [], now: NOW });

const variances = {
  none: null,
  met: judged(good),
  criticalShort: judged(swap("fs1")),
  criticalOffSpec: judged(swap("fc1", fitment({ id: "fc2", lineId: "c1", attributes: { powerW: 1 }, evidence: photo }))),
  criticalUnproven: judged(swap("fc1", fitment({ id: "fc3", lineId: "c1", attributes: { powerW: 5 } }))),
  otherShort: judged(swap("ft1")),
  otherOffSpec: judged(swap("ft1", fitment({ id: "ft2", lineId: "t1", attributes: { drawers: 1 } }))),
  prohibitedFitted: judged([...good, fitment({ id: "fn1", lineId: "n1" })]),
};
const defectSets: Record<string, OpenDefect[]> = {
  none: [],
  watch: [{ id: "d1", severity: "watch", title: "Stone chip" }],
  beforeTrip: [{ id: "d2", severity: "before_next_trip", title: "Worn wiper" }],
  stop: [{ id: "d3", severity: "stop", title: "Brake fluid leak" }],
};
const expirySets: Record<string, ExpiringItem[]> = {
  none: [],
  expired: [{ label: "First-aid kit", expiresAt: daysFromNow(-1) }, { label: "Registration", expiresAt: daysFromNow(200) }],
  atNow: [{ label: "Fire extinguisher", expiresAt: NOW }],
  soon: [{ label: "Registration", expiresAt: daysFromNow(200) }, { label: "Flares", expiresAt: daysFromNow(30) }],
  justBeyond: [{ label: "Flares", expiresAt: daysFromNow(30.0001) }],
};

describe("readiness in brief gives the full judgement's state", () => {
  const cases: [string, TripReadinessInput][] = [];
  for (const vehicleState of VEHICLE_STATES)
    for (const [v, variance] of Object.entries(variances))
      for (const [d, openDefects] of Object.entries(defectSets))
        for (const [e, expiringItems] of Object.entries(expirySets))
          cases.push([`${vehicleState} / ${v} / defects ${d} / expiry ${e}`, { vehicleState, variance, openDefects, expiringItems, now: NOW }]);

  it(`for all ${cases.length} combinations of state, variance, defects and expiries`, () => {
    const states = new Set<string>();
    for (const [name, input] of cases) {
      const full = tripReadiness(input).state;
      states.add(full);
      expect(readinessStateOf(readinessFactsOf(input), NOW), name).toBe(full);
    }
    // The combinations reach every state.
    expect([...states].sort()).toEqual(["limited", "not_ready", "ready"]);
  });

  it("with another look-ahead than the default 30 days", () => {
    const input: TripReadinessInput = { vehicleState: "in_service", variance: variances.met, openDefects: [], expiringItems: expirySets.soon!, now: NOW, soonDays: 10 };
    expect(readinessStateOf(readinessFactsOf(input), NOW, 10)).toBe(tripReadiness(input).state);
    expect(tripReadiness(input).state).toBe("ready");
  });
});

describe("the facts", () => {
  it("count critical gaps only in the critical categories, and find the earliest expiry", () => {
    expect(criticalGapCount(variances.criticalShort)).toBe(1);
    expect(criticalGapCount(variances.criticalOffSpec)).toBe(1);
    expect(criticalGapCount(variances.criticalUnproven)).toBe(0);
    expect(criticalGapCount(variances.otherShort)).toBe(0);
    expect(criticalGapCount(null)).toBe(0);
    expect(earliestExpiry(expirySets.soon!)).toEqual(daysFromNow(30));
    expect(earliestExpiry([])).toBeNull();
  });
});

describe("when time alone turns the state", () => {
  const facts = { vehicleState: "in_service" as const, stopDefects: 0, beforeTripDefects: 0, criticalGaps: 0, limitingLines: 0 };
  it("at the look-ahead before the earliest expiry, then at the expiry itself, then never", () => {
    const expiry = daysFromNow(45);
    const f = { ...facts, earliestExpiry: expiry };
    const soon = expiry.getTime() - 30 * 86_400_000;
    expect(nextReadinessChange(f, NOW)).toBe(soon);
    // The state holds up to the instant named and turns at it (readinessStateOf is the judge).
    expect(readinessStateOf(f, new Date(soon - 1))).toBe("ready");
    expect(readinessStateOf(f, new Date(soon))).toBe("limited");
    expect(nextReadinessChange(f, new Date(soon))).toBe(expiry.getTime());
    expect(readinessStateOf(f, new Date(expiry.getTime() - 1))).toBe("limited");
    expect(readinessStateOf(f, expiry)).toBe("not_ready");
    expect(nextReadinessChange(f, expiry)).toBeNull();
    expect(nextReadinessChange({ earliestExpiry: null }, NOW)).toBeNull();
  });
});
