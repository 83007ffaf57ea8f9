import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  awgAreaMm2,
  awgDiameterMm,
  awgLabel,
  conductorResistanceOhm,
  conductorResistanceOhmPerKm,
  copperResistivityOhmMm2PerM,
  minAreaForDropMm2,
  nextSizeAtOrAbove,
  voltageDrop,
} from "@/lib/electrical";
import { InputError } from "@/lib/errors";

describe("copper resistivity", () => {
  it("is 0.017241 Ω·mm²/m (1/58) at 20 °C", () => {
    // IEC 60028 (S): annealed copper 0.017241 Ω·mm²/m at 20 °C
    expect(copperResistivityOhmMm2PerM(20)).toBe(0.017241);
    expect(copperResistivityOhmMm2PerM()).toBe(0.017241);
    expect(1 / 58).toBeCloseTo(copperResistivityOhmMm2PerM(20), 6);
  });

  it("rises by α = 0.00393 /°C", () => {
    // IEC 60028 (S): ρ(50 °C) = 0.017241 × (1 + 0.00393 × 30) = 0.0192737 (hand-worked)
    expect(copperResistivityOhmMm2PerM(50)).toBeCloseTo(0.0192737, 6);
  });

  it("refuses temperatures outside the loom's range", () => {
    expect(() => copperResistivityOhmMm2PerM(500)).toThrow(InputError);
    expect(() => copperResistivityOhmMm2PerM(Number.NaN)).toThrow(InputError);
  });
});

describe("conductor resistance", () => {
  it("6 mm² plain copper is within the IEC 60228 class 2 and class 5 maxima", () => {
    const ohmPerKm = conductorResistanceOhmPerKm(6);
    // IEC 60228 maximum conductor resistance, 6 mm² plain copper: 3.08 Ω/km class 2 (S)
    expect(ohmPerKm).toBeLessThanOrEqual(3.08);
    // IEC 60228, 6 mm² class 5 (flexible): 3.30 Ω/km (S)
    expect(ohmPerKm).toBeLessThanOrEqual(3.3);
    // IEC 60028 (S): 0.017241 / 6 × 1000 = 2.8735 Ω/km (hand-worked)
    expect(ohmPerKm).toBeCloseTo(2.8735, 4);
  });

  it("a 10 m loop of 6 mm² is 0.028735 Ω", () => {
    // Two-wire DC drop case (C): R = 0.028735 Ω for 5 m one way of 6 mm²
    expect(conductorResistanceOhm({ areaMm2: 6, lengthM: 10 })).toBeCloseTo(0.028735, 6);
  });
});

describe("AWG sizes by the ASTM B258 formula", () => {
  // ASTM B258 (S) diameter formula; areas (C)
  const published: Array<[number, number]> = [
    [4, 21.15],
    [6, 13.3],
    [8, 8.366],
    [10, 5.261],
    [12, 3.309],
    [14, 2.081],
    [16, 1.309],
  ];
  it.each(published)("%i AWG is %f mm²", (gauge, areaMm2) => {
    // ASTM B258 (S), area computed from the diameter (C)
    expect(awgAreaMm2(gauge)).toBeCloseTo(areaMm2, areaMm2 < 10 ? 3 : 2);
  });

  it("36 AWG is 0.127 mm and 4/0 is labelled as such", () => {
    // ASTM B258 (S): d = 0.127 × 92^0 at n = 36
    expect(awgDiameterMm(36)).toBeCloseTo(0.127, 9);
    expect(awgLabel(-3)).toBe("4/0 AWG");
    expect(awgLabel(8)).toBe("8 AWG");
  });

  it("refuses gauges that do not exist", () => {
    expect(() => awgAreaMm2(3.5)).toThrow(InputError);
    expect(() => awgAreaMm2(-4)).toThrow(InputError);
  });
});

