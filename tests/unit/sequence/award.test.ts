import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { InputError } from "@/lib/errors";
import {
  awardCheckInputSchema,
  buildOrder,
  canAward,
  DependencyCycleError,
  sequenceWarnings,
  type SequenceLine,
} from "@/lib/sequence";

// Dependency rules worked by hand; the trade order (tyre size first, alignment after suspension
// work, engineering advice before any spanner is turned) is common practice.
const standard: SequenceLine[] = [
  { id: "tyres", label: "Tyre size decided", category: "tyres", dependsOn: [], met: false, kind: "decision" },
  { id: "eng", label: "Engineer's lift advice", category: "engineering", dependsOn: ["tyres"], met: false, kind: "engineering" },
  { id: "lift", label: "Suspension lift", category: "suspension", dependsOn: ["eng"], met: false },
  { id: "align", label: "Wheel alignment", category: "suspension", dependsOn: ["lift"], met: false, kind: "alignment" },
  { id: "bar", label: "Rear bar", category: "protection", dependsOn: [], met: false },
  { id: "spare", label: "Second spare on the bar", category: "recovery", dependsOn: ["bar"], met: false },
];

function withMet(ids: string[]): SequenceLine[] {
  return standard.map((line) => (ids.includes(line.id) ? { ...line, met: true } : line));
}

describe("canAward", () => {
  it("refuses a line whose prerequisite is neither met nor in the same award", () => {
    const check = canAward(["spare"], standard);
    expect(check.ok).toBe(false);
    expect(check.refused).toEqual([
      {
        id: "spare",
        label: "Second spare on the bar",
        missing: [{ id: "bar", label: "Rear bar", kind: "fitting", reason: "not-included" }],
      },
    ]);
  });

  it("accepts a line with its prerequisite in the same award, or met", () => {
    expect(canAward(["bar", "spare"], standard).ok).toBe(true);
    expect(canAward(["spare"], withMet(["bar"])).ok).toBe(true);
  });

  it("an engineering line gates its dependents until it is met, even in the same award", () => {
    const together = canAward(["eng", "lift"], withMet(["tyres"]));
    expect(together.ok).toBe(false);
    expect(together.refused).toEqual([
      {
        id: "lift",
        label: "Suspension lift",
        missing: [{ id: "eng", label: "Engineer's lift advice", kind: "engineering", reason: "awaiting-sign-off" }],
      },
    ]);
    expect(canAward(["lift", "align"], withMet(["tyres", "eng"])).ok).toBe(true);
  });

  it("follows prerequisites through lines in the same award", () => {
    // align needs lift (in the award), lift needs eng (not met): both refused, naming eng
    const check = canAward(["lift", "align"], withMet(["tyres"]));
    expect(check.refused.map((r) => [r.id, r.missing.map((m) => m.id)])).toEqual([
      ["lift", ["eng"]],
      ["align", ["eng"]],
    ]);
  });

  it("reports lines already met and refuses unknown ids", () => {
    expect(canAward(["bar"], withMet(["bar"])).alreadyMet.map((r) => r.id)).toEqual(["bar"]);
    expect(() => canAward(["bar", "roof"], standard)).toThrow(expect.objectContaining({ field: "lineIds.1" }));
    expect(() => canAward(["bar"], [...standard, { ...standard[4]!, id: "x", dependsOn: ["x"] }])).toThrow(
      DependencyCycleError,
    );
  });

  it("the schema parses the request body", () => {
    expect(awardCheckInputSchema.safeParse({ lineIds: ["bar"], lines: standard }).success).toBe(true);
    expect(awardCheckInputSchema.safeParse({ lineIds: [], lines: standard }).success).toBe(false);
  });

  it("the first stage of the build order can always be awarded", () => {
    fc.assert(
      fc.property(fc.subarray(["tyres", "eng", "lift", "align", "bar", "spare"]), (metIds) => {
        const lines = withMet(metIds);
        const firstStage = buildOrder(lines).stages[0]?.lines.map((planned) => planned.id) ?? [];
        if (firstStage.length > 0) expect(canAward(firstStage, lines).ok).toBe(true);
      }),
    );
  });
});

describe("sequenceWarnings", () => {
  it("is quiet for a standard that follows the trade order", () => {
    expect(sequenceWarnings(standard)).toEqual([]);
  });

  it("warns when suspension work has no alignment after it (common practice)", () => {
    const warnings = sequenceWarnings(standard.filter((line) => line.id !== "align"));
    expect(warnings.map((w) => [w.code, w.line.id])).toEqual([["alignment-missing", "lift"]]);
  });

  it("warns when an engineering step gates nothing (common practice)", () => {
    const lines = standard.map((line) => (line.id === "lift" ? { ...line, dependsOn: [] } : line));
    expect(sequenceWarnings(lines).map((w) => [w.code, w.line.id])).toEqual([["engineering-gates-nothing", "eng"]]);
  });

  it("checks its input like the other sequence functions", () => {
    expect(() => sequenceWarnings([{ ...standard[0]!, dependsOn: ["nowhere"] }])).toThrow(InputError);
  });
});
