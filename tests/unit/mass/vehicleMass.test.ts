import { describe, expect, it } from "vitest";
import { InputError } from "@/lib/errors";
import { vehicleMass, type PlatformMassFigures, type VehicleMassInput, type VehicleMassResult } from "@/lib/mass";

// Invented platform "Tarnby Ridge wagon": every figure made up for the tests.
const platform: PlatformMassFigures = {
  wheelbaseMm: 3000,
  kerbMassKg: 2150,
  kerbFrontKg: 1200,
  kerbRearKg: 950,
  gvmKg: 3100,
  gcmKg: 5900,
  frontAxleRatingKg: 1450,
  rearAxleRatingKg: 1880,
  towingCapacityKg: 3500,
  towballMaxKg: 350,
  roofDynamicLimitKg: 75,
};

function checkOf(r: VehicleMassResult, limit: string) {
  const c = r.checks.find((x) => x.limit === limit);
  if (!c) throw new Error(`no ${limit} check`);
  return c;
}

function allFinite(value: unknown): boolean {
  if (typeof value === "number") return Number.isFinite(value);
  if (Array.isArray(value)) return value.every(allFinite);
  if (value && typeof value === "object") return Object.values(value).every(allFinite);
  return true;
}

describe("vehicleMass — the towing case", () => {
  // ADR Definitions and Vehicle Categories (S); Qld mass regulation 2005 s 48(2) (P); case (C):
  // tare 2,150; fit-out 350; occupants 160; extra 70 L diesel × 0.832 kg/L = 58; towball 250;
  // trailer ATM 2,500; GVM 3,100; GCM 5,900 → vehicle 2,968 ≤ 3,100; GTM 2,250; combination 5,218 ≤ 5,900.
  const input: VehicleMassInput = {
    platform: { ...platform, kerbMassKg: 2150, kerbFrontKg: undefined, kerbRearKg: undefined },
    items: [{ label: "Fit-out", massKg: 350, xMm: 2400 }],
    occupants: [{ count: 2 }],
    fuel: { litres: 70 },
    trailer: { atmKg: 2500, towballKg: 250 },
    tyres: { size: "LT265/70R17 121/118S" },
  };
  const r = vehicleMass(input);

  it("gives every number of the case", () => {
    expect(r.lines.find((l) => l.kind === "fuel")?.massKg).toBeCloseTo(58.24, 2); // 70 × 0.832
    expect(Math.round(r.lines.find((l) => l.kind === "fuel")?.massKg ?? 0)).toBe(58);
    expect(r.lines.find((l) => l.kind === "occupants")?.massKg).toBe(160); // 2 × 80 kg (common practice)
    expect(Math.round(r.grossKg ?? 0)).toBe(2968);
    expect(checkOf(r, "gvm")).toMatchObject({ capacityKg: 3100, ok: true });
    expect(Math.round(checkOf(r, "gvm").loadKg)).toBe(2968);
    // GTM = ATM − towball = 2,250; combination = vehicle + GTM
    expect(Math.round((r.combinationKg ?? 0) - (r.grossKg ?? 0))).toBe(2250);
    expect(Math.round(r.combinationKg ?? 0)).toBe(5218);
    expect(checkOf(r, "gcm")).toMatchObject({ capacityKg: 5900, ok: true });
    expect(checkOf(r, "towing")).toMatchObject({ loadKg: 2500, ok: true });
    expect(checkOf(r, "towball")).toMatchObject({ loadKg: 250, ok: true });
  });

  it("without the axle split it still checks GVM and GCM and asks for the split", () => {
    expect(r.frontKg).toBeUndefined();
    expect(r.missing.map((m) => m.field)).toContain("platform.kerbFrontKg");
    expect(r.complete).toBe(false);
    expect(allFinite(r)).toBe(true);
  });

  it("a combination over GCM fails even when the vehicle is within GVM", () => {
    // Qld mass regulation 2005 s 48(2) (P): a combination may never exceed GCM.
    // Hand-worked: ATM 3,300 with 250 kg download → combination 2,968 + 3,050 = 6,018 > 5,900.
    const heavy = vehicleMass({ ...input, trailer: { atmKg: 3300, towballKg: 250 } });
    expect(checkOf(heavy, "gvm").ok).toBe(true);
    expect(checkOf(heavy, "gcm").ok).toBe(false);
    expect(Math.round(checkOf(heavy, "gcm").headroomKg)).toBe(-118);
    expect(heavy.binding?.limit).toBe("gcm");
  });
});

