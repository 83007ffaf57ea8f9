import { describe, expect, it } from "vitest";
import {
  batteryCalc,
  batteryCalcInputSchema,
  batteryPlan,
  batteryPlanInputSchema,
  rechargeInputSchema,
  rechargeTime,
  suggestBattery,
  USABLE_DEPTH_OF_DISCHARGE,
} from "@/lib/electrical";
import { InputError } from "@/lib/errors";

// 720 Wh a day: a camp fridge of 60 W running 12 h (invented input).
const fridgeOnly = [{ label: "Camp fridge", powerW: 60, hoursPerDay: 12 }];

// 1,860 Wh a day from invented consumers, hand-worked:
// fridge 45 W × 24 h × 50 % = 540; lights 20 W × 5 h = 100; laptop on the inverter
// 90 W × 4 h / 0.9 = 400; water pump 60 W × 2 h = 120; fan 35 W × 20 h = 700 → 1,860 Wh.
const touringLoads = [
  { label: "Fridge", powerW: 45, hoursPerDay: 24, dutyPct: 50 },
  { label: "Cabin lights", powerW: 20, hoursPerDay: 5 },
  { label: "Laptop", powerW: 90, hoursPerDay: 4, ac: true },
  { label: "Water pump", powerW: 60, hoursPerDay: 2 },
  { label: "Fan", powerW: 35, hoursPerDay: 20 },
];

