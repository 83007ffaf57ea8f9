import { describe, expect, it } from "vitest";
import { InputError } from "@/lib/errors";
import { DEFAULT_ZONE_POSITIONS, leverRule, zoneXMm } from "@/lib/mass";

describe("leverRule", () => {
  it("10 kN at 1 m on a 4 m span → 7.5 kN / 2.5 kN", () => {
    // Lever rule, statics of a simply supported beam (S, beam textbook example); units carry through
    const r = leverRule({ massKg: 10_000, xMm: 1000 }, 4000);
    expect(r.frontKg).toBeCloseTo(7500, 9);
    expect(r.rearKg).toBeCloseTo(2500, 9);
  });

  it("1000 N at 2 m on a 5 m span → 600 N / 400 N", () => {
    // Lever rule, statics of a simply supported beam (S)
    const r = leverRule({ massKg: 1000, xMm: 2000 }, 5000);
    expect(r.frontKg).toBeCloseTo(600, 9);
    expect(r.rearKg).toBeCloseTo(400, 9);
  });

  it("10 kN at 10 m on an 8 m span (overhang) → front −2.5 kN, rear 12.5 kN", () => {
    // Lever rule, statics of a simply supported beam (C)
    const r = leverRule({ massKg: 10_000, xMm: 10_000 }, 8000);
    expect(r.frontKg).toBeCloseTo(-2500, 9);
    expect(r.rearKg).toBeCloseTo(12_500, 9);
  });

  it("100 kg at 1.0 m, WB 3.0 m → 66.67 / 33.33 kg", () => {
    // Lever rule, statics of a simply supported beam (C)
    const r = leverRule({ massKg: 100, xMm: 1000 }, 3000);
    expect(r.frontKg).toBeCloseTo(66.67, 2);
    expect(r.rearKg).toBeCloseTo(33.33, 2);
  });

  it("100 kg at 3.8 m, WB 3.0 m → −26.67 / 126.67 kg: behind the rear axle it unloads the front", () => {
    // Lever rule, statics of a simply supported beam (C)
    const r = leverRule({ massKg: 100, xMm: 3800 }, 3000);
    expect(r.frontKg).toBeCloseTo(-26.67, 2);
    expect(r.rearKg).toBeCloseTo(126.67, 2);
  });

  it("rejects bad input naming the field", () => {
    expect(() => leverRule({ massKg: 100, xMm: 1000 }, 0)).toThrow(InputError);
    try {
      leverRule({ massKg: Number.NaN, xMm: 1000 }, 3000, "items.2");
      expect.unreachable();
    } catch (e) {
      expect((e as InputError).field).toBe("items.2.massKg");
    }
  });
});

describe("zones", () => {
  it("place items by the common-practice defaults", () => {
    // Common practice defaults (no published source): bar 600 mm ahead of the front axle,
    // towball 1100 mm behind the rear axle, tub over the rear axle.
    expect(DEFAULT_ZONE_POSITIONS.front).toEqual({ kind: "behindFrontAxle", mm: -600 });
    expect(zoneXMm("front", 3000)).toBe(-600);
    expect(zoneXMm("tub", 3000)).toBe(3000);
    expect(zoneXMm("roof", 3000)).toBe(1500);
    expect(zoneXMm("rearOverhang", 3000)).toBe(3800);
    expect(zoneXMm("towbar", 3000)).toBe(4100);
  });

  it("take a platform's own positions first", () => {
    expect(zoneXMm("towbar", 3000, { towbar: { kind: "behindRearAxle", mm: 950 } })).toBe(3950);
    expect(zoneXMm("cab", 3200, { cab: { kind: "fraction", fraction: 0.25 } })).toBe(800);
  });

  it("reject an unknown zone", () => {
    expect(() => zoneXMm("bonnet" as never, 3000)).toThrow(InputError);
  });
});
