import { describe, expect, it } from "vitest";
import { InputError } from "@/lib/errors";
import { GENERAL_CHECK_ITEMS, buildChecklist, checkAnswers, checkSummary, type CheckableLine } from "@/lib/defects";

// The general walk-round items are common practice for a pre-trip check of a remote-area
// vehicle (tyres and pressures, fluids, lights, spare, recovery gear, first aid, extinguisher,
// communications); the rest are Rigline's own rules.

const line = (over: Partial<CheckableLine>): CheckableLine => ({
  key: "k1",
  code: "SA-01",
  title: "First-aid kit, remote",
  category: "safety",
  quantity: 1,
  checkable: true,
  ...over,
});

describe("pre-trip checklist", () => {
  it("always has the general walk-round (common practice)", () => {
    const labels = buildChecklist([]).map((i) => i.label);
    expect(labels).toEqual([
      "Tyres and pressures",
      "Fluid levels",
      "Lights",
      "Spare wheel and jack",
      "Recovery gear",
      "First-aid kit",
      "Fire extinguisher",
      "Communications",
    ]);
  });

  it("adds each checkable line once, after the general items, and skips the others", () => {
    const list = buildChecklist([
      line({ key: "fa", title: "First-aid kit, remote" }),
      line({ key: "tracks", code: "RC-02", title: "Recovery tracks", category: "recovery", quantity: 2 }),
      line({ key: "drawers", code: "ST-01", title: "Cargo drawers", category: "storage", checkable: false }),
      line({ key: "fa", title: "duplicate of the first" }),
    ]);
    expect(list).toHaveLength(GENERAL_CHECK_ITEMS.length + 2);
    expect(list.slice(-2)).toEqual([
      { key: "line.fa", label: "First-aid kit, remote", hint: "On board and working — standard line SA-01", lineKey: "fa", defectCategory: "safety_gear" },
      { key: "line.tracks", label: "Recovery tracks (2)", hint: "On board and working — standard line RC-02", lineKey: "tracks", defectCategory: "recovery_gear" },
    ]);
  });

  it("refuses a line without a key", () => {
    expect(() => buildChecklist([line({ key: "" })])).toThrow(InputError);
  });

  it("takes one answer per item, in checklist order, and a note with every fault", () => {
    const list = buildChecklist([line({ key: "fa" })]);
    const answers = list.map((i) => ({ key: i.key, result: "pass" as const })).reverse();
    expect(checkAnswers(list, answers).map((a) => a.key)).toEqual(list.map((i) => i.key));

    const withFault = answers.map((a) => (a.key === "general.lights" ? { key: a.key, result: "fail" as const } : a));
    expect(() => checkAnswers(list, withFault)).toThrow(/Say what is wrong/);
    const noted = withFault.map((a) => (a.key === "general.lights" ? { ...a, note: "Left brake light out" } : a));
    expect(checkSummary(checkAnswers(list, noted))).toEqual({ pass: 8, fail: 1, na: 0 });
  });

  it("names the field at fault for a missing, unknown or doubled answer", () => {
    const list = buildChecklist([]);
    const all = list.map((i) => ({ key: i.key, result: "na" as const }));
    const missing = (() => {
      try {
        checkAnswers(list, all.slice(1));
      } catch (e) {
        return e as InputError;
      }
    })();
    expect(missing).toBeInstanceOf(InputError);
    expect(missing?.message).toContain("Tyres and pressures");
    expect(() => checkAnswers(list, [...all, { key: "general.tyres", result: "pass" }])).toThrow(/answered twice/);
    expect(() => checkAnswers(list, [...all, { key: "line.nope", result: "pass" }])).toThrow(/not on this vehicle's checklist/);
  });
});

describe("answers sent after the standard changed", () => {
  const list = buildChecklist([line({ key: "fa" }), line({ key: "new", code: "CM-03", title: "Satellite messenger", category: "communications" })]);
  const general = GENERAL_CHECK_ITEMS.map((i) => ({ key: i.key, result: "pass" as const }));

  it("keeps a line the phone showed and no longer demands a line added since, when told to", () => {
    const answers = [...general, { key: "line.fa", result: "pass" as const }, { key: "line.gone", result: "na" as const, label: "Long-range fuel tank" }];
    expect(() => checkAnswers(list, answers)).toThrow(InputError);
    const kept = checkAnswers(list, answers, { tolerateLineDrift: true });
    expect(kept.map((a) => [a.key, a.label])).toEqual([
      ...GENERAL_CHECK_ITEMS.map((i) => [i.key, i.label]),
      ["line.fa", "First-aid kit, remote"],
      ["line.gone", "Long-range fuel tank"],
    ]);
    expect(kept.at(-1)?.lineKey).toBe("gone");
  });

  it("still demands every general item and a label on a stray line", () => {
    expect(() => checkAnswers(list, general.slice(1), { tolerateLineDrift: true })).toThrow(/Tyres and pressures/);
    expect(() => checkAnswers(list, [...general, { key: "line.gone", result: "pass" }], { tolerateLineDrift: true })).toThrow(/not on this vehicle's checklist/);
    expect(() => checkAnswers(list, [...general, { key: "general.other", result: "pass", label: "x" }], { tolerateLineDrift: true })).toThrow(InputError);
  });
});
