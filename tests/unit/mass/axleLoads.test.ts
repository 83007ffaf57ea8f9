import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { InputError } from "@/lib/errors";
import { axleLoads, axleLoadsInputSchema, type AxleLoadsInput } from "@/lib/mass";

// Invented vehicle: wheelbase 3000 mm, kerb 1200 front / 950 rear (2150 kg).
const base: AxleLoadsInput = {
  wheelbaseMm: 3000,
  base: { frontKg: 1200, rearKg: 950 },
  ratings: { frontKg: 1450, rearKg: 1880, gvmKg: 3100, gcmKg: 5900 },
  items: [],
};

describe("axleLoads", () => {
  it("adds items by the lever rule", () => {
    // Lever rule (C): 100 kg at 1.0 m on WB 3.0 m → 66.67 / 33.33; 100 kg at 3.8 m → −26.67 / 126.67
    const r = axleLoads({ ...base, items: [{ massKg: 100, xMm: 1000 }, { label: "second spare", massKg: 100, xMm: 3800 }] });
    expect(r.frontKg).toBeCloseTo(1200 + 66.667 - 26.667, 2);
    expect(r.rearKg).toBeCloseTo(950 + 33.333 + 126.667, 2);
    expect(r.grossKg).toBeCloseTo(2350, 9);
    expect(r.headroom.gvmKg).toBeCloseTo(750, 9);
    expect(r.headroom.frontKg).toBeCloseTo(1450 - 1240, 2);
  });

  it("the towing case: vehicle 2,968 kg ≤ GVM 3,100; combination 5,218 kg ≤ GCM 5,900", () => {
    // ADR Definitions and Vehicle Categories (S); Qld mass regulation 2005 s 48(2) (P); case (C):
    // tare 2,150 + fit-out 350 + occupants 160 + 70 L diesel × 0.832 = 58 + towball 250 = 2,968;
    // GTM = 2,500 − 250 = 2,250; combination 2,968 + 2,250 = 5,218.
    const r = axleLoads({
      ...base,
      items: [
        { label: "fit-out", massKg: 350, xMm: 2400 },
        { label: "occupants", massKg: 160, xMm: 1100 },
        { label: "diesel 70 L", massKg: 70 * 0.832, xMm: 1500 },
      ],
      trailer: { atmKg: 2500, towballKg: 250 },
    });
    expect(Math.round(r.grossKg)).toBe(2968);
    expect(r.headroom.gvmKg).toBeGreaterThan(0);
    expect(Math.round(5900 - (r.headroom.gcmKg ?? Number.NaN))).toBe(5218);
    expect(r.headroom.gcmKg).toBeGreaterThan(0);
  });

  it("puts the towball download behind the rear axle (default towbar position)", () => {
    // Lever rule (C): 250 kg at 4100 mm on WB 3000 → front −91.67, rear 341.67 (hand-worked)
    const r = axleLoads({ ...base, trailer: { atmKg: 2500, towballKg: 250 } });
    expect(r.frontKg).toBeCloseTo(1200 - 91.667, 2);
    expect(r.rearKg).toBeCloseTo(950 + 341.667, 2);
    const at = axleLoads({ ...base, trailer: { atmKg: 2500, towballKg: 250 }, towballXMm: 3900 });
    expect(at.rearKg).toBeCloseTo(950 + 325, 6); // 250 × 3900 / 3000
  });

  it("names the binding limit with its margin", () => {
    // Invented heavy rear load, hand-worked: 600 kg over the rear axle → rear 1550 (headroom 330)
    // binds before GVM (350) and the front (1600 − 1200 = 400).
    const ratings = { frontKg: 1600, rearKg: 1880, gvmKg: 3100 };
    const r = axleLoads({ ...base, ratings, items: [{ massKg: 600, xMm: 3000 }] });
    expect(r.binding.limit).toBe("rear");
    expect(r.binding.marginKg).toBeCloseTo(330, 9);
    // Hand-worked: 1000 kg mid-wheelbase → 1700 / 1450 on 2000 / 2000 axles, gross 3150 > GVM 3100
    const over = axleLoads({ ...base, ratings: { frontKg: 2000, rearKg: 2000, gvmKg: 3100 }, items: [{ massKg: 1000, xMm: 1500 }] });
    expect(over.binding).toEqual({ limit: "gvm", marginKg: -50 });
  });

  it("omits GCM headroom when no GCM is rated", () => {
    const r = axleLoads({ ...base, ratings: { frontKg: 1450, rearKg: 1880, gvmKg: 3100 } });
    expect(r.headroom.gcmKg).toBeUndefined();
    expect("gcmKg" in r.headroom).toBe(false);
  });

  it("throws InputError naming the field", () => {
    try {
      axleLoads({ ...base, items: [{ massKg: 10, xMm: 0 }, { massKg: -5, xMm: 100 }] });
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(InputError);
      expect((e as InputError).field).toBe("items.1.massKg");
    }
    expect(() => axleLoads({ ...base, trailer: { atmKg: 100, towballKg: 200 } })).toThrow(/towball/);
    expect(() => axleLoads({ ...base, wheelbaseMm: Number.POSITIVE_INFINITY })).toThrow(InputError);
  });
});

