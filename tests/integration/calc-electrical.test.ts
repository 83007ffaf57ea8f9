import { describe, expect, it, vi } from "vitest";
import { POST as batteryRoute } from "@/app/api/calc/battery/route";
import { POST as cableRoute } from "@/app/api/calc/cable/route";
import { useTestDatabase } from "../helpers/db";
import { callRoute, requestUser } from "../helpers/route";
import { signedInAs } from "../helpers/users";

vi.mock("@/lib/server/session", async (original) => ({
  ...(await original<typeof import("@/lib/server/session")>()),
  currentUser: async () => requestUser.current,
}));

const database = await useTestDatabase();
const manager = await signedInAs(database, "manager@mirrabel-health.example");

type ErrorJson = { error: { code: string; details: { field?: string; message: string }[] } };
type CableResult = {
  dropV: number;
  dropPct: number;
  maxDropPct: number;
  withinLimit: boolean;
  minAreaMm2: number;
  recommendedAreaMm2: number;
  recommendedRatingA: number;
  fuseA: number;
  fuseLocation: string;
  notes: string[];
  caution: string;
};
type BatteryResult = {
  plan: { dailyWh: number; dailyAh: number; requiredCapacityAh: number; usableDepthOfDischargePct: number; suggestedBattery: { count: number; capacityAhEach: number } };
  recharge: { dailyAhIn: number; daysToRecover: number | null } | null;
  chargingKeepsUp: boolean | null;
  caution: string;
};

const postCable = (body: unknown) => callRoute(cableRoute, { user: manager, url: "http://localhost/api/calc/cable", body });
const postBattery = (body: unknown) => callRoute(batteryRoute, { user: manager, url: "http://localhost/api/calc/battery", body });

describe("POST /api/calc/cable", () => {
  it("the 20 A, 5 m, 6 mm² run at 12 V drops 0.575 V = 4.79 %: fails 3 %, sized up to 10 mm²", async () => {
    const { status, json } = await postCable({ currentA: 20, lengthOneWayM: 5, systemV: 12, maxDropPct: 3, areaMm2: 6 });
    expect(status).toBe(200);
    const r = json as CableResult;
    // Two-wire DC drop case (C): 0.575 V = 4.79 %
    expect(r.dropV).toBeCloseTo(0.575, 3);
    expect(r.dropPct).toBeCloseTo(4.79, 2);
    // ABYC E-11 (S): 3 % for critical circuits → fails
    expect(r.maxDropPct).toBe(3);
    expect(r.withinLimit).toBe(false);
    // Case (C): smallest cable for 3 % is 9.58 mm² → next standard size 10 mm²
    expect(r.minAreaMm2).toBeCloseTo(9.58, 2);
    expect(r.recommendedAreaMm2).toBe(10);
    // Fuse above the load and at or below the cable's rating, near the battery (common practice):
    // 20 A × 1.25 = 25 A → the 25 A standard rating (hand-worked)
    expect(r.fuseA).toBe(25);
    expect(r.fuseA).toBeLessThanOrEqual(r.recommendedRatingA);
    expect(r.fuseLocation).toMatch(/close to the battery/);
    expect(r.caution).toBe("Planning aid only. Wiring follows the equipment makers' instructions and local wiring rules.");
  });

  it("the same run passes the 10 % limit for other circuits", async () => {
    const { json } = await postCable({ currentA: 20, lengthOneWayM: 5, systemV: 12, areaMm2: 6, circuit: "other" });
    const r = json as CableResult;
    // ABYC E-11 (S): 10 % for other circuits → 4.79 % passes
    expect(r.maxDropPct).toBe(10);
    expect(r.dropPct).toBeCloseTo(4.79, 2);
    expect(r.withinLimit).toBe(true);
  });

  it("at 50 °C the drop of the 6 mm² run is 0.642 V", async () => {
    const { json } = await postCable({ currentA: 20, lengthOneWayM: 5, systemV: 12, areaMm2: 6, temperatureC: 50, circuit: "other" });
    // IEC 60028 temperature coefficient (S), case (C): 0.642 V
    expect((json as CableResult).dropV).toBeCloseTo(0.642, 3);
  });

  it("answers 422 naming the field for zero current", async () => {
    const { status, json } = await postCable({ currentA: 0, lengthOneWayM: 5, systemV: 12 });
    expect(status).toBe(422);
    const body = json as ErrorJson;
    expect(body.error.code).toBe("validation_failed");
    expect(body.error.details[0]).toEqual({ field: "currentA", message: "currentA must be greater than zero" });
  });

  it("answers 422 naming the field when the computation refuses the input", async () => {
    // 400 A needs a fuse above the largest standard rating: refused by the computation itself.
    const { status, json } = await postCable({ currentA: 400, lengthOneWayM: 1, systemV: 12 });
    expect(status).toBe(422);
    expect((json as ErrorJson).error.details[0]?.field).toBe("currentA");
    expect((json as ErrorJson).error.details[0]?.message).toMatch(/auto-electrician/);
  });
});

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