describe("vehicleMass — axle loads, tyres and binding", () => {
  it("adds items by the lever rule, with the binding limit named", () => {
    // Lever rule (C): 100 kg at 1.0 m, WB 3.0 m → 66.67 / 33.33; 100 kg at 3.8 m → −26.67 / 126.67
    const r = vehicleMass({
      platform,
      items: [
        { label: "Drawer system", massKg: 100, xMm: 1000 },
        { label: "Second spare", massKg: 100, xMm: 3800 },
      ],
      tyres: { size: "LT265/70R17 121/118S" },
    });
    expect(r.frontKg).toBeCloseTo(1200 + 66.667 - 26.667, 2);
    expect(r.rearKg).toBeCloseTo(950 + 33.333 + 126.667, 2);
    expect((r.frontKg ?? 0) + (r.rearKg ?? 0)).toBeCloseTo(r.grossKg ?? 0, 9);
    // ISO 4000-1 / ETRTO load index table (S): LI 121 → 1450 kg per tyre, 2900 kg per axle of two
    expect(checkOf(r, "frontTyres").capacityKg).toBe(2900);
    expect(checkOf(r, "rearTyres").capacityKg).toBe(2900);
    const minHeadroom = Math.min(...r.checks.map((c) => c.headroomKg));
    expect(r.binding?.marginKg).toBe(minHeadroom);
    expect(r.binding?.limit).toBe("front"); // 1450 − 1240 = 210 is the least
    expect(r.complete).toBe(true);
  });

  it("warns that mass far behind the rear axle unloads the front", () => {
    // Lever rule (C): 100 kg at 3.8 m on WB 3.0 m takes 26.67 kg off the front axle
    const r = vehicleMass({ platform, items: [{ massKg: 100, zone: "rearOverhang" }], tyres: { frontLoadIndex: 116, rearLoadIndex: 116 } });
    expect(r.frontKg).toBeCloseTo(1200 - 26.667, 2);
    expect(r.warnings.map((w) => w.code)).toContain("front-unloaded");
  });

  it("uses the dual load index for four rear tyres", () => {
    // ISO 4000-1 / ETRTO load index table (S): LI 116 dual → 1250 kg per tyre
    const r = vehicleMass({ platform, tyres: { size: "LT265/70R17 120/116S", rearCount: 4 } });
    expect(checkOf(r, "rearTyres").capacityKg).toBe(5000);
    expect(checkOf(r, "frontTyres").capacityKg).toBe(2800); // LI 120 single → 1400 kg × 2
  });

  it("splits constant and variable mass by axle", () => {
    // Lever rule (C), hand-worked: 150 kg bar at x = 0 → all front; 350 kg at x = WB → all rear;
    // 60 L water in the tub (over the rear axle by default, common practice) → 60 kg rear.
    const r = vehicleMass({
      platform,
      items: [
        { label: "Bar and winch", massKg: 150, xMm: 0 },
        { label: "Drawers and spare", massKg: 350, xMm: 3000 },
      ],
      water: { litres: 60 },
      tyres: { frontLoadIndex: 121, rearLoadIndex: 121 },
    });
    expect(r.constant).toEqual({ totalKg: 500, frontKg: 150, rearKg: 350 });
    expect(r.variable).toEqual({ totalKg: 60, frontKg: 0, rearKg: 60 });
  });
});

describe("vehicleMass — roof load", () => {
  it("roof limit 75 kg − rack 30 kg → 45 kg of load allowed, which also comes out of payload", () => {
    // Motoring-association guidance on roof loads (S): the rack counts against the roof limit and GVM
    const items = [
      { label: "Roof rack", massKg: 30, zone: "roof" as const, rackLoadLimitKg: 100 },
      { label: "Swags", massKg: 45, zone: "roof" as const, variable: true },
    ];
    const r = vehicleMass({ platform, items, tyres: { frontLoadIndex: 121, rearLoadIndex: 121 } });
    expect(r.roofLoadKg).toBe(75);
    expect(checkOf(r, "roof")).toMatchObject({ loadKg: 75, capacityKg: 75, headroomKg: 0, ok: true });
    expect(r.grossKg).toBe(2150 + 75);
    expect(r.payload?.leftKg).toBe(3100 - 2150 - 75);
    const over = vehicleMass({ platform, items: [items[0]!, { ...items[1]!, massKg: 46 }] });
    expect(checkOf(over, "roof").ok).toBe(false);
  });

  it("uses the lower of the vehicle's and the rack's limits", () => {
    // Motoring-association guidance on roof loads (S): use the lower of the vehicle and rack limits.
    // Hand-worked: rack 30 kg rated for 35 kg of load → 65 kg on the roof in all, below the vehicle's 75.
    const r = vehicleMass({ platform, items: [{ label: "Rack", massKg: 30, rackLoadLimitKg: 35 }, { massKg: 40, zone: "roof" }] });
    expect(checkOf(r, "roof")).toMatchObject({ loadKg: 70, capacityKg: 65, ok: false });
  });
});

