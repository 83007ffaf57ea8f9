import { describe, expect, it } from "vitest";
import { InputError } from "@/lib/errors";
import { lineVariance, vehicleVariance, NOT_RECORDED, type EditionLine } from "@/lib/variance";
import { NOW, concession, daysFromNow, fitment, line } from "./fixtures";

// Every expectation in this file is a Rigline rule (our own variance rules, no external
// source), hand-worked from the inputs beside it.

const tyres: EditionLine = line({
  id: "l-tyres",
  code: "TY-01",
  category: "tyres",
  title: "All-terrain tyres, light-truck construction",
  quantity: 4,
  massKg: 5,
  criteria: [
    { attribute: "loadIndex", label: "Load index", op: "gte", value: 116 },
    { attribute: "size", label: "Tyre size", op: "eq", value: "265/70R17" },
  ],
  evidenceNeeded: ["photo"],
  standardCostCents: 260_000,
});

const goodTyres = fitment({
  id: "f-tyres",
  lineId: "l-tyres",
  label: "Four all-terrain tyres",
  quantity: 4,
  attributes: { loadIndex: "121", size: "265/70 r17" },
  evidence: [{ kind: "photo", status: "accepted" }],
});

describe("lineVariance: meets", () => {
  it("meets when quantity, every criterion and every evidence kind are satisfied", () => {
    // Rigline rule: 4 of 4 fitted, LI "121" ≥ 116 (numeric string read as a number),
    // "265/70 r17" equals "265/70R17" ignoring case and spaces, photo accepted → meets.
    const r = lineVariance(tyres, [goodTyres], [], NOW);
    expect(r.status).toBe("meets");
    expect(r.fittedQuantity).toBe(4);
    expect(r.requiredQuantity).toBe(4);
    expect(r.missingQuantity).toBe(0);
    expect(r.fitmentIds).toEqual(["f-tyres"]);
    expect(r.failing).toBeUndefined();
    expect(r.code).toBe("TY-01");
    expect(r.standardCostCents).toBe(260_000);
  });

  it("adds up the quantity of several fitments answering one line", () => {
    // Rigline rule: 1 + 3 = 4 tyres fitted against a quantity of 4 → meets.
    const one = { ...goodTyres, id: "f-a", quantity: 1 };
    const three = { ...goodTyres, id: "f-b", quantity: 3 };
    const r = lineVariance(tyres, [one, three], [], NOW);
    expect(r.status).toBe("meets");
    expect(r.fittedQuantity).toBe(4);
  });
});

describe("lineVariance: short", () => {
  it("is short when a must-fit line has nothing fitted", () => {
    // Rigline rule: 0 of 4 → short, 4 missing.
    const r = lineVariance(tyres, [], [], NOW);
    expect(r.status).toBe("short");
    expect(r.missingQuantity).toBe(4);
    expect(r.fittedQuantity).toBe(0);
  });

  it("is short when fewer than the quantity are fitted, and still lists failing criteria", () => {
    // Rigline rule: 3 of 4 → short by 1; short outranks off_spec but the failure is shown.
    const three = { ...goodTyres, quantity: 3, attributes: { loadIndex: 112, size: "265/70R17" } };
    const r = lineVariance(tyres, [three], [], NOW);
    expect(r.status).toBe("short");
    expect(r.missingQuantity).toBe(1);
    expect(r.failing).toEqual([{ criterion: tyres.criteria[0], actual: 112, fitmentId: "f-tyres" }]);
  });

  it("only uses the fitments and concessions that point at the line", () => {
    // Rigline rule: a fitment for another line does not fill this one → short.
    const other = fitment({ id: "f-other", lineId: "l-other", quantity: 4 });
    const r = lineVariance(tyres, [other], [concession({ lineId: "l-other" })], NOW);
    expect(r.status).toBe("short");
    expect(r.fitmentIds).toEqual([]);
  });
});