describe("POST /api/calc/battery", () => {
  it("720 Wh/day at 12 V is 60 Ah/day → 120 Ah at 50 % for one day", async () => {
    const { status, json } = await postBattery({ consumers: fridgeOnly, systemV: 12, daysAutonomy: 1, chemistry: "lead-acid" });
    expect(status).toBe(200);
    const r = json as BatteryResult;
    // Ah per day = Σ(W × h) / V (S); case (C): 720 Wh → 60 Ah
    expect(r.plan.dailyWh).toBeCloseTo(720, 9);
    expect(r.plan.dailyAh).toBeCloseTo(60, 9);
    // Capacity = Ah/day × days / usable DoD (AS/NZS 4509.2, S); 50 % lead-acid (common practice); case (C): 120 Ah
    expect(r.plan.requiredCapacityAh).toBeCloseTo(120, 9);
    expect(r.recharge).toBeNull();
    expect(r.caution).toMatch(/local wiring rules/);
  });

  it("1,860 Wh/day at 12 V is 155 Ah → 194 Ah at 80 %", async () => {
    const { json } = await postBattery({ consumers: touringLoads, systemV: 12, daysAutonomy: 1, chemistry: "lithium-iron-phosphate" });
    const r = json as BatteryResult;
    // Case (S): 1,860 Wh/day → 155 Ah; 194 Ah at 80 % (155 / 0.8 = 193.75); 80 % LiFePO4 (common practice)
    expect(r.plan.dailyWh).toBeCloseTo(1860, 9);
    expect(r.plan.dailyAh).toBeCloseTo(155, 9);
    expect(r.plan.usableDepthOfDischargePct).toBe(80);
    expect(r.plan.requiredCapacityAh).toBeCloseTo(193.75, 9);
  });

  it("checks whether the charging keeps up", async () => {
    const { json } = await postBattery({
      consumers: fridgeOnly,
      systemV: 12,
      daysAutonomy: 2,
      chemistry: "lithium-iron-phosphate",
      charging: { sources: [{ kind: "solar", watts: 160, hoursPerDay: 5 }] },
    });
    const r = json as BatteryResult;
    // Case (C) 60 Ah/day; 2 days / 0.8 (common practice) = 150 Ah (hand-worked)
    expect(r.plan.requiredCapacityAh).toBeCloseTo(150, 9);
    // Hand-worked: 160 W / 12 V × 0.75 derating (common practice) = 10 A × 5 h = 50 Ah/day < 60 Ah/day;
    // 120 Ah deficit after two days / 50 = 2.4 days
    expect(r.recharge?.dailyAhIn).toBeCloseTo(50, 9);
    expect(r.recharge?.daysToRecover).toBeCloseTo(2.4, 9);
    expect(r.chargingKeepsUp).toBe(false);
  });

  it("answers 422 naming the field for bad consumers and chemistry", async () => {
    const { status, json } = await postBattery({
      consumers: [{ label: "Fridge", currentA: 0, hoursPerDay: 30 }],
      systemV: 12,
      daysAutonomy: 1,
      chemistry: "unobtainium",
    });
    expect(status).toBe(422);
    const fields = (json as ErrorJson).error.details.map((d) => d.field);
    expect(fields).toEqual(expect.arrayContaining(["consumers.0.hoursPerDay", "chemistry"]));
    // Consumers that draw nothing pass the schema but the computation refuses them.
    const idle = await postBattery({ consumers: [{ label: "Fridge", powerW: 0, hoursPerDay: 5 }], systemV: 12, daysAutonomy: 1, chemistry: "agm" });
    expect(idle.status).toBe(422);
    expect((idle.json as ErrorJson).error.details[0]?.field).toBe("consumers");
  });
});
