import { describe, expect, it } from "vitest";
import { quoteContentSchema, toTotalsLine } from "@/lib/jobs";
import { quoteTotals } from "@/lib/money";

describe("quote content input", () => {
  it("reads lines from JSON text (the editor's hidden field) or a list", () => {
    const lines = [{ kind: "part", description: "Recovery board pair", quantity: 1, unitPriceCents: 32_900, taxable: true }];
    expect(quoteContentSchema.parse({ lines: JSON.stringify(lines) }).lines).toHaveLength(1);
    expect(quoteContentSchema.parse({ lines }).lines[0]).toMatchObject({ kind: "part", lineKey: null });
  });

  it("names the field at fault", () => {
    const result = quoteContentSchema.safeParse({ lines: [{ kind: "labour", description: "Fit springs", hours: -1, rateCents: 14_000 }] });
    expect(result.success).toBe(false);
    expect(result.error?.issues[0]?.path).toEqual(["lines", 0, "hours"]);
    expect(quoteContentSchema.safeParse({ lines: [{ kind: "gift", description: "x" }] }).success).toBe(false);
    expect(quoteContentSchema.safeParse({ lines: [], validUntil: "not a date" }).error?.issues[0]?.path).toEqual(["validUntil"]);
  });

  it("turns labour into hours × rate for the totals", () => {
    const [line] = quoteContentSchema.parse({ lines: [{ kind: "labour", description: "Fit springs", hours: 2.5, rateCents: 14_000, taxable: true }] }).lines;
    expect(toTotalsLine(line!)).toEqual({ kind: "labour", description: "Fit springs", hours: 2.5, rateCents: 14_000, taxable: true });
  });
});

describe("GST on a quote's lines", () => {
  const part = (unitPriceCents: number) =>
    toTotalsLine(quoteContentSchema.parse({ lines: [{ kind: "part", description: "Shackle", quantity: 1, unitPriceCents, taxable: true }] }).lines[0]!);

  it("$100.00 excl. GST carries $10.00 GST", () => {
    // A New Tax System (Goods and Services Tax Imposition—General) Act 1999 s 4 (P): rate 10 %
    expect(quoteTotals([part(10_000)], "per-line").totals).toMatchObject({ gstCents: 1_000, inclGstCents: 11_000 });
  });

  it("$12.35 excl. on one line rounds 1.235 up to $1.24", () => {
    // GST Act s 9-90 (P): nearest cent, 0.5 c up
    expect(quoteTotals([part(1_235)], "per-line").totals.gstCents).toBe(124);
  });

  it("two lines of $12.35 summed then rounded give $2.47; rounded per line give $2.48", () => {
    // GST Act s 9-90 (P): several supplies — sum unrounded then round (2.470 → 2.47) ...
    expect(quoteTotals([part(1_235), part(1_235)], "invoice-total").totals.gstCents).toBe(247);
    // ... or round each line (1.24 + 1.24, hand-worked) then total
    expect(quoteTotals([part(1_235), part(1_235)], "per-line").totals.gstCents).toBe(248);
  });
});