describe("batteryPlan", () => {
  it("720 Wh/day at 12 V is 60 Ah/day → 120 Ah lead-acid, 75 Ah LiFePO4 for one day", () => {
    const lead = batteryPlan({ consumers: fridgeOnly, systemV: 12, daysAutonomy: 1, chemistry: "lead-acid" });
    // Ah per day = Σ(W × h) / V (S); case (C): 720 Wh → 60 Ah
    expect(lead.dailyWh).toBeCloseTo(720, 9);
    expect(lead.dailyAh).toBeCloseTo(60, 9);
    // Capacity = Ah/day × days / usable DoD (AS/NZS 4509.2, S); 50 % lead-acid (common practice); case (C): 120 Ah
    expect(lead.usableDepthOfDischargePct).toBe(50);
    expect(lead.requiredCapacityAh).toBeCloseTo(120, 9);
    const lithium = batteryPlan({
      consumers: fridgeOnly,
      systemV: 12,
      daysAutonomy: 1,
      chemistry: "lithium-iron-phosphate",
    });
    // 80 % LiFePO4 (common practice); case (C): 75 Ah
    expect(lithium.usableDepthOfDischargePct).toBe(80);
    expect(lithium.requiredCapacityAh).toBeCloseTo(75, 9);
  });

  it("a consumer given by current gives the same budget", () => {
    // Case (C): 5 A × 12 V = 60 W, × 12 h = 720 Wh → 60 Ah
    const plan = batteryPlan({
      consumers: [{ label: "Camp fridge", currentA: 5, hoursPerDay: 12 }],
      systemV: 12,
      daysAutonomy: 1,
      chemistry: "agm",
    });
    expect(plan.dailyAh).toBeCloseTo(60, 9);
    // AGM at about 50 % usable (common practice)
    expect(plan.requiredCapacityAh).toBeCloseTo(120, 9);
  });

  it("1,860 Wh/day at 12 V is 155 Ah → 310 Ah at 50 %, 194 Ah at 80 %", () => {
    const lead = batteryPlan({ consumers: touringLoads, systemV: 12, daysAutonomy: 1, chemistry: "lead-acid" });
    // AC loads divided by the inverter efficiency, about 0.9 (S): laptop 400 Wh (hand-worked)
    expect(lead.inverterEfficiency).toBe(0.9);
    expect(lead.consumers[2]?.whPerDay).toBeCloseTo(400, 9);
    // Case (S): 1,860 Wh/day → 155 Ah → 310 Ah at 50 %
    expect(lead.dailyWh).toBeCloseTo(1860, 9);
    expect(lead.dailyAh).toBeCloseTo(155, 9);
    expect(lead.requiredCapacityAh).toBeCloseTo(310, 9);
    const lithium = batteryPlan({
      consumers: touringLoads,
      systemV: 12,
      daysAutonomy: 1,
      chemistry: "lithium-iron-phosphate",
    });
    // Case (S): 194 Ah at 80 % (155 / 0.8 = 193.75)
    expect(lithium.requiredCapacityAh).toBeCloseTo(194, 0);
    expect(lithium.requiredCapacityAh).toBeCloseTo(193.75, 9);
  });

  it("scales with days of autonomy", () => {
    // Capacity = Ah/day × days of autonomy / usable DoD (AS/NZS 4509.2, S): 60 × 3 / 0.5 = 360 (hand-worked)
    const plan = batteryPlan({ consumers: fridgeOnly, systemV: 12, daysAutonomy: 3, chemistry: "lead-acid" });
    expect(plan.requiredCapacityAh).toBeCloseTo(360, 9);
    // 360 Ah is above the largest common size (common practice): two batteries of 200 Ah
    expect(plan.suggestedBattery).toEqual({ count: 2, capacityAhEach: 200, totalAh: 400 });
  });

  it("suggests the smallest common battery size at or above the need", () => {
    // Common practice battery sizes
    expect(suggestBattery(120)).toEqual({ count: 1, capacityAhEach: 120, totalAh: 120 });
    expect(suggestBattery(193.75)).toEqual({ count: 1, capacityAhEach: 200, totalAh: 200 });
    expect(suggestBattery(310)).toEqual({ count: 2, capacityAhEach: 170, totalAh: 340 });
  });

  it("usable depth of discharge by chemistry", () => {
    // Common practice: about 50 % lead-acid/AGM, about 80 % LiFePO4
    expect(USABLE_DEPTH_OF_DISCHARGE).toEqual({ "lead-acid": 0.5, agm: 0.5, "lithium-iron-phosphate": 0.8 });
  });

  it("refuses consumers that are not fully described, naming the field", () => {
    const base = { systemV: 12, daysAutonomy: 1, chemistry: "agm" as const };
    expect(() => batteryPlan({ ...base, consumers: [{ label: "Radio", hoursPerDay: 3 }] })).toThrow(
      expect.objectContaining({ field: "consumers.0.powerW" }),
    );
    expect(() =>
      batteryPlan({ ...base, consumers: [{ label: "Kettle", currentA: 8, hoursPerDay: 1, ac: true }] }),
    ).toThrow(expect.objectContaining({ field: "consumers.0.currentA" }));
    expect(() =>
      batteryPlan({ ...base, consumers: [fridgeOnly[0]!, { label: "Lamp", powerW: 5, hoursPerDay: 25 }] }),
    ).toThrow(expect.objectContaining({ field: "consumers.1.hoursPerDay" }));
    expect(() => batteryPlan({ ...base, consumers: [{ label: "Idle", powerW: 0, hoursPerDay: 4 }] })).toThrow(
      InputError,
    );
    expect(() => batteryPlan({ ...base, consumers: fridgeOnly, daysAutonomy: 0 })).toThrow(InputError);
    expect(() =>
      batteryPlan({ ...base, consumers: fridgeOnly, chemistry: "toString" as "agm" }),
    ).toThrow(expect.objectContaining({ field: "chemistry" }));
  });

  it("the schema mirrors the same rules", () => {
    const good = batteryPlanInputSchema.safeParse({ consumers: touringLoads, systemV: 12, daysAutonomy: 2, chemistry: "agm" });
    expect(good.success).toBe(true);
    const bad = batteryPlanInputSchema.safeParse({
      consumers: [{ label: "Radio", currentA: 1, powerW: 12, hoursPerDay: 3 }],
      systemV: 12,
      daysAutonomy: 2,
      chemistry: "gel",
    });
    expect(bad.success).toBe(false);
    const paths = bad.error?.issues.map((issue) => issue.path.join("."));
    expect(paths).toEqual(expect.arrayContaining(["consumers.0.powerW", "chemistry"]));
  });
});

