import { describe, expect, it } from "vitest";
import { InputError } from "@/lib/errors";
import {
  allowedIndicatedRangeKmh,
  speedometerCompliant,
  speedometerRows,
  trueSpeedRangeForIndicatedKmh,
} from "@/lib/tyres";

describe("speedometer accuracy rule", () => {
  it("allows the published indicated range at each true speed", () => {
    // UN Regulation 39 ¶5.3, ADR 18/03 (P): 0 ≤ V1 − V2 ≤ 0.1 × V2 + 4
    const table: Array<[number, number, number]> = [
      [50, 50, 59],
      [70, 70, 81],
      [90, 90, 103],
      [100, 100, 114],
      [110, 110, 125],
      [130, 130, 147],
    ];
    for (const [v2, min, max] of table) {
      const r = allowedIndicatedRangeKmh(v2);
      expect(r.minKmh).toBeCloseTo(min, 9);
      expect(r.maxKmh).toBeCloseTo(max, 9);
      expect(speedometerCompliant(min, v2)).toBe(true);
      expect(speedometerCompliant(max, v2)).toBe(true);
      expect(speedometerCompliant(max + 0.01, v2)).toBe(false);
      expect(speedometerCompliant(min - 0.01, v2)).toBe(false); // never reads low
    }
  });

  it("indicated 100 km/h means a true 87.27–100 km/h", () => {
    // UN Regulation 39 ¶5.3, ADR 18/03 (C)
    const r = trueSpeedRangeForIndicatedKmh(100);
    expect(r.minKmh).toBeCloseTo(87.27, 2);
    expect(r.maxKmh).toBe(100);
  });
});

describe("speedometerRows after a tyre change", () => {
  // 265/70R17 → 285/70R17: diameter ratio 830.8 / 802.8 = 1.03488
  const ratio = 830.8 / 802.8;

  it("a speedometer exact on the old tyres reads low on the larger ones", () => {
    // UN Regulation 39 ¶5.3, ADR 18/03 (C): indicated 100 → true 103.49, V1 − V2 = −3.49 → fails
    const [row] = speedometerRows({ diameterRatio: ratio, speedsKmh: [100] });
    expect(ratio).toBeCloseTo(1.03488, 5);
    expect(row?.trueNewKmh).toBeCloseTo(103.49, 2);
    expect(row?.readsHighKmh).toBeCloseTo(-3.49, 2);
    expect(row?.compliant).toBe(false);
    expect(row?.compliantOld).toBe(true);
  });

  it("one that read 100 at a true 95 on the old tyres still passes", () => {
    // UN Regulation 39 ¶5.3, ADR 18/03 (C): true becomes 98.31, V1 − V2 = 1.69 ≤ 13.83 → passes
    const [row] = speedometerRows({ diameterRatio: ratio, speedoReadsHighPct: 5, speedsKmh: [100] });
    expect(row?.trueOldKmh).toBeCloseTo(95, 9);
    expect(row?.trueNewKmh).toBeCloseTo(98.31, 2);
    expect(row?.readsHighKmh).toBeCloseTo(1.69, 2);
    expect(row?.allowedHighKmh).toBeCloseTo(13.83, 2);
    expect(row?.compliant).toBe(true);
  });

  it("tabulates the default speeds", () => {
    const rows = speedometerRows({ diameterRatio: 1 });
    expect(rows.map((r) => r.indicatedKmh)).toEqual([40, 60, 80, 100, 110, 130]);
    // Same tyres, exact speedometer: V1 − V2 = 0 is allowed (UN Regulation 39 ¶5.3, ADR 18/03 (P))
    expect(rows.every((r) => r.compliant && r.readsHighKmh === 0)).toBe(true);
  });

  it("rejects bad input naming the field", () => {
    expect(() => speedometerRows({ diameterRatio: 0 })).toThrow(InputError);
    expect(() => speedometerRows({ diameterRatio: 1, speedoReadsHighPct: 80 })).toThrow(/speedoReadsHighPct/);
    try {
      speedometerRows({ diameterRatio: 1, speedsKmh: [60, -5] });
      expect.unreachable();
    } catch (e) {
      expect((e as InputError).field).toBe("speedsKmh.1");
    }
  });
});