describe("voltageDrop", () => {
  it("20 A over 5 m one way on 6 mm² at 12 V drops 0.575 V = 4.79 %", () => {
    // Two-wire DC drop V = I ρ 2L / A, case (C): 0.575 V, 4.79 %
    const result = voltageDrop({ currentA: 20, lengthOneWayM: 5, areaMm2: 6, systemV: 12 });
    expect(result.loopResistanceOhm).toBeCloseTo(0.028735, 6);
    expect(result.dropV).toBeCloseTo(0.575, 3);
    expect(result.dropPct).toBeCloseTo(4.79, 2);
    // ABYC E-11 (S): fails the 3 % limit for critical circuits, passes the 10 % one
    expect(result.dropPct).toBeGreaterThan(3);
    expect(result.dropPct).toBeLessThanOrEqual(10);
  });

  it("at 50 °C the same run drops 0.642 V", () => {
    // IEC 60028 temperature coefficient (S), case (C): 0.642 V at 50 °C
    const result = voltageDrop({ currentA: 20, lengthOneWayM: 5, areaMm2: 6, systemV: 12, temperatureC: 50 });
    expect(result.dropV).toBeCloseTo(0.642, 3);
  });

  it("the smallest cable for 3 % is 9.58 mm², next standard size 10 mm²", () => {
    // Case (C): minimum 9.58 mm² → next standard size 10 mm²
    const minAreaMm2 = minAreaForDropMm2({ currentA: 20, lengthOneWayM: 5, systemV: 12, maxDropPct: 3 });
    expect(minAreaMm2).toBeCloseTo(9.58, 2);
    expect(nextSizeAtOrAbove(minAreaMm2)?.areaMm2).toBe(10);
  });

  it("refuses non-physical input with the field named", () => {
    expect(() => voltageDrop({ currentA: 20, lengthOneWayM: 5, areaMm2: 0, systemV: 12 })).toThrow(
      expect.objectContaining({ field: "areaMm2" }),
    );
    expect(() => voltageDrop({ currentA: -1, lengthOneWayM: 5, areaMm2: 6, systemV: 12 })).toThrow(InputError);
    expect(() => voltageDrop({ currentA: 1, lengthOneWayM: Infinity, areaMm2: 6, systemV: 12 })).toThrow(InputError);
  });

  const current = fc.double({ min: 0.1, max: 200, noNaN: true });
  const length = fc.double({ min: 0.1, max: 30, noNaN: true });
  const area = fc.double({ min: 0.5, max: 120, noNaN: true });

  it("drop falls as the cross-section grows", () => {
    fc.assert(
      fc.property(current, length, area, area, (currentA, lengthOneWayM, a, b) => {
        // A real difference in size, not two neighbouring floating-point values.
        fc.pre(b > a * 1.001);
        const thin = voltageDrop({ currentA, lengthOneWayM, areaMm2: a, systemV: 12 });
        const thick = voltageDrop({ currentA, lengthOneWayM, areaMm2: b, systemV: 12 });
        expect(thick.dropV).toBeLessThan(thin.dropV);
      }),
    );
  });

  it("drop rises with length", () => {
    fc.assert(
      fc.property(current, length, length, area, (currentA, a, b, areaMm2) => {
        fc.pre(b > a * 1.001);
        const short = voltageDrop({ currentA, lengthOneWayM: a, areaMm2, systemV: 12 });
        const long = voltageDrop({ currentA, lengthOneWayM: b, areaMm2, systemV: 12 });
        expect(long.dropV).toBeGreaterThan(short.dropV);
      }),
    );
  });

  it("the minimum area gives exactly the allowed drop", () => {
    fc.assert(
      fc.property(current, length, fc.double({ min: 0.5, max: 20, noNaN: true }), (currentA, lengthOneWayM, maxDropPct) => {
        const areaMm2 = minAreaForDropMm2({ currentA, lengthOneWayM, systemV: 24, maxDropPct });
        expect(voltageDrop({ currentA, lengthOneWayM, areaMm2, systemV: 24 }).dropPct).toBeCloseTo(maxDropPct, 9);
      }),
    );
  });
});