describe("rechargeTime", () => {
  it("adds dc-dc and derated solar", () => {
    // Hand-worked: dc-dc 25 A × 3 h driving = 75 Ah/day; solar 200 W / 12 V × 0.75 derating
    // (common practice) = 12.5 A × 5 peak sun hours = 62.5 Ah/day → 137.5 Ah/day in.
    // Together 37.5 A → 120 Ah back in 3.2 h of both delivering; 120 / 137.5 = 0.8727 days.
    const result = rechargeTime({
      deficitAh: 120,
      systemV: 12,
      sources: [
        { kind: "dc-dc", currentA: 25, hoursPerDay: 3 },
        { kind: "solar", watts: 200, hoursPerDay: 5 },
      ],
    });
    expect(result.solarDerating).toBe(0.75);
    expect(result.sources[1]?.chargeA).toBeCloseTo(12.5, 9);
    expect(result.sources[1]?.dailyAh).toBeCloseTo(62.5, 9);
    expect(result.chargeA).toBeCloseTo(37.5, 9);
    expect(result.hoursToRecover).toBeCloseTo(3.2, 9);
    expect(result.dailyAhIn).toBeCloseTo(137.5, 9);
    expect(result.daysToRecover).toBeCloseTo(0.872727, 5);
  });

  it("mains without hours gives the hours but no days", () => {
    // Hand-worked: 90 Ah at 15 A = 6 h
    const result = rechargeTime({ deficitAh: 90, sources: [{ kind: "mains", currentA: 15 }] });
    expect(result.hoursToRecover).toBeCloseTo(6, 9);
    expect(result.sources[0]?.dailyAh).toBeNull();
    expect(result.daysToRecover).toBeNull();
  });

  it("refuses a solar source without sun hours and watts without a system voltage", () => {
    expect(() => rechargeTime({ deficitAh: 50, systemV: 12, sources: [{ kind: "solar", watts: 100 }] })).toThrow(
      expect.objectContaining({ field: "sources.0.hoursPerDay" }),
    );
    expect(() => rechargeTime({ deficitAh: 50, sources: [{ kind: "solar", watts: 100, hoursPerDay: 5 }] })).toThrow(
      expect.objectContaining({ field: "systemV" }),
    );
    expect(() => rechargeTime({ deficitAh: 50, sources: [] })).toThrow(InputError);
    expect(rechargeInputSchema.safeParse({ deficitAh: 50, sources: [{ kind: "solar", watts: 100 }] }).success).toBe(
      false,
    );
  });
});

describe("batteryCalc", () => {
  it("plans the battery and checks that charging keeps up", () => {
    const body = batteryCalcInputSchema.parse({
      consumers: fridgeOnly,
      systemV: 12,
      daysAutonomy: 2,
      chemistry: "lithium-iron-phosphate",
      charging: { sources: [{ kind: "solar", watts: 160, hoursPerDay: 5 }] },
    });
    const result = batteryCalc(body);
    // Case (C) 60 Ah/day; 2 days / 0.8 (common practice) = 150 Ah (hand-worked)
    expect(result.plan.requiredCapacityAh).toBeCloseTo(150, 9);
    // Hand-worked: 160 W / 12 V × 0.75 (common practice) = 10 A × 5 h = 50 Ah/day < 60 Ah/day;
    // 120 Ah deficit after two days / 50 = 2.4 days
    expect(result.recharge?.dailyAhIn).toBeCloseTo(50, 9);
    expect(result.recharge?.daysToRecover).toBeCloseTo(2.4, 9);
    expect(result.chargingKeepsUp).toBe(false);
  });
});