describe("axleLoadsInputSchema", () => {
  it("accepts the contract and rejects bad fields with their path", () => {
    const ok = axleLoadsInputSchema.safeParse({ ...base, items: [{ label: "bar", massKg: 70, xMm: -600 }], trailer: { atmKg: 2500, towballKg: 250 } });
    expect(ok.success).toBe(true);
    if (ok.success) expect(() => axleLoads(ok.data)).not.toThrow();
    const bad = axleLoadsInputSchema.safeParse({ ...base, items: [{ massKg: "heavy", xMm: 0 }] });
    expect(bad.error?.issues[0]?.path).toEqual(["items", 0, "massKg"]);
    const ball = axleLoadsInputSchema.safeParse({ ...base, trailer: { atmKg: 100, towballKg: 200 } });
    expect(ball.error?.issues[0]?.path).toEqual(["trailer", "towballKg"]);
    const inf = axleLoadsInputSchema.safeParse({ ...base, wheelbaseMm: Infinity });
    expect(inf.success).toBe(false);
  });
});

describe("axleLoads properties", () => {
  const item = fc.record({ massKg: fc.double({ min: 0, max: 2000, noNaN: true }), xMm: fc.double({ min: -1500, max: 6000, noNaN: true }) });
  const input = fc.record({
    wheelbaseMm: fc.double({ min: 1500, max: 5000, noNaN: true }),
    front: fc.double({ min: 0, max: 3000, noNaN: true }),
    rear: fc.double({ min: 0, max: 3000, noNaN: true }),
    items: fc.array(item, { maxLength: 12 }),
    trailer: fc.option(fc.record({ atmKg: fc.double({ min: 0, max: 3500, noNaN: true }), share: fc.double({ min: 0, max: 0.2, noNaN: true }) }), { nil: undefined }),
  });
  type Gen = {
    wheelbaseMm: number;
    front: number;
    rear: number;
    items: Array<{ massKg: number; xMm: number }>;
    trailer?: { atmKg: number; share: number };
  };
  const toInput = (v: Gen): AxleLoadsInput => ({
    wheelbaseMm: v.wheelbaseMm,
    base: { frontKg: v.front, rearKg: v.rear },
    ratings: { frontKg: 1500, rearKg: 2000, gvmKg: 3300, gcmKg: 6000 },
    items: v.items,
    ...(v.trailer ? { trailer: { atmKg: v.trailer.atmKg, towballKg: v.trailer.atmKg * v.trailer.share } } : {}),
  });

  it("front + rear always equals gross, and every figure is finite", () => {
    // Lever rule (S): the two reactions always sum to the load
    fc.assert(
      fc.property(input, (v) => {
        const r = axleLoads(toInput(v));
        const expected = v.front + v.rear + v.items.reduce((s, i) => s + i.massKg, 0) + (v.trailer ? v.trailer.atmKg * v.trailer.share : 0);
        expect(r.frontKg + r.rearKg).toBeCloseTo(r.grossKg, 6);
        expect(r.grossKg).toBeCloseTo(expected, 6);
        for (const x of [r.frontKg, r.rearKg, r.grossKg, r.binding.marginKg, ...Object.values(r.headroom)]) {
          expect(Number.isFinite(x)).toBe(true);
        }
      }),
    );
  });

  it("moving an item rearward never raises the front load", () => {
    // Lever rule (S): front share W·(WB − x)/WB falls as x grows
    fc.assert(
      fc.property(input, fc.nat({ max: 11 }), fc.double({ min: 0, max: 3000, noNaN: true }), (v, idx, moveMm) => {
        fc.pre(v.items.length > 0);
        const i = idx % v.items.length;
        const before = axleLoads(toInput(v));
        const moved = v.items.map((it, j) => (j === i ? { ...it, xMm: it.xMm + moveMm } : it));
        const after = axleLoads(toInput({ ...v, items: moved }));
        expect(after.frontKg).toBeLessThanOrEqual(before.frontKg + 1e-6);
      }),
    );
  });

  it("adding mass never increases GVM headroom", () => {
    fc.assert(
      fc.property(input, item, (v, extra) => {
        const before = axleLoads(toInput(v));
        const after = axleLoads(toInput({ ...v, items: [...v.items, extra] }));
        expect(after.headroom.gvmKg).toBeLessThanOrEqual(before.headroom.gvmKg + 1e-6);
      }),
    );
  });
});
