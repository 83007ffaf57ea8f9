import { describe, expect, it } from "vitest";
import { electricalPlanSchema, summariseElectricalPlan } from "@/lib/electrical";
import { InputError } from "@/lib/errors";

// An invented plan, typed as a form sends it (numbers as text).
const typed = {
  systemV: "12",
  daysAutonomy: "2",
  chemistry: "agm",
  consumers: [
    { label: "Fridge", currentA: "4", hoursPerDay: "24", dutyPct: "50" },
    { label: "Lights", currentA: "2", hoursPerDay: "3" },
  ],
  sources: [{ kind: "dc-dc", amount: "20", unit: "A", hoursPerDay: "" }],
  runs: [{ label: "Battery to fridge", currentA: "5", lengthOneWayM: "4", circuit: "critical" }],
};

describe("the saved 12 V plan", () => {
  it("reads typed numbers, leaves a blank optional field out and summarises the plan", () => {
    const plan = electricalPlanSchema.parse(typed);
    expect(plan.systemV).toBe(12);
    expect(plan.sources[0]!.hoursPerDay).toBeUndefined();
    const summary = summariseElectricalPlan(plan);
    // Ah per day = Σ(A × h × duty), hand-worked: 4 A × 24 h × 50 % + 2 A × 3 h = 48 + 6 = 54 Ah.
    expect(summary.battery.dailyAh).toBeCloseTo(54, 9);
    // Capacity = Ah/day × days / usable depth (AS/NZS 4509.2); AGM 50 % usable (common practice): 54 × 2 / 0.5 = 216 Ah.
    expect(summary.battery.requiredCapacityAh).toBeCloseTo(216, 9);
    // Recharge at 20 A with every source on (hand-worked): 108 Ah / 20 A = 5.4 h; no hours a day given → no days figure.
    expect(summary.recharge!.hoursToRecover).toBeCloseTo(5.4, 9);
    expect(summary.recharge!.daysToRecover).toBeNull();
    // A 5 A run, 4 m one way, on the 3 % critical limit (ABYC E-11 as published guidance) stays within it.
    expect(summary.runs[0]!.maxDropPct).toBe(3);
    expect(summary.runs[0]!.withinLimit).toBe(true);
    expect(summary.runs[0]!.dropPct).toBeLessThanOrEqual(3);
    expect(summary.runs[0]!.fuseA).toBeGreaterThanOrEqual(5);
  });

  it("names the field at fault: blank numbers are missing, never 0", () => {
    const paths = (input: unknown) => {
      const result = electricalPlanSchema.safeParse(input);
      return result.success ? [] : result.error.issues.map((i) => i.path.join("."));
    };
    expect(paths({ ...typed, daysAutonomy: "" })).toEqual(["daysAutonomy"]);
    expect(paths({ ...typed, consumers: [{ label: "Fridge", currentA: "", hoursPerDay: "5" }] })).toEqual(["consumers.0.currentA"]);
    expect(paths({ ...typed, sources: [{ kind: "solar", amount: "200", unit: "W" }] })).toEqual(["sources.0.hoursPerDay"]);
    expect(paths({ ...typed, runs: [{ label: "Winch", currentA: "abc", lengthOneWayM: "2", circuit: "other" }] })).toEqual(["runs.0.currentA"]);
    expect(paths({ ...typed, systemV: "48" })).toEqual(["systemV"]);
  });

  it("a plan that uses nothing cannot be sized: the error points at the consumers", () => {
    const plan = electricalPlanSchema.parse({ ...typed, consumers: [{ label: "Spare outlet", currentA: "1", hoursPerDay: "0" }] });
    expect(() => summariseElectricalPlan(plan)).toThrow(InputError);
    try {
      summariseElectricalPlan(plan);
    } catch (error) {
      expect((error as InputError).field).toBe("consumers");
    }
  });
});