describe("lineVariance: off_spec", () => {
  it("names the failing criterion and the value found", () => {
    // Rigline rule: LI 112 < 116 → off_spec, actual 112.
    const low = { ...goodTyres, attributes: { loadIndex: 112, size: "265/70R17" } };
    const r = lineVariance(tyres, [low], [], NOW);
    expect(r.status).toBe("off_spec");
    expect(r.failing).toEqual([{ criterion: tyres.criteria[0], actual: 112, fitmentId: "f-tyres" }]);
  });

  it("counts a missing attribute as failing with actual 'not recorded'", () => {
    // Rigline rule: no loadIndex recorded → off_spec on that criterion, actual "not recorded".
    const noLi = { ...goodTyres, attributes: { size: "265/70R17" } };
    const r = lineVariance(tyres, [noLi], [], NOW);
    expect(r.status).toBe("off_spec");
    expect(r.failing).toHaveLength(1);
    expect(r.failing?.[0]?.criterion.attribute).toBe("loadIndex");
    expect(r.failing?.[0]?.actual).toBe(NOT_RECORDED);
    expect(NOT_RECORDED).toBe("not recorded");
  });

  it("treats a blank attribute as not recorded", () => {
    // Rigline rule: "  " is no value → "not recorded".
    const blank = { ...goodTyres, attributes: { loadIndex: "  ", size: "265/70R17" } };
    expect(lineVariance(tyres, [blank], [], NOW).failing?.[0]?.actual).toBe(NOT_RECORDED);
  });

  it("fails a different tyre designation even when the numbers match", () => {
    // ETRTO / ISO metric designation (S): "LT" sizes follow the US Tire and Rim Association and
    // may carry different load ratings, so LT265/70R17 is not the metric 265/70R17.
    const lt = { ...goodTyres, attributes: { loadIndex: 121, size: "LT265/70R17" } };
    const r = lineVariance(tyres, [lt], [], NOW);
    expect(r.status).toBe("off_spec");
    expect(r.failing?.[0]?.actual).toBe("LT265/70R17");
  });

  it("judges a fitted may-fit line on its criteria like a must-fit line", () => {
    // Rigline rule: a fitted may-fit item must still meet its criteria: 800 W > 600 W → off_spec.
    const inverter = line({
      id: "l-inv",
      category: "electrical",
      requirement: "may_fit",
      criteria: [{ attribute: "powerW", unit: "W", op: "lte", value: 600 }],
    });
    const f = fitment({ id: "f-inv", lineId: "l-inv", attributes: { powerW: 800 } });
    const r = lineVariance(inverter, [f], [], NOW);
    expect(r.status).toBe("off_spec");
    expect(r.requiredQuantity).toBe(0);
    expect(r.failing?.[0]?.actual).toBe(800);
  });
});

describe("lineVariance: unproven", () => {
  it("is unproven when the evidence is only lodged", () => {
    // Rigline rule: criteria pass, photo lodged not accepted → unproven, photo missing.
    const lodged = { ...goodTyres, evidence: [{ kind: "photo" as const, status: "lodged" as const }] };
    const r = lineVariance(tyres, [lodged], [], NOW);
    expect(r.status).toBe("unproven");
    expect(r.evidenceMissing).toEqual(["photo"]);
  });

  it("is unproven when one of two needed kinds is rejected", () => {
    // Rigline rule: certificate accepted, engineering sign-off rejected → unproven.
    const lift = line({
      id: "l-lift",
      category: "suspension",
      evidenceNeeded: ["certificate", "engineering_signoff"],
    });
    const f = fitment({
      id: "f-lift",
      lineId: "l-lift",
      evidence: [
        { kind: "certificate", status: "accepted" },
        { kind: "engineering_signoff", status: "rejected" },
      ],
    });
    const r = lineVariance(lift, [f], [], NOW);
    expect(r.status).toBe("unproven");
    expect(r.evidenceMissing).toEqual(["engineering_signoff"]);
  });

  it("off_spec outranks unproven", () => {
    // Rigline rule: LI 110 fails and no evidence → the larger gap, off_spec, is named.
    const f = { ...goodTyres, attributes: { loadIndex: 110, size: "265/70R17" }, evidence: [] };
    expect(lineVariance(tyres, [f], [], NOW).status).toBe("off_spec");
  });
});

