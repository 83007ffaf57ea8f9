import { describe, expect, it } from "vitest";
import { editionLineInputSchema, editionLinesInputSchema } from "@/lib/editions";
import { checkEditionLine } from "@/lib/variance";

// Rigline rules: the limits of an edition line's input, set out in lib/editions/schema.ts.

const valid = {
  key: "k-tyres",
  code: "TY-01",
  category: "tyres",
  title: "All-terrain tyres",
  requirement: "must_fit",
  quantity: 4,
  massKg: 6,
  zone: "front",
  massKind: "constant",
  criteria: [
    { attribute: "loadIndex", label: "Load index", op: "gte", value: 116 },
    { attribute: "size", op: "eq", value: "265/70R17" },
    { attribute: "speedSymbol", op: "one_of", value: ["Q", "R", "S"] },
    { attribute: "pressureKpa", unit: "kPa", op: "between", value: [200, 450] },
  ],
  evidenceNeeded: ["photo"],
  standardCostCents: 260_000,
  dependsOn: [],
  checkable: true,
  expiryMonths: null,
};

function messages(input: unknown): string[] {
  const r = editionLineInputSchema.safeParse(input);
  return r.success ? [] : r.error.issues.map((i) => `${i.path.join(".")}: ${i.message}`);
}

describe("editionLineInputSchema", () => {
  it("accepts a full line and fills defaults for the optional parts", () => {
    // Rigline rule.
    const parsed = editionLineInputSchema.parse(valid);
    expect(parsed.xMm).toBeNull();
    expect(parsed.zone).toBe("front");
    // What it parses is a valid edition line once the database gives it an id.
    expect(() => checkEditionLine("line", { ...parsed, id: "new-1" })).not.toThrow();
    const minimal = editionLineInputSchema.parse({
      key: "k-sign",
      code: "EN-01",
      category: "engineering",
      title: "Engineer's advice on the lift",
      requirement: "must_fit",
      quantity: 1,
      massKg: 0,
      massKind: "constant",
      standardCostCents: 0,
    });
    expect(minimal).toMatchObject({ xMm: null, zone: null, criteria: [], evidenceNeeded: [], dependsOn: [], checkable: false, expiryMonths: null });
  });

  it("quantity is a whole number of at least 1", () => {
    // Rigline rule.
    expect(messages({ ...valid, quantity: 0 })).toEqual(["quantity: quantity must be at least 1"]);
    expect(messages({ ...valid, quantity: 1.5 })).toEqual(["quantity: quantity must be a whole number"]);
  });

  it("mass is not negative and cost is whole cents, not negative", () => {
    // Rigline rule.
    expect(messages({ ...valid, massKg: -1 })).toEqual(["massKg: massKg must not be negative"]);
    expect(messages({ ...valid, standardCostCents: 12.5 })).toEqual(["standardCostCents: standardCostCents must be whole cents"]);
    expect(messages({ ...valid, standardCostCents: -100 })).toEqual(["standardCostCents: standardCostCents must not be negative"]);
    expect(messages({ ...valid, massKg: Number.NaN })).toHaveLength(1);
  });

  it("a line with mass says where it sits: xMm, a zone, or both", () => {
    // Rigline rule.
    expect(messages({ ...valid, zone: null })).toEqual([
      "xMm: say where the line sits: a distance behind the front axle (xMm) or a zone",
    ]);
    expect(messages({ ...valid, zone: null, xMm: 1450 })).toEqual([]);
    expect(messages({ ...valid, zone: "front", xMm: -650 })).toEqual([]);
    expect(messages({ ...valid, zone: null, requirement: "must_not_fit" })).toEqual([]);
    expect(messages({ ...valid, zone: null, massKg: 0 })).toEqual([]);
    expect(messages({ ...valid, zone: "bonnet" })).toHaveLength(1);
  });

  it("checks each criterion against its operator", () => {
    // Rigline rule.
    const withCriterion = (c: object) => messages({ ...valid, criteria: [{ attribute: "x", ...c }] });
    expect(withCriterion({ op: "between", value: [450, 200] })).toEqual(["criteria.0.value: the low bound must not exceed the high bound"]);
    expect(withCriterion({ op: "between", value: [1] })).toEqual(['criteria.0.value: "between" needs two numbers: [low, high]']);
    expect(withCriterion({ op: "gte", value: "high" })).toEqual(['criteria.0.value: "gte" needs a single number']);
    expect(withCriterion({ op: "gte", value: "116" })).toEqual([]);
    expect(withCriterion({ op: "one_of", value: "Q" })).toEqual(['criteria.0.value: "one_of" needs a list of values']);
    expect(withCriterion({ op: "eq", value: [1, 2] })).toEqual(['criteria.0.value: "eq" needs a single value']);
    expect(withCriterion({ op: "approx", value: 1 })).toHaveLength(1);
  });

  it("refuses repeated evidence kinds and dependencies, and bad expiry months", () => {
    // Rigline rule.
    expect(messages({ ...valid, evidenceNeeded: ["photo", "photo"] })).toEqual(["evidenceNeeded: list each evidence kind once"]);
    expect(messages({ ...valid, dependsOn: ["a", "a"] })).toEqual(["dependsOn: list each dependency once"]);
    expect(messages({ ...valid, expiryMonths: 0 })).toEqual(["expiryMonths: expiryMonths must be at least 1"]);
    expect(messages({ ...valid, title: "   " })).toEqual(["title: title is required"]);
  });
});

describe("editionLinesInputSchema", () => {
  it("refuses two lines with one key", () => {
    // Rigline rule.
    const r = editionLinesInputSchema.safeParse([valid, { ...valid, code: "TY-02" }]);
    expect(r.success).toBe(false);
    expect(r.error?.issues[0]?.path).toEqual([1, "key"]);
    expect(r.error?.issues[0]?.message).toBe("key k-tyres is already used by line 1");
  });
});
