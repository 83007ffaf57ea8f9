import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { InputError } from "@/lib/errors";
import { exactDecimal, GST_RATE_PERCENT, gstInInclusive, gstOnExclusive, roundHalfUp, withGst } from "@/lib/money";

describe("GST on single amounts", () => {
  it("the rate is 10 %", () => {
    // A New Tax System (Goods and Services Tax Imposition—General) Act 1999 s 4 (P)
    expect(GST_RATE_PERCENT).toBe(10);
  });

  it("$100.00 excluding GST carries $10.00 GST", () => {
    // GST Act 1999 s 4 (P): 10 % of $100.00
    expect(gstOnExclusive(10000)).toBe(1000);
    expect(withGst(10000)).toBe(11000);
  });

  it("$110.00 including GST contains $10.00 GST (1/11)", () => {
    // GST Act 1999 s 4 (P): GST in a fully taxable GST-inclusive price is 1/11
    expect(gstInInclusive(11000)).toBe(1000);
  });

  it("$12.35 excluding GST, one line: 1.235 → $1.24", () => {
    // GST Act s 9-90 (P): nearest cent, 0.5 c rounds up
    expect(gstOnExclusive(1235)).toBe(124);
  });

  it("rounds half a cent up and below half down", () => {
    // GST Act s 9-90 (P): 0.5 c up — hand-worked: 5 c → 0.5 → 1 c; 4 c → 0.4 → 0 c; 14 c → 1.4 → 1 c
    expect(gstOnExclusive(5)).toBe(1);
    expect(gstOnExclusive(4)).toBe(0);
    expect(gstOnExclusive(14)).toBe(1);
    // 1/11 of $1.10 = 10 c exactly; 1/11 of 6 c = 0.545 → 1 c; 1/11 of 5 c = 0.4545 → 0 c (hand-worked)
    expect(gstInInclusive(110)).toBe(10);
    expect(gstInInclusive(6)).toBe(1);
    expect(gstInInclusive(5)).toBe(0);
  });

  it("a credit rounds like the charge it reverses", () => {
    // GST Act s 9-90 (P) applied to the magnitude: −$12.35 → −$1.24
    expect(gstOnExclusive(-1235)).toBe(-124);
    expect(gstInInclusive(-11000)).toBe(-1000);
  });

  it("is exact for the largest amounts JavaScript holds", () => {
    // 10 % of 9,007,199,254,740,990 c is 900,719,925,474,099 c exactly (hand-worked)
    expect(gstOnExclusive(9007199254740990)).toBe(900719925474099);
  });

  it("refuses fractions of a cent and non-numbers", () => {
    expect(() => gstOnExclusive(12.5)).toThrow(InputError);
    expect(() => gstInInclusive(Number.NaN)).toThrow(InputError);
    expect(() => withGst(Number.MAX_SAFE_INTEGER)).toThrow(InputError);
  });

  it("the GST inside a price equals the GST that was added to it", () => {
    // Follows from GST Act s 4 and s 9-90 (P): x + round(x/10) contains round(x/10) at 1/11
    fc.assert(
      fc.property(fc.integer({ min: -1e12, max: 1e12 }), (exclusiveCents) => {
        expect(gstInInclusive(withGst(exclusiveCents))).toBe(gstOnExclusive(exclusiveCents));
      }),
    );
  });
});

describe("exact arithmetic helpers", () => {
  it("reads a decimal as written", () => {
    expect(exactDecimal("q", 1.5)).toEqual({ numerator: 15n, denominator: 10n });
    expect(exactDecimal("q", 0.1)).toEqual({ numerator: 1n, denominator: 10n });
    expect(exactDecimal("q", 1e-7)).toEqual({ numerator: 1n, denominator: 10000000n });
    expect(exactDecimal("q", 2e21)).toEqual({ numerator: 2000000000000000000000n, denominator: 1n });
    expect(() => exactDecimal("q", Infinity)).toThrow(InputError);
  });

  it("rounds half away from zero", () => {
    // GST Act s 9-90 (P): 0.5 up
    expect(roundHalfUp(5n, 10n)).toBe(1n);
    expect(roundHalfUp(-5n, 10n)).toBe(-1n);
    expect(roundHalfUp(49n, 100n)).toBe(0n);
    expect(() => roundHalfUp(1n, 0n)).toThrow(InputError);
  });
});
