import { describe, expect, it } from "vitest";
import { InputError } from "@/lib/errors";
import { reconcileWeighbridge } from "@/lib/mass";

// Invented ticket figures; expected values hand-worked in the comments (measured − computed).
const computed = { frontKg: 1290, rearKg: 1560, grossKg: 2850 };

describe("reconcileWeighbridge", () => {
  it("compares each axle and the gross within a kg tolerance", () => {
    // Hand-worked: 1310 − 1290 = +20 (within 30); 1600 − 1560 = +40 (beyond 30); gross 2910 − 2850 = +60
    const r = reconcileWeighbridge(computed, { frontKg: 1310, rearKg: 1600 }, { kg: 30 });
    expect(r.measuredGrossKg).toBe(2910); // defaults to front + rear
    expect(r.rows.map((x) => [x.what, x.differenceKg, x.withinTolerance])).toEqual([
      ["front", 20, true],
      ["rear", 40, false],
      ["gross", 60, false],
    ]);
    expect(r.flags.map((f) => f.code)).toEqual(["rear-differs", "gross-differs"]);
    expect(r.grossVsAxleSum).toBeUndefined();
    expect(r.ok).toBe(false);
  });

  it("takes a percentage tolerance of the measured figure", () => {
    // Hand-worked: 2 % of 1310 = 26.2 kg; 2 % of 1600 = 32 kg; 2 % of 2910 = 58.2 kg
    const r = reconcileWeighbridge(computed, { frontKg: 1310, rearKg: 1590 }, { pct: 2 });
    expect(r.rows[0]?.toleranceKg).toBeCloseTo(26.2, 9);
    expect(r.rows.every((x) => x.withinTolerance)).toBe(true);
    expect(r.rows[1]?.differencePct).toBeCloseTo((30 / 1560) * 100, 9);
    expect(r.ok).toBe(true);
  });

  it("flags a ticket whose gross disagrees with its own axle sum", () => {
    // Hand-worked: axle sum 1300 + 1550 = 2850, gross 2950 → 100 kg apart, beyond 30
    const r = reconcileWeighbridge(computed, { frontKg: 1300, rearKg: 1550, grossKg: 2950 }, { kg: 30 });
    expect(r.grossVsAxleSum).toEqual({ differenceKg: 100, toleranceKg: 30, consistent: false });
    expect(r.flags.map((f) => f.code)).toContain("gross-inconsistent");
    const fine = reconcileWeighbridge(computed, { frontKg: 1300, rearKg: 1550, grossKg: 2860 }, { kg: 30 });
    expect(fine.grossVsAxleSum?.consistent).toBe(true);
    expect(fine.ok).toBe(true);
  });

  it("rejects bad input naming the field", () => {
    expect(() => reconcileWeighbridge(computed, { frontKg: -1, rearKg: 1500 }, { kg: 30 })).toThrow(InputError);
    try {
      reconcileWeighbridge(computed, { frontKg: 1300, rearKg: 1500 }, { pct: Number.NaN });
      expect.unreachable();
    } catch (e) {
      expect((e as InputError).field).toBe("tolerance.pct");
    }
    expect(() => reconcileWeighbridge(computed, { frontKg: 1300, rearKg: 1500 }, {} as never)).toThrow(InputError);
  });
});
