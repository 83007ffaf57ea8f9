import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { InputError } from "@/lib/errors";
import { quoteTotals, quoteTotalsInputSchema, type QuoteLineInput } from "@/lib/money";

const bashPlate = (unitPriceCents: number): Extract<QuoteLineInput, { kind: "part" | "other" }> => ({
  kind: "part",
  description: "Bash plate bolt kit",
  quantity: 1,
  unitPriceCents,
  taxable: true,
});

describe("quoteTotals", () => {
  it("two lines of $12.35: summed then rounded gives $2.47 GST", () => {
    const result = quoteTotals([bashPlate(1235), bashPlate(1235)], "invoice-total");
    // GST Act s 9-90 (P): several supplies, sum unrounded (2.470) then round → $2.47
    expect(result.method).toBe("invoice-total");
    expect(result.totals.gstCents).toBe(247);
    expect(result.totals.exGstCents).toBe(2470);
    expect(result.totals.inclGstCents).toBe(2717);
    // Each line's exact GST: 1,235 c × 10 % = 123.5 c = 1,235 tenths of a cent (hand-worked)
    expect(result.lines[0]?.gstTenthsOfCent).toBe(1235);
    expect(result.methodDescription).toMatch(/once on the total/);
  });

  it("the same lines rounded per line give $2.48 GST", () => {
    const result = quoteTotals([bashPlate(1235), bashPlate(1235)], "per-line");
    // GST Act s 9-90 (P): round each line (1.235 → 1.24) then total → $2.48
    expect(result.method).toBe("per-line");
    expect(result.lines.map((line) => line.gstCents)).toEqual([124, 124]);
    expect(result.totals.gstCents).toBe(248);
    expect(result.methodDescription).toMatch(/each line/);
  });

  it("labour is hours × rate, a fractional amount rounded half a cent up", () => {
    const result = quoteTotals(
      [{ kind: "labour", description: "Fit and wire dual-battery tray", hours: 1.5, rateCents: 9533, taxable: true }],
      "per-line",
    );
    // Hand-worked: 1.5 h × 9,533 c = 14,299.5 c → 14,300 c (half up, GST Act s 9-90 (P) rule);
    // GST 10 % (GST Act s 4, P) = 1,430 c
    expect(result.lines[0]).toMatchObject({ exGstCents: 14300, amountRounded: true, gstCents: 1430, inclGstCents: 15730 });
    expect(result.totals.byKindExGstCents).toEqual({ part: 0, labour: 14300, other: 0 });
    expect(result.methodDescription).toMatch(/fraction of a cent/);
  });

  it("keeps decimal quantities exact where floating point would drift", () => {
    // Hand-worked: 2.3 × 25 c = 57.5 c → 58 c (half up). In floating point 2.3 × 25 is
    // 57.49999999999999, which would round down.
    expect(2.3 * 25).toBeLessThan(57.5);
    const result = quoteTotals([{ kind: "other", quantity: 2.3, unitPriceCents: 25, taxable: false }], "per-line");
    expect(result.lines[0]?.exGstCents).toBe(58);
  });

  it("GST-free lines carry no GST and are totalled apart", () => {
    const result = quoteTotals(
      [
        bashPlate(10000),
        { kind: "other", description: "Registration transfer fee", quantity: 1, unitPriceCents: 4500, taxable: false },
        { kind: "other", description: "Fleet discount", quantity: 1, unitPriceCents: -1000, taxable: true },
      ],
      "invoice-total",
    );
    // GST Act s 4 (P): 10 % of the taxable $90.00 = $9.00 (hand-worked)
    expect(result.totals).toEqual({
      exGstCents: 13500,
      taxableExGstCents: 9000,
      gstFreeExGstCents: 4500,
      gstCents: 900,
      inclGstCents: 14400,
      byKindExGstCents: { part: 10000, labour: 0, other: 3500 },
    });
    expect(result.lines[1]?.gstCents).toBe(0);
  });

  it("an empty quote totals zero", () => {
    expect(quoteTotals([], "per-line").totals.inclGstCents).toBe(0);
  });

  it("refuses bad lines, naming the field", () => {
    expect(() => quoteTotals([{ ...bashPlate(100), quantity: -1 }], "per-line")).toThrow(
      expect.objectContaining({ field: "lines.0.quantity" }),
    );
    expect(() => quoteTotals([bashPlate(100), bashPlate(10.5)], "per-line")).toThrow(
      expect.objectContaining({ field: "lines.1.unitPriceCents" }),
    );
    expect(() => quoteTotals([bashPlate(100)], "rounded" as "per-line")).toThrow(InputError);
  });

  it("the schema reads a request body and strips what a labour line does not use", () => {
    const parsed = quoteTotalsInputSchema.parse({
      method: "per-line",
      lines: [{ kind: "labour", hours: 2, rateCents: 12000, taxable: true, quantity: 1, unitPriceCents: 0 }],
    });
    expect(parsed.lines[0]).toEqual({ kind: "labour", hours: 2, rateCents: 12000, taxable: true });
    const bad = quoteTotalsInputSchema.safeParse({
      method: "per-line",
      lines: [{ kind: "part", quantity: 1, unitPriceCents: 12.5, taxable: true }, { kind: "bolt" }],
    });
    expect(bad.success).toBe(false);
    expect(bad.error?.issues.map((issue) => issue.path.join("."))).toEqual(
      expect.arrayContaining(["lines.0.unitPriceCents", "lines.1.kind"]),
    );
  });

  it("per-line GST differs from invoice-total GST by at most half a cent per taxable line", () => {
    // GST Act s 9-90 (P): each rounding moves an amount by at most half a cent
    const line = fc.record({
      quantity: fc.integer({ min: 0, max: 20 }),
      unitPriceCents: fc.integer({ min: -50000, max: 500000 }),
      taxable: fc.boolean(),
    });
    fc.assert(
      fc.property(fc.array(line, { maxLength: 30 }), (raw) => {
        const lines = raw.map((l): QuoteLineInput => ({ kind: "part", ...l }));
        const perLine = quoteTotals(lines, "per-line").totals.gstCents;
        const invoice = quoteTotals(lines, "invoice-total").totals.gstCents;
        const taxableLines = lines.filter((l) => l.taxable).length;
        expect(Math.abs(perLine - invoice)).toBeLessThanOrEqual(taxableLines / 2);
      }),
    );
  });
});
