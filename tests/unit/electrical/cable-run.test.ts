import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  cableRatingA,
  cableRun,
  cableRunInputSchema,
  FUSE_HEADROOM,
  fuseBetween,
  STANDARD_FUSE_RATINGS_A,
} from "@/lib/electrical";
import { InputError } from "@/lib/errors";

describe("cableRun", () => {
  it("the 20 A, 5 m, 6 mm² run fails the critical limit and is sized up to 10 mm²", () => {
    const result = cableRun({ currentA: 20, lengthOneWayM: 5, systemV: 12, areaMm2: 6, circuit: "critical" });
    // Two-wire DC drop case (C): 0.575 V = 4.79 %
    expect(result.dropV).toBeCloseTo(0.575, 3);
    expect(result.dropPct).toBeCloseTo(4.79, 2);
    // ABYC E-11 (S): 3 % for critical circuits → fails
    expect(result.maxDropPct).toBe(3);
    expect(result.withinLimit).toBe(false);
    expect(result.checked?.withinLimit).toBe(false);
    // Case (C): smallest cable for 3 % is 9.58 mm² → next standard size 10 mm²
    expect(result.minAreaMm2).toBeCloseTo(9.58, 2);
    expect(result.recommendedAreaMm2).toBe(10);
    expect(result.recommendedSizeLabel).toBe("10 mm²");
    // Fuse above the load and at or below the cable's rating (common practice):
    // 20 A × 1.25 = 25 A → the 25 A standard rating (hand-worked)
    expect(result.fuseA).toBe(25);
    expect(result.fuseA).toBeLessThanOrEqual(result.recommendedRatingA);
    expect(result.steppedUpForFuse).toBe(false);
    // Fuse as close to the battery (each supply end) as possible (common practice)
    expect(result.fuseLocation).toMatch(/close to the battery/);
    expect(result.fuseLocation).toMatch(/each end/);
    expect(result.notes.join(" ")).toMatch(/over the 3 % limit; use 10 mm²/);
  });

  it("the same run passes the 10 % limit for other circuits", () => {
    const result = cableRun({ currentA: 20, lengthOneWayM: 5, systemV: 12, areaMm2: 6, circuit: "other" });
    // ABYC E-11 (S): 10 % for other circuits → 4.79 % passes
    expect(result.maxDropPct).toBe(10);
    expect(result.maxDropFrom).toBe("other");
    expect(result.withinLimit).toBe(true);
    // Two-wire DC drop (C): 20 × 0.017241 × 10 / (0.10 × 12) = 2.8735 mm² → 4 mm² (hand-worked)
    expect(result.minAreaMm2).toBeCloseTo(2.8735, 4);
    expect(result.recommendedAreaMm2).toBe(4);
  });

  it("without a circuit kind or limit the stricter critical limit applies", () => {
    const result = cableRun({ currentA: 20, lengthOneWayM: 5, systemV: 12 });
    // ABYC E-11 (S): 3 % is the stricter of the two published limits
    expect(result.maxDropPct).toBe(3);
    expect(result.maxDropFrom).toBe("critical");
    expect(result.checked).toBeNull();
    // Without areaMm2 the drop shown is the recommended cable's. Two-wire DC drop, hand-worked:
    // 20 A × 0.017241 × 10 m / 10 mm² = 0.34482 V = 2.8735 % of 12 V
    expect(result.dropV).toBeCloseTo(0.34482, 5);
    expect(result.dropPct).toBeCloseTo(2.8735, 4);
  });

  it("an explicit limit overrides the circuit default", () => {
    const result = cableRun({ currentA: 20, lengthOneWayM: 5, systemV: 12, maxDropPct: 5, circuit: "critical" });
    expect(result.maxDropPct).toBe(5);
    expect(result.maxDropFrom).toBe("input");
    // Two-wire DC drop (C): 20 × 0.017241 × 10 / (0.05 × 12) = 5.747 mm² → 6 mm² (hand-worked)
    expect(result.minAreaMm2).toBeCloseTo(5.747, 3);
    expect(result.recommendedAreaMm2).toBe(6);
  });

  it("at 50 °C the drop of the 6 mm² run is 0.642 V", () => {
    // IEC 60028 temperature coefficient (S), case (C): 0.642 V
    const result = cableRun({ currentA: 20, lengthOneWayM: 5, systemV: 12, areaMm2: 6, temperatureC: 50, circuit: "other" });
    expect(result.dropV).toBeCloseTo(0.642, 3);
  });

  it("offers AWG sizes as an option", () => {
    const result = cableRun({ currentA: 20, lengthOneWayM: 5, systemV: 12, circuit: "critical", sizeSeries: "awg" });
    // Case (C) 9.58 mm² minimum; ASTM B258 areas (C): 8 AWG 8.366 is too small, 6 AWG 13.30 fits
    expect(result.recommendedSizeLabel).toBe("6 AWG");
    expect(result.recommendedAreaMm2).toBeCloseTo(13.3, 2);
  });

  it("steps the cable up when no standard fuse fits between the load and the cable rating", () => {
    // A short run: the drop alone allows the thinnest cable, but 18 A × 1.25 = 22.5 A needs a
    // 25 A fuse (common practice), more than a thin cable is rated for.
    const result = cableRun({ currentA: 18, lengthOneWayM: 0.5, systemV: 12, circuit: "other" });
    expect(result.steppedUpForFuse).toBe(true);
    expect(result.fuseA).toBe(25);
    expect(result.recommendedRatingA).toBeGreaterThanOrEqual(25);
    expect(cableRatingA(result.recommendedAreaMm2)).toBe(result.recommendedRatingA);
    expect(result.notes.join(" ")).toMatch(/stepped up to/);
  });

  it("says when the cable given carries the load within the drop limit but not the fuse", () => {
    const result = cableRun({ currentA: 18, lengthOneWayM: 0.5, systemV: 12, circuit: "other", areaMm2: 1 });
    expect(result.checked?.withinLimit).toBe(true);
    expect(result.notes.join(" ")).toMatch(/rated below the 25 A fuse/);
  });

  it("refuses loads beyond the largest standard fuse and runs no cable can serve", () => {
    expect(() => cableRun({ currentA: 250, lengthOneWayM: 1, systemV: 12 })).toThrow(
      expect.objectContaining({ field: "currentA" }),
    );
    expect(() => cableRun({ currentA: 100, lengthOneWayM: 40, systemV: 12 })).toThrow(
      expect.objectContaining({ field: "lengthOneWayM" }),
    );
    expect(() => cableRun({ currentA: 0, lengthOneWayM: 1, systemV: 12 })).toThrow(InputError);
    expect(() => cableRun({ currentA: 5, lengthOneWayM: 1, systemV: 12, circuit: "toString" as "other" })).toThrow(
      expect.objectContaining({ field: "circuit" }),
    );
    expect(() => cableRun({ currentA: 5, lengthOneWayM: 1, systemV: 12, maxDropPct: 0 })).toThrow(InputError);
  });

  it("every result keeps the fuse between the load and the cable, and the drop within the limit", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.5, max: 100, noNaN: true }),
        fc.double({ min: 0.2, max: 6, noNaN: true }),
        fc.constantFrom(12, 24),
        fc.constantFrom<"critical" | "other">("critical", "other"),
        (currentA, lengthOneWayM, systemV, circuit) => {
          let result;
          try {
            result = cableRun({ currentA, lengthOneWayM, systemV, circuit });
          } catch (error) {
            expect(error).toBeInstanceOf(InputError);
            return;
          }
          expect(result.fuseA).toBeGreaterThanOrEqual(currentA * FUSE_HEADROOM);
          expect(result.fuseA).toBeLessThanOrEqual(result.recommendedRatingA);
          expect(STANDARD_FUSE_RATINGS_A).toContain(result.fuseA);
          expect(result.recommendedAreaMm2).toBeGreaterThanOrEqual(result.minAreaMm2 * (1 - 1e-9));
          expect(result.dropPct).toBeLessThanOrEqual(result.maxDropPct * (1 + 1e-9));
        },
      ),
    );
  });
});

describe("fuseBetween", () => {
  it("picks the smallest standard rating at or above the load × 1.25 that the cable can carry", () => {
    // Common practice: 10 A × 1.25 = 12.5 A → 15 A fuse; on a 16 A cable it fits, on 10 A it does not
    expect(fuseBetween(10, 16)).toBe(15);
    expect(fuseBetween(10, 10)).toBeUndefined();
    // 4 A × 1.25 = 5 A exactly → 5 A (at or above)
    expect(fuseBetween(4, 6)).toBe(5);
  });
});

describe("cableRunInputSchema", () => {
  it("accepts the request body and rejects bad fields by path", () => {
    expect(cableRunInputSchema.parse({ currentA: 20, lengthOneWayM: 5, systemV: 12, circuit: "other" })).toEqual({
      currentA: 20,
      lengthOneWayM: 5,
      systemV: 12,
      circuit: "other",
    });
    const bad = cableRunInputSchema.safeParse({ currentA: -2, lengthOneWayM: 5, systemV: 12, circuit: "vital" });
    expect(bad.success).toBe(false);
    const paths = bad.error?.issues.map((issue) => issue.path.join("."));
    expect(paths).toEqual(expect.arrayContaining(["currentA", "circuit"]));
  });
});
