import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { asNumber, evaluateCriterion, normaliseText, valuesEqual, NOT_RECORDED } from "@/lib/variance";

describe("criterion evaluation", () => {
  it("compares tyre sizes ignoring case and spaces", () => {
    // ETRTO / ISO metric designation (ISO 4000-1; S): width/aspect, construction letter R, rim
    // diameter; case and spacing carry no meaning, so these are one size.
    expect(valuesEqual("265/70 r17", "265/70R17")).toBe(true);
    expect(valuesEqual(" 265 / 70 R 17 ", "265/70r17")).toBe(true);
    expect(normaliseText("LT285/75 R16")).toBe("lt285/75r16");
    // Same designation rules (S): a different rim diameter or aspect ratio is a different size.
    expect(valuesEqual("265/70R16", "265/70R17")).toBe(false);
    expect(valuesEqual("265/75R17", "265/70R17")).toBe(false);
  });

  it("property: inserting spaces or changing case never changes a text match", () => {
    // Rigline rule: text comparison is case- and space-insensitive.
    fc.assert(
      fc.property(fc.stringMatching(/^[A-Za-z0-9/]{1,12}$/), fc.array(fc.nat(12)), (s, cuts) => {
        let spaced = s;
        for (const c of cuts) {
          const at = c % (spaced.length + 1);
          spaced = `${spaced.slice(0, at)} ${spaced.slice(at)}`;
        }
        const flipped = [...spaced].map((ch, i) => (i % 2 ? ch.toUpperCase() : ch.toLowerCase())).join("");
        // Both sides non-numeric or both numeric: the result must match the plain comparison.
        return valuesEqual(flipped, s) === true;
      }),
    );
  });

  it("reads numeric strings as numbers and nothing else", () => {
    // Rigline rule: "116" and " 2.5 " are numbers; "0x10", "", "12 V" are not.
    expect(asNumber("116")).toBe(116);
    expect(asNumber(" 2.5 ")).toBe(2.5);
    expect(asNumber("1e3")).toBe(1000);
    expect(asNumber("0x10")).toBeNull();
    expect(asNumber("")).toBeNull();
    expect(asNumber("12 V")).toBeNull();
    expect(asNumber(Number.POSITIVE_INFINITY)).toBeNull();
    expect(valuesEqual("17.0", 17)).toBe(true);
    expect(valuesEqual("17", "R17")).toBe(false);
  });

  it("gte and lte compare numerically, including numeric strings", () => {
    // Rigline rule: numeric strings compare as numbers: "121" ≥ 116 passes, "99" fails
    // (although as text "99" sorts after "116").
    const gte = { attribute: "loadIndex", op: "gte" as const, value: 116 };
    expect(evaluateCriterion(gte, { loadIndex: "121" })).toEqual({ pass: true });
    expect(evaluateCriterion(gte, { loadIndex: 116 })).toEqual({ pass: true });
    expect(evaluateCriterion(gte, { loadIndex: "99" })).toEqual({ pass: false, actual: "99" });
    const lte = { attribute: "liftMm", op: "lte" as const, value: "50" };
    expect(evaluateCriterion(lte, { liftMm: 50 })).toEqual({ pass: true });
    expect(evaluateCriterion(lte, { liftMm: 51 })).toEqual({ pass: false, actual: 51 });
    expect(evaluateCriterion(lte, { liftMm: "fifty" })).toEqual({ pass: false, actual: "fifty" });
  });

  it("between is inclusive at both ends", () => {
    // Rigline rule: [6, 10] mm² passes 6 and 10, fails 4 and 16.
    const c = { attribute: "cableMm2", op: "between" as const, value: [6, 10] };
    expect(evaluateCriterion(c, { cableMm2: 6 }).pass).toBe(true);
    expect(evaluateCriterion(c, { cableMm2: 10 }).pass).toBe(true);
    expect(evaluateCriterion(c, { cableMm2: "8" }).pass).toBe(true);
    expect(evaluateCriterion(c, { cableMm2: 4 })).toEqual({ pass: false, actual: 4 });
    expect(evaluateCriterion(c, { cableMm2: 16 })).toEqual({ pass: false, actual: 16 });
  });

  it("one_of passes any listed value, numbers or text", () => {
    // Rigline rule, with ISO 4000-1 / ETRTO speed symbols (S) as the listed values.
    const c = { attribute: "speedSymbol", op: "one_of" as const, value: ["Q", "R", "S", "T"] };
    expect(evaluateCriterion(c, { speedSymbol: "r" }).pass).toBe(true);
    expect(evaluateCriterion(c, { speedSymbol: "N" })).toEqual({ pass: false, actual: "N" });
    const rims = { attribute: "rimIn", op: "one_of" as const, value: [16, 17] };
    expect(evaluateCriterion(rims, { rimIn: "17" }).pass).toBe(true);
    expect(evaluateCriterion(rims, { rimIn: 18 }).pass).toBe(false);
  });

  it("a missing attribute fails with 'not recorded', including inherited names", () => {
    // Rigline rule.
    const c = { attribute: "toString", op: "eq" as const, value: "x" };
    expect(evaluateCriterion(c, {})).toEqual({ pass: false, actual: NOT_RECORDED });
  });

  it("property: eq and one_of agree with valuesEqual, gte with a plain numeric comparison", () => {
    // Rigline rule: one equality for every operator that matches values.
    const scalar = fc.oneof(
      fc.integer({ min: -500, max: 500 }),
      fc.integer({ min: -500, max: 500 }).map((n) => ` ${n} `),
      fc.constantFrom("265/70R17", "265/70 r17", "LT265/70R17", "Q", "q", "17", "R17", "x"),
    );
    fc.assert(
      fc.property(scalar, scalar, fc.integer({ min: -500, max: 500 }), (actual, expected, limit) => {
        const eq = evaluateCriterion({ attribute: "a", op: "eq", value: expected }, { a: actual }).pass;
        const oneOf = evaluateCriterion({ attribute: "a", op: "one_of", value: ["zzz", expected] }, { a: actual }).pass;
        const n = asNumber(actual);
        const gte = evaluateCriterion({ attribute: "a", op: "gte", value: limit }, { a: actual }).pass;
        return eq === valuesEqual(actual, expected) && oneOf === eq && gte === (n !== null && n >= limit);
      }),
    );
  });
});