describe("lineVariance: concession", () => {
  it("an unexpired concession covers a short line", () => {
    // Rigline rule: missing but concession expiring in 30 days → concession.
    const c = concession({ lineId: "l-tyres" });
    const r = lineVariance(tyres, [], [c], NOW);
    expect(r.status).toBe("concession");
    expect(r.concession).toEqual(c);
  });

  it("an expired concession counts as short", () => {
    // Rigline rule: the concession lapsed yesterday → the line is what it is: short by 4.
    const c = concession({ lineId: "l-tyres", expiresAt: daysFromNow(-1) });
    const r = lineVariance(tyres, [], [c], NOW);
    expect(r.status).toBe("short");
    expect(r.missingQuantity).toBe(4);
    expect(r.concession).toBeUndefined();
    expect(r.concessionExpiredAt).toEqual(daysFromNow(-1));
  });

  it("a concession expiring exactly now has lapsed", () => {
    // Rigline rule: expiry ≤ now is expired.
    const c = concession({ lineId: "l-tyres", expiresAt: NOW });
    expect(lineVariance(tyres, [], [c], NOW).status).toBe("short");
  });

  it("uses the latest of several concessions when one is still current", () => {
    // Rigline rule: one lapsed, one current → concession, citing the current one.
    const lapsed = concession({ lineId: "l-tyres", expiresAt: daysFromNow(-10), reason: "old" });
    const current = concession({ lineId: "l-tyres", expiresAt: daysFromNow(5), reason: "new" });
    const r = lineVariance(tyres, [], [lapsed, current], NOW);
    expect(r.status).toBe("concession");
    expect(r.concession?.reason).toBe("new");
  });

  it("a concession on a line that meets is not needed and not shown", () => {
    // Rigline rule: meets stays meets.
    const r = lineVariance(tyres, [goodTyres], [concession({ lineId: "l-tyres" })], NOW);
    expect(r.status).toBe("meets");
    expect(r.concession).toBeUndefined();
  });

  it("a concession covers an off-spec line", () => {
    // Rigline rule: LI 112 fails, current concession → concession, failure still listed.
    const low = { ...goodTyres, attributes: { loadIndex: 112, size: "265/70R17" } };
    const r = lineVariance(tyres, [low], [concession({ lineId: "l-tyres" })], NOW);
    expect(r.status).toBe("concession");
    expect(r.failing).toHaveLength(1);
  });
});

describe("lineVariance: must-not-fit and may-fit", () => {
  const roofTent = line({
    id: "l-no-tent",
    category: "lighting_roof",
    title: "Roof-top tent (roof rated too low)",
    requirement: "must_not_fit",
    zone: "roof",
  });

  it("a must-not-fit line that is fitted is prohibited_fitted", () => {
    // Rigline rule.
    const f = fitment({ id: "f-tent", lineId: "l-no-tent", label: "Roof-top tent" });
    const r = lineVariance(roofTent, [f], [], NOW);
    expect(r.status).toBe("prohibited_fitted");
    expect(r.requiredQuantity).toBe(0);
    expect(r.fitmentIds).toEqual(["f-tent"]);
  });

  it("a must-not-fit line with nothing fitted meets", () => {
    // Rigline rule.
    expect(lineVariance(roofTent, [], [], NOW).status).toBe("meets");
  });

  it("a removed prohibited item no longer counts", () => {
    // Rigline rule: removed yesterday → meets.
    const f = fitment({ id: "f-tent", lineId: "l-no-tent", removedAt: daysFromNow(-1) });
    expect(lineVariance(roofTent, [f], [], NOW).status).toBe("meets");
  });

  it("a may-fit line not fitted is optional_absent", () => {
    // Rigline rule.
    const drawers = line({ id: "l-drawers", requirement: "may_fit" });
    const r = lineVariance(drawers, [], [], NOW);
    expect(r.status).toBe("optional_absent");
    expect(r.requiredQuantity).toBe(0);
    expect(r.missingQuantity).toBe(0);
  });

  it("a fitted may-fit line with fewer than its design quantity still meets", () => {
    // Rigline rule: may-fit quantity is a design figure, not a minimum.
    const jerry = line({ id: "l-jerry", requirement: "may_fit", quantity: 2 });
    const f = fitment({ id: "f-jerry", lineId: "l-jerry", quantity: 1 });
    expect(lineVariance(jerry, [f], [], NOW).status).toBe("meets");
  });
});

