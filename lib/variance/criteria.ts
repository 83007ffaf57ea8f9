import { InputError } from "@/lib/errors";
import { CRITERION_OPS, type Criterion } from "./types";

/**
 * Evaluating a line's acceptance criteria against a fitment's recorded attributes.
 *
 * Rigline rules:
 * - Numbers compare numerically; a numeric string ("116", " 2.5 ") is read as its number.
 * - Other strings compare ignoring case and all white space, so a tyre size written
 *   "265/70R17" equals "265/70 r17" (the ISO metric designation has no meaningful spaces or
 *   case). A prefix such as "LT" is part of the designation and is not dropped.
 * - `between` is inclusive at both ends; `one_of` passes when any listed value matches.
 * - A missing or blank attribute fails, with the actual value "not recorded".
 */

export const NOT_RECORDED = "not recorded";

const NUMERIC = /^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?$/;

/** The number a value stands for, or null when it is not a finite number or numeric string. */
export function asNumber(value: unknown): number | null {
  if (typeof value === "number") return Number.isFinite(value) ? value : null;
  if (typeof value !== "string") return null;
  const trimmed = value.trim();
  if (!NUMERIC.test(trimmed)) return null;
  const n = Number(trimmed);
  return Number.isFinite(n) ? n : null;
}

/** Case- and space-insensitive form of a text value. */
export function normaliseText(value: string): string {
  return value.replace(/\s+/gu, "").toLowerCase();
}

/** Equality under the Rigline rules: numerically when both sides are numbers, else as text. */
export function valuesEqual(actual: number | string, expected: number | string): boolean {
  const a = asNumber(actual);
  const e = asNumber(expected);
  if (a !== null && e !== null) return a === e;
  // Otherwise compare as text (one numeric side never matches a word: "17" is not "R17").
  return normaliseText(String(actual)) === normaliseText(String(expected));
}

/** Throws InputError unless the criterion is well formed (so evaluation never guesses). */
export function checkCriterion(field: string, criterion: Criterion): void {
  if (criterion === null || typeof criterion !== "object") {
    throw new InputError(field, `${field} must be a criterion`);
  }
  if (typeof criterion.attribute !== "string" || criterion.attribute.trim() === "") {
    throw new InputError(`${field}.attribute`, `${field}.attribute must name an attribute`);
  }
  if (!(CRITERION_OPS as readonly string[]).includes(criterion.op)) {
    throw new InputError(`${field}.op`, `${field}.op must be one of ${CRITERION_OPS.join(", ")}`);
  }
  const { op, value } = criterion;
  const vf = `${field}.value`;
  switch (op) {
    case "gte":
    case "lte":
      if (asNumber(value) === null) throw new InputError(vf, `${vf} must be a number for "${op}"`);
      return;
    case "eq":
      if (!isScalar(value)) throw new InputError(vf, `${vf} must be a single number or text for "eq"`);
      return;
    case "between": {
      if (!Array.isArray(value) || value.length !== 2) {
        throw new InputError(vf, `${vf} must be [low, high] for "between"`);
      }
      const lo = asNumber(value[0]);
      const hi = asNumber(value[1]);
      if (lo === null || hi === null) throw new InputError(vf, `${vf} bounds must be numbers`);
      if (lo > hi) throw new InputError(vf, `${vf} low bound must not exceed the high bound`);
      return;
    }
    case "one_of":
      if (!Array.isArray(value) || value.length === 0 || !value.every(isScalar)) {
        throw new InputError(vf, `${vf} must be a non-empty list of numbers or text for "one_of"`);
      }
      return;
  }
}

function isScalar(value: unknown): value is number | string {
  return (typeof value === "number" && Number.isFinite(value)) || typeof value === "string";
}

export type CriterionResult = { pass: true } | { pass: false; actual: number | string };

/**
 * A checked criterion with its limits read once (numbers parsed, text normalised), so judging a
 * fleet does not re-parse the same edition's criteria for every vehicle.
 */
export type CompiledCriterion = {
  criterion: Criterion;
  lo: number;
  hi: number;
  /** For eq and one_of: each expected value as a number (or null) and as normalised text. */
  options: { num: number | null; text: string }[];
};

export function compileCriterion(criterion: Criterion): CompiledCriterion {
  const { op, value } = criterion;
  let lo = -Infinity;
  let hi = Infinity;
  let options: CompiledCriterion["options"] = [];
  if (op === "gte") lo = asNumber(value) ?? Infinity;
  else if (op === "lte") hi = asNumber(value) ?? -Infinity;
  else if (op === "between" && Array.isArray(value)) {
    lo = asNumber(value[0]) ?? Infinity;
    hi = asNumber(value[1]) ?? -Infinity;
  } else {
    const list = Array.isArray(value) ? value : [value];
    options = list.map((v) => ({ num: asNumber(v), text: normaliseText(String(v)) }));
  }
  return { criterion, lo, hi, options };
}

const PASS: CriterionResult = Object.freeze({ pass: true });

/** evaluateCriterion for a compiled criterion (same rules, no re-parsing). */
export function evaluateCompiled(
  compiled: CompiledCriterion,
  attributes: Readonly<Record<string, number | string>>,
): CriterionResult {
  const name = compiled.criterion.attribute;
  const raw = Object.hasOwn(attributes, name) ? attributes[name] : undefined;
  if (raw === undefined || raw === null || (typeof raw === "string" && raw.trim() === "")) {
    return { pass: false, actual: NOT_RECORDED };
  }
  if (typeof raw === "number" && !Number.isFinite(raw)) return { pass: false, actual: String(raw) };
  const op = compiled.criterion.op;
  if (op === "gte" || op === "lte" || op === "between") {
    const a = typeof raw === "number" ? raw : asNumber(raw);
    return a !== null && a >= compiled.lo && a <= compiled.hi ? PASS : { pass: false, actual: raw };
  }
  const a = typeof raw === "number" ? raw : asNumber(raw);
  let text: string | undefined;
  for (const o of compiled.options) {
    if (a !== null && o.num !== null) {
      if (a === o.num) return PASS;
    } else if ((text ??= normaliseText(String(raw))) === o.text) return PASS;
  }
  return { pass: false, actual: raw };
}

/**
 * Whether one fitment's attributes pass one (already checked) criterion. On a fail, `actual`
 * is the recorded value, or "not recorded".
 */
export function evaluateCriterion(
  criterion: Criterion,
  attributes: Readonly<Record<string, number | string>>,
): CriterionResult {
  return evaluateCompiled(compileCriterion(criterion), attributes);
}
