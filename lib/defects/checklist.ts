import { InputError } from "@/lib/errors";
import type { LineCategory } from "@/lib/variance";
import type { DefectCategory } from "./vocabulary";

/**
 * The pre-trip checklist: the general walk-round every vehicle gets, then the lines of the
 * vehicle's edition marked as checkable (the gear the standard says must be on board).
 * Each item is answered pass, fail (with a note, perhaps a photo) or not applicable.
 */

export const CHECK_RESULTS = ["pass", "fail", "na"] as const;
export type CheckResult = (typeof CHECK_RESULTS)[number];

export const CHECK_RESULT_LABELS: Record<CheckResult, string> = { pass: "OK", fail: "Fault", na: "N/A" };

export type ChecklistItem = {
  /** Stable key of the item: "general.<name>" or "line.<edition line key>". */
  key: string;
  label: string;
  /** What to look at, in a few words. */
  hint: string;
  /** The edition line this item checks, when it comes from the standard. */
  lineKey?: string;
  /** The category a defect raised from this item starts with. */
  defectCategory: DefectCategory;
};

export const GENERAL_CHECK_ITEMS: readonly ChecklistItem[] = [
  { key: "general.tyres", label: "Tyres and pressures", hint: "Tread, cuts, bulges; pressures cold, to the placard", defectCategory: "tyres_wheels" },
  { key: "general.fluids", label: "Fluid levels", hint: "Engine oil, coolant, brake fluid, washer water", defectCategory: "engine_fluids" },
  { key: "general.lights", label: "Lights", hint: "Head, brake, indicators, reverse; lenses clean", defectCategory: "lights_electrical" },
  { key: "general.spare", label: "Spare wheel and jack", hint: "Spare inflated; jack, brace and base on board", defectCategory: "tyres_wheels" },
  { key: "general.recovery", label: "Recovery gear", hint: "Straps, shackles, shovel, tracks; stowed and tied down", defectCategory: "recovery_gear" },
  { key: "general.first_aid", label: "First-aid kit", hint: "Sealed, stocked, in date", defectCategory: "safety_gear" },
  { key: "general.extinguisher", label: "Fire extinguisher", hint: "Gauge in the green, pin in, in date", defectCategory: "safety_gear" },
  { key: "general.comms", label: "Communications", hint: "Radio and satellite device on, charged, tested", defectCategory: "communications" },
];

const CATEGORY_FOR_LINE: Record<LineCategory, DefectCategory> = {
  tyres: "tyres_wheels",
  suspension: "steering_suspension",
  steering_driveline: "steering_suspension",
  protection: "body_glass",
  recovery: "recovery_gear",
  water_dust: "fit_out",
  electrical: "lights_electrical",
  communications: "communications",
  storage: "fit_out",
  lighting_roof: "lights_electrical",
  safety: "safety_gear",
  engineering: "other",
};

/** What the checklist needs of an edition line. */
export type CheckableLine = {
  key: string;
  code: string;
  title: string;
  category: LineCategory;
  quantity: number;
  checkable: boolean;
};

/** The general items, then each checkable line once (by key, in the order given). */
export function buildChecklist(lines: readonly CheckableLine[]): ChecklistItem[] {
  if (!Array.isArray(lines as unknown)) throw new InputError("lines", "lines must be a list");
  const items: ChecklistItem[] = [...GENERAL_CHECK_ITEMS];
  const seen = new Set<string>();
  lines.forEach((line, i) => {
    if (line === null || typeof line !== "object") throw new InputError(`lines.${i}`, "a line is required");
    if (typeof line.key !== "string" || line.key.trim() === "") throw new InputError(`lines.${i}.key`, "a line needs a key");
    if (!(line.category in CATEGORY_FOR_LINE)) throw new InputError(`lines.${i}.category`, "unknown line category");
    if (!line.checkable || seen.has(line.key)) return;
    seen.add(line.key);
    const count = Number.isInteger(line.quantity) && line.quantity > 1 ? ` (${line.quantity})` : "";
    items.push({
      key: `line.${line.key}`,
      label: `${line.title}${count}`,
      hint: `On board and working — standard line ${line.code}`,
      lineKey: line.key,
      defectCategory: CATEGORY_FOR_LINE[line.category],
    });
  });
  return items;
}

export type CheckAnswer = { key: string; result: CheckResult; note?: string | null | undefined; label?: string | undefined };

export type CheckedAnswer = CheckAnswer & { label: string; lineKey?: string };

/**
 * Checks a set of answers against the checklist: every item answered once, no unknown items,
 * and a note on every fault (a fault with no words helps nobody). Returns the answers in
 * checklist order, each with its item's label.
 *
 * `tolerateLineDrift`: a phone may have loaded the checklist before the vehicle's standard
 * changed and sent the check hours later. Then a standard line the phone showed but the
 * checklist no longer has is kept (with the label the phone sent), and a line added since is
 * not demanded. The general items are always demanded.
 */
export function checkAnswers(
  checklist: readonly ChecklistItem[],
  answers: readonly CheckAnswer[],
  options: { tolerateLineDrift?: boolean } = {},
): CheckedAnswer[] {
  if (!Array.isArray(answers as unknown)) throw new InputError("items", "items must be a list");
  const drift = options.tolerateLineDrift === true;
  const byKey = new Map<string, CheckAnswer>();
  const known = new Map(checklist.map((c) => [c.key, c]));
  const strays: CheckedAnswer[] = [];
  answers.forEach((a, i) => {
    if (a === null || typeof a !== "object") throw new InputError(`items.${i}`, "an answer is required");
    if (byKey.has(a.key)) throw new InputError(`items.${i}.key`, `"${a.key}" is answered twice`);
    if (!(CHECK_RESULTS as readonly string[]).includes(a.result)) {
      throw new InputError(`items.${i}.result`, "answer OK, fault or not applicable");
    }
    if (a.result === "fail" && (a.note ?? "").trim() === "") {
      throw new InputError(`items.${i}.note`, "Say what is wrong");
    }
    byKey.set(a.key, a);
    if (!known.has(a.key)) {
      const label = (a.label ?? "").trim();
      if (!(drift && a.key.startsWith("line.") && label !== "")) {
        throw new InputError(`items.${i}.key`, `"${a.key}" is not on this vehicle's checklist`);
      }
      strays.push({ ...a, label, lineKey: a.key.slice("line.".length) });
    }
  });
  const out: CheckedAnswer[] = [];
  checklist.forEach((item, i) => {
    const a = byKey.get(item.key);
    if (!a) {
      if (drift && item.lineKey !== undefined) return;
      throw new InputError("items", `Answer "${item.label}" (item ${i + 1})`);
    }
    out.push({ ...a, label: item.label, ...(item.lineKey !== undefined ? { lineKey: item.lineKey } : {}) });
  });
  return [...out, ...strays];
}

/** Counts of a finished check, for its summary line. */
export function checkSummary(answers: readonly { result: CheckResult }[]): Record<CheckResult, number> {
  const out: Record<CheckResult, number> = { pass: 0, fail: 0, na: 0 };
  for (const a of answers) out[a.result] += 1;
  return out;
}
