import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { ZONES, vehicleMass, vehicleMassInputSchema, type VehicleMassInput } from "@/lib/mass";

// Invented platform figures for the generated cases.
const platform = {
  wheelbaseMm: 3100,
  kerbFrontKg: 1250,
  kerbRearKg: 1000,
  gvmKg: 3300,
  gcmKg: 6500,
  frontAxleRatingKg: 1500,
  rearAxleRatingKg: 2000,
  towingCapacityKg: 3500,
  towballMaxKg: 350,
  roofDynamicLimitKg: 100,
};

const item = fc.record({
  massKg: fc.double({ min: 0, max: 300, noNaN: true }),
  xMm: fc.option(fc.double({ min: -1000, max: 5000, noNaN: true }), { nil: undefined }),
  zone: fc.constantFrom(...ZONES),
  variable: fc.boolean(),
});

describe("vehicleMass properties", () => {
  it("front + rear equals gross, constant + variable equals the added mass, binding is the least headroom", () => {
    // Lever rule, statics of a simply supported beam (S): the axle reactions sum to the load
    fc.assert(
      fc.property(fc.array(item, { maxLength: 10 }), fc.nat({ max: 5 }), (items, people) => {
        const input: VehicleMassInput = { platform, items, occupants: [{ count: people }], tyres: { frontLoadIndex: 116, rearLoadIndex: 121 } };
        const r = vehicleMass(input);
        expect((r.frontKg ?? Number.NaN) + (r.rearKg ?? Number.NaN)).toBeCloseTo(r.grossKg ?? Number.NaN, 6);
        expect(r.constant.totalKg + r.variable.totalKg).toBeCloseTo((r.grossKg ?? 0) - 2250, 6);
        expect(r.binding?.marginKg).toBe(Math.min(...r.checks.map((c) => c.headroomKg)));
        expect(JSON.stringify(r)).not.toMatch(/NaN|Infinity|null/);
      }),
    );
  });

  it("adding mass never increases GVM headroom", () => {
    fc.assert(
      fc.property(fc.array(item, { maxLength: 8 }), item, (items, extra) => {
        const gvm = (xs: typeof items) => vehicleMass({ platform, items: xs }).checks.find((c) => c.limit === "gvm")?.headroomKg ?? Number.NaN;
        expect(gvm([...items, extra])).toBeLessThanOrEqual(gvm(items) + 1e-6);
      }),
    );
  });
});

describe("vehicleMassInputSchema", () => {
  it("accepts a full input and null platform figures, and rejects bad ones by path", () => {
    const ok = vehicleMassInputSchema.safeParse({
      platform: { ...platform, gcmKg: null, zonePositions: { towbar: { kind: "behindRearAxle", mm: 950 } } },
      items: [{ label: "Rack", massKg: 30, zone: "roof", rackLoadLimitKg: 100 }],
      occupants: [{ count: 2 }],
      fuel: { litres: 70 },
      trailer: { atmKg: 2500, towballKg: 250 },
      tyres: { size: "LT265/70R17 121/118S" },
    });
    expect(ok.success).toBe(true);
    if (ok.success) expect(vehicleMass(ok.data).missing.map((m) => m.field)).toEqual(["platform.gcmKg"]);
    const bad = vehicleMassInputSchema.safeParse({ platform: {}, items: [{ massKg: 10, zone: "bonnet" }] });
    expect(bad.error?.issues[0]?.path).toEqual(["items", 0, "zone"]);
    const people = vehicleMassInputSchema.safeParse({ platform: {}, occupants: [{ count: 1.5 }] });
    expect(people.error?.issues[0]?.path).toEqual(["occupants", 0, "count"]);
  });
});
