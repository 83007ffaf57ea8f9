import { describe, expect, it } from "vitest";
import { InputError } from "@/lib/errors";
import { compareEditions, copyEditionLines } from "@/lib/editions";
import type { EditionLine } from "@/lib/variance";
import { line } from "../variance/fixtures";

// Rigline rules throughout: lines are matched across editions by key, dependencies by the keys
// they point at. Expected values are worked by hand from the invented editions below.

function counter(prefix: string): () => string {
  let n = 0;
  return () => `${prefix}-${++n}`;
}

const first: EditionLine[] = [
  line({ id: "a1", key: "k-tyres", code: "TY-01", category: "tyres", criteria: [{ attribute: "loadIndex", op: "gte", value: 116 }, { attribute: "size", op: "eq", value: "265/70R17" }], evidenceNeeded: ["photo", "certificate"] }),
  line({ id: "a2", key: "k-bar", code: "PR-01", category: "protection", massKg: 70, zone: "front" }),
  line({ id: "a3", key: "k-winch", code: "RC-02", category: "recovery", massKg: 35, dependsOn: ["a2"] }),
  line({ id: "a4", key: "k-old-rack", code: "LR-01", category: "lighting_roof" }),
];

describe("copyEditionLines", () => {
  it("gives fresh ids, keeps keys and remaps dependsOn to the new ids", () => {
    // Rigline rule.
    const copy = copyEditionLines(first, counter("b"));
    expect(copy.map((l) => l.id)).toEqual(["b-1", "b-2", "b-3", "b-4"]);
    expect(copy.map((l) => l.key)).toEqual(first.map((l) => l.key));
    // a3 depended on a2; a2's copy is b-2.
    expect(copy[2]?.dependsOn).toEqual(["b-2"]);
    expect(copy[0]?.criteria).toEqual(first[0]?.criteria);
  });

  it("shares nothing with the source", () => {
    // Rigline rule.
    const copy = copyEditionLines(first, counter("c"));
    copy[0]!.criteria[0]!.value = 121;
    copy[0]!.evidenceNeeded.push("weighbridge_ticket");
    copy[2]!.dependsOn.push("c-1");
    expect(first[0]?.criteria[0]?.value).toBe(116);
    expect(first[0]?.evidenceNeeded).toEqual(["photo", "certificate"]);
    expect(first[2]?.dependsOn).toEqual(["a2"]);
  });

  it("refuses an id generator that repeats or reuses a source id", () => {
    // Rigline rule.
    expect(() => copyEditionLines(first, () => "same")).toThrow(/twice/);
    const ids = ["a1", "x2", "x3", "x4"];
    expect(() => copyEditionLines(first, () => ids.shift() ?? "")).toThrow(InputError);
    expect(() => copyEditionLines(first, () => "")).toThrow(/empty id/);
  });

  it("refuses a dependency on a line not in the edition", () => {
    // Rigline rule.
    const bad = [...first, line({ id: "a5", key: "k-x", dependsOn: ["zz"] })];
    expect(() => copyEditionLines(bad, counter("d"))).toThrow(/lines\.4\.dependsOn\.0|not a line of this edition/);
  });
});

describe("compareEditions", () => {
  it("a plain copy is all unchanged, although every id differs", () => {
    // Rigline rule.
    // dependsOn compared by keys: a3 → a2 and b-3 → b-2 both mean k-winch → k-bar.
    const r = compareEditions(first, copyEditionLines(first, counter("b")));
    expect(r.counts).toEqual({ added: 0, removed: 0, changed: 0, unchanged: 4 });
  });

  it("lists added, removed and changed lines with each field before → after", () => {
    // Rigline rule.
    const next = copyEditionLines(first, counter("b"));
    // b-1 tyres: load index 116 → 121 and cost 10 000 → 12 500 c.
    next[0] = { ...next[0]!, criteria: [{ attribute: "loadIndex", op: "gte", value: 121 }, next[0]!.criteria[1]!], standardCostCents: 12_500 };
    // b-3 winch now depends on the tyres instead of the bar.
    next[2] = { ...next[2]!, dependsOn: ["b-1"] };
    // k-old-rack dropped; a first-aid kit added.
    next.splice(3, 1);
    next.push(line({ id: "b-9", key: "k-kit", code: "SA-01", category: "safety" }));

    const r = compareEditions(first, next);
    expect(r.counts).toEqual({ added: 1, removed: 1, changed: 2, unchanged: 1 });
    expect(r.added.map((l) => l.key)).toEqual(["k-kit"]);
    expect(r.removed.map((l) => l.key)).toEqual(["k-old-rack"]);
    expect(r.changed.map((c) => c.key)).toEqual(["k-tyres", "k-winch"]);
    expect(r.changed[0]?.changes).toEqual([
      { field: "criteria", before: first[0]?.criteria, after: next[0]?.criteria },
      { field: "standardCostCents", before: 10_000, after: 12_500 },
    ]);
    expect(r.changed[1]?.changes).toEqual([{ field: "dependsOn", before: ["k-bar"], after: ["k-tyres"] }]);
    expect(r.changed[1]?.code).toBe("RC-02");
  });

  it("ignores the order of criteria, of their properties, and of evidence kinds", () => {
    // Rigline rule.
    const next = copyEditionLines(first, counter("b"));
    const [c0, c1] = next[0]!.criteria;
    next[0] = {
      ...next[0]!,
      criteria: [c1!, { value: c0!.value, op: c0!.op, attribute: c0!.attribute }],
      evidenceNeeded: ["certificate", "photo"],
    };
    expect(compareEditions(first, next).counts.changed).toBe(0);
  });

  it("names simple field changes: requirement, quantity, position", () => {
    // Rigline rule.
    const next = first.map((l) => (l.key === "k-bar" ? { ...l, id: "n2", requirement: "may_fit" as const, quantity: 2, zone: null, xMm: -650 } : l));
    const r = compareEditions(first, next.map((l) => (l.id === "a3" ? { ...l, dependsOn: ["n2"] } : l)));
    expect(r.changed.map((c) => c.key)).toEqual(["k-bar"]);
    expect(r.changed[0]?.changes).toEqual([
      { field: "requirement", before: "must_fit", after: "may_fit" },
      { field: "quantity", before: 1, after: 2 },
      { field: "xMm", before: null, after: -650 },
      { field: "zone", before: "front", after: null },
    ]);
  });

  it("refuses a duplicate key within one edition", () => {
    // Rigline rule.
    const dup = [...first, line({ id: "a9", key: "k-bar" })];
    expect(() => compareEditions(dup, first)).toThrow(/a\.4\.key|appears twice/);
  });
});
