import { describe, expect, it } from "vitest";
import { costCategoryFor, decisionInputSchema, decisionOutcome, financeApprovalInputSchema, financeOutcome, mayDecide } from "@/lib/jobs";

describe("decisionOutcome", () => {
  const threshold = 500_000;
  it("accepts at or below the threshold and awards the job", () => {
    expect(decisionOutcome("accept", 499_999, threshold)).toEqual({ status: "accepted", needsFinance: false, awards: true });
    // "above" the threshold is strict: exactly the threshold needs no finance approval
    expect(decisionOutcome("accept", 500_000, threshold)).toEqual({ status: "accepted", needsFinance: false, awards: true });
  });

  it("sends an acceptance above the threshold to finance", () => {
    expect(decisionOutcome("accept", 500_001, threshold)).toEqual({ status: "awaiting_finance", needsFinance: true, awards: false });
  });

  it("declines and returns without awarding", () => {
    expect(decisionOutcome("decline", 900_000, threshold)).toEqual({ status: "declined", needsFinance: false, awards: false });
    expect(decisionOutcome("return", 900_000, threshold)).toEqual({ status: "returned", needsFinance: false, awards: false });
  });

  it("refuses amounts that are not whole cents", () => {
    expect(() => decisionOutcome("accept", 10.5, threshold)).toThrow(RangeError);
    expect(() => decisionOutcome("accept", 10, -1)).toThrow(RangeError);
  });

  it("finance approves into accepted, or declines", () => {
    expect(financeOutcome(true)).toEqual({ status: "accepted", needsFinance: false, awards: true });
    expect(financeOutcome(false)).toEqual({ status: "declined", needsFinance: false, awards: false });
  });
});

describe("decision input", () => {
  it("needs a reason to decline or return, not to accept", () => {
    expect(decisionInputSchema.safeParse({ decision: "accept", version: 3 }).success).toBe(true);
    const decline = decisionInputSchema.safeParse({ decision: "decline", version: 3 });
    expect(decline.success).toBe(false);
    expect(decline.error?.issues[0]?.path).toEqual(["reason"]);
    const back = decisionInputSchema.safeParse({ decision: "return", reason: "  ", version: 3 });
    expect(back.error?.issues[0]?.message).toBe("Say what needs to change");
  });

  it("needs the version seen, and one of the three decisions", () => {
    expect(decisionInputSchema.safeParse({ decision: "accept" }).success).toBe(false);
    expect(decisionInputSchema.safeParse({ decision: "maybe", version: 1 }).success).toBe(false);
    expect(decisionInputSchema.parse({ decision: "accept", version: "2" }).version).toBe(2);
  });

  it("finance must give a reason to decline", () => {
    expect(financeApprovalInputSchema.safeParse({ approve: "false", version: 1 }).success).toBe(false);
    expect(financeApprovalInputSchema.parse({ approve: "true", version: 1 }).approve).toBe(true);
  });
});

describe("mayDecide", () => {
  it("refuses whoever submitted, created or revised the quote", () => {
    const quote = { submittedBy: "u1", createdBy: "u2", revisedBy: ["u3"] };
    expect(mayDecide("u1", quote)).toBe(false);
    expect(mayDecide("u2", quote)).toBe(false);
    expect(mayDecide("u3", quote)).toBe(false);
    expect(mayDecide("u4", quote)).toBe(true);
  });
});

describe("costCategoryFor", () => {
  it("books under the category with the largest amount, ties to the first met", () => {
    const lines = [
      { category: "tyres" as const, exGstCents: 100_00 },
      { category: "suspension" as const, exGstCents: 80_00 },
      { category: "suspension" as const, exGstCents: 40_00 },
      { category: null, exGstCents: 500_00 },
    ];
    expect(costCategoryFor(lines, "engineering")).toBe("suspension");
    expect(costCategoryFor([{ category: "tyres", exGstCents: 5 }, { category: "recovery", exGstCents: 5 }], "engineering")).toBe("tyres");
  });

  it("falls back when no line names a category", () => {
    expect(costCategoryFor([{ category: null, exGstCents: 1 }], "engineering")).toBe("engineering");
    expect(costCategoryFor([], "safety")).toBe("safety");
  });
});