describe("lineVariance: removed, expired and future fitments", () => {
  const firstAid = line({
    id: "l-fak",
    code: "SA-02",
    category: "safety",
    title: "Remote-area first-aid kit",
    expiryMonths: 12,
  });

  it("an expired fitment counts as short but stays listed", () => {
    // Rigline rule: kit expired 3 days ago → short by 1, listed as expired.
    const kit = fitment({ id: "f-kit", lineId: "l-fak", expiresAt: daysFromNow(-3) });
    const r = lineVariance(firstAid, [kit], [], NOW);
    expect(r.status).toBe("short");
    expect(r.missingQuantity).toBe(1);
    expect(r.fittedQuantity).toBe(0);
    expect(r.fitmentIds).toEqual(["f-kit"]);
    expect(r.expiredFitmentIds).toEqual(["f-kit"]);
  });

  it("a fitment expiring exactly now has expired; one expiring tomorrow has not", () => {
    // Rigline rule: expiresAt ≤ now is expired.
    const atNow = fitment({ id: "f-kit", lineId: "l-fak", expiresAt: NOW });
    const tomorrow = fitment({ id: "f-kit", lineId: "l-fak", expiresAt: daysFromNow(1) });
    expect(lineVariance(firstAid, [atNow], [], NOW).status).toBe("short");
    expect(lineVariance(firstAid, [tomorrow], [], NOW).status).toBe("meets");
  });

  it("a may-fit item carried only past its expiry is short", () => {
    // Rigline rule: an optional item, once carried, must be in date.
    const spareKit = line({ id: "l-kit2", category: "safety", requirement: "may_fit" });
    const kit = fitment({ id: "f-kit2", lineId: "l-kit2", expiresAt: daysFromNow(-1) });
    const r = lineVariance(spareKit, [kit], [], NOW);
    expect(r.status).toBe("short");
    expect(r.missingQuantity).toBe(1);
  });

  it("a removed fitment does not count", () => {
    // Rigline rule: removed on `now` → not fitted → short; removal after `now` still counts.
    const removed = fitment({ id: "f-kit", lineId: "l-fak", removedAt: NOW });
    const later = fitment({ id: "f-kit", lineId: "l-fak", removedAt: daysFromNow(2) });
    const r = lineVariance(firstAid, [removed], [], NOW);
    expect(r.status).toBe("short");
    expect(r.fitmentIds).toEqual([]);
    expect(lineVariance(firstAid, [later], [], NOW).status).toBe("meets");
  });

  it("a fitment dated after now has not been fitted yet", () => {
    // Rigline rule: the same data answers "as at" a date.
    const future = fitment({ id: "f-kit", lineId: "l-fak", fittedAt: daysFromNow(1) });
    expect(lineVariance(firstAid, [future], [], NOW).status).toBe("short");
  });
});

describe("lineVariance: bad input", () => {
  it("throws InputError naming the field", () => {
    // Rigline rule.
    const bad = line({ id: "l-bad", massKg: Number.NaN });
    expect(() => lineVariance(bad, [], [], NOW)).toThrow(InputError);
    try {
      lineVariance(bad, [], [], NOW);
    } catch (e) {
      expect((e as InputError).field).toBe("line.massKg");
    }
  });

  it("refuses a malformed criterion, an invalid date and a negative quantity", () => {
    // Rigline rule.
    const between = line({ id: "l-b", criteria: [{ attribute: "x", op: "between", value: [5, 1] }] });
    expect(() => lineVariance(between, [], [], NOW)).toThrow(/low bound/);
    const gteText = line({ id: "l-g", criteria: [{ attribute: "x", op: "gte", value: "high" }] });
    expect(() => lineVariance(gteText, [], [], NOW)).toThrow(InputError);
    expect(() => lineVariance(tyres, [], [], new Date("nope"))).toThrow(InputError);
    const neg = fitment({ id: "f-neg", lineId: "l-tyres", quantity: -1 });
    expect(() => lineVariance(tyres, [neg], [], NOW)).toThrow(/fitments\.0\.quantity/);
  });

  it("checks a reused lines array again when a line in it is replaced", () => {
    // Rigline rule: an edition's lines are checked once per array, but a swapped line is seen.
    const edition = [line({ id: "l-a" }), line({ id: "l-b" })];
    const input = { lines: edition, fitments: [], concessions: [], now: NOW };
    expect(vehicleVariance(input).summary.short).toBe(2);
    edition[1] = line({ id: "l-b", quantity: 0 });
    expect(() => vehicleVariance(input)).toThrow(/lines\.1\.quantity/);
  });

  it("refuses duplicate line ids in a vehicle variance", () => {
    // Rigline rule.
    const a = line({ id: "l-dup" });
    expect(() => vehicleVariance({ lines: [a, a], fitments: [], concessions: [], now: NOW })).toThrow(
      /appears twice/,
    );
  });
});