describe("vehicleMass — warnings", () => {
  it("warns when loaded mass is more than 500 kg above standard without a brake upgrade", () => {
    // Common practice: a loaded touring fit-out is commonly 500–600 kg above standard
    const input: VehicleMassInput = { platform, items: [{ massKg: 420, zone: "tub" }], occupants: [{ count: 2 }], tyres: { frontLoadIndex: 121, rearLoadIndex: 121 } };
    const r = vehicleMass(input);
    expect(r.aboveStandardKg).toBe(580);
    expect(r.warnings.map((w) => w.code)).toContain("brakes");
    expect(vehicleMass({ ...input, brakeUpgradeFitted: true }).warnings.map((w) => w.code)).not.toContain("brakes");
    expect(vehicleMass({ ...input, aboveStandardWarnKg: 600 }).warnings.map((w) => w.code)).not.toContain("brakes");
    expect(vehicleMass({ ...input, items: [{ massKg: 300, zone: "tub" }] }).warnings.map((w) => w.code)).not.toContain("brakes");
  });
});

describe("vehicleMass — weighbridge base", () => {
  it("uses measured axle masses and does not count fitted items twice", () => {
    // Lever rule (C), hand-worked: planned 100 kg at 1.0 m on WB 3.0 m adds 66.67 front / 33.33 rear
    const r = vehicleMass({
      platform,
      measured: { frontKg: 1300, rearKg: 1250 },
      items: [
        { label: "Bar (fitted, on the ticket)", massKg: 80, zone: "front" },
        { label: "Planned drawer", massKg: 100, xMm: 1000, status: "planned" },
      ],
      tyres: { frontLoadIndex: 121, rearLoadIndex: 121 },
    });
    expect(r.base?.source).toBe("measured");
    expect(r.grossKg).toBeCloseTo(2650, 9);
    expect(r.frontKg).toBeCloseTo(1366.667, 2);
    expect(r.lines.find((l) => l.label.startsWith("Bar"))?.counted).toBe(false);
    expect(r.aboveStandardKg).toBeCloseTo(500, 9);
  });

  it("adds fitted items when the ticket was taken before they went on", () => {
    const r = vehicleMass({ platform, measured: { frontKg: 1200, rearKg: 950, includesFittedItems: false }, items: [{ massKg: 80, xMm: 0 }] });
    expect(r.frontKg).toBe(1280);
  });
});

describe("vehicleMass — missing figures", () => {
  it("says which figures are missing instead of throwing, with no NaN anywhere", () => {
    const r = vehicleMass({ platform: {}, items: [{ massKg: 70, zone: "front" }], trailer: { atmKg: 2000, towballKg: 200 } });
    const fields = r.missing.map((m) => m.field);
    for (const f of [
      "platform.kerbMassKg",
      "platform.wheelbaseMm",
      "platform.gvmKg",
      "platform.frontAxleRatingKg",
      "platform.rearAxleRatingKg",
      "platform.gcmKg",
      "platform.towingCapacityKg",
      "platform.towballMaxKg",
      "tyres",
    ]) {
      expect(fields).toContain(f);
    }
    expect(r.complete).toBe(false);
    expect(r.checks).toEqual([]);
    expect(r.binding).toBeUndefined();
    expect(r.grossKg).toBeUndefined();
    expect(allFinite(r)).toBe(true);
    expect(JSON.stringify(r)).not.toMatch(/NaN|Infinity|null/);
  });

  it("treats null figures (empty database columns) as missing", () => {
    const r = vehicleMass({ platform: { ...platform, gvmKg: null, rearAxleRatingKg: null }, tyres: { frontLoadIndex: 121, rearLoadIndex: 121 } });
    expect(r.missing.map((m) => m.field).sort()).toEqual(["platform.gvmKg", "platform.rearAxleRatingKg"]);
    expect(r.checks.map((c) => c.limit)).toEqual(["front", "frontTyres", "rearTyres"]);
  });

  it("still throws InputError for figures that are present but wrong", () => {
    try {
      vehicleMass({ platform: { ...platform, gvmKg: -3100 } });
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(InputError);
      expect((e as InputError).field).toBe("platform.gvmKg");
    }
    expect(() => vehicleMass({ platform, items: [{ massKg: 10 }] })).toThrow(/position/);
    expect(() => vehicleMass({ platform, occupants: [{ count: 1.5 }] })).toThrow(InputError);
    expect(() => vehicleMass({ platform, fuel: { litres: -1 } })).toThrow(InputError);
  });
});
