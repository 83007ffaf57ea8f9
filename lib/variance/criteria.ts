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
 * Whether one fitment's attributes pass one (already checked) criterion. On a fail, `actual`
 * is the recorded value, or "not recorded".
 */
export function evaluateCriterion(
  criterion: Criterion,
  attributes: Readonly<Record<string, number | string>>,
): CriterionResult {
  const raw = Object.prototype.hasOwnProperty.call(attributes, criterion.attribute)
    ? attributes[criterion.attribute]
    : undefined;
  if (raw === undefined || raw === null || (typeof raw === "string" && raw.trim() === "")) {
    return { pass: false, actual: NOT_RECORDED };
  }
  if (typeof raw === "number" && !Number.isFinite(raw)) return { pass: false, actual: String(raw) };
  const fail = { pass: false as const, actual: raw };
  const { op, value } = criterion;
  switch (op) {
    case "gte":
    case "lte": {
      const a = asNumber(raw);
      const limit = asNumber(value);
      if (a === null || limit === null) return fail;
      return (op === "gte" ? a >= limit : a <= limit) ? { pass: true } : fail;
    }
    case "between": {
      const a = asNumber(raw);
      const [loRaw, hiRaw] = value as (number | string)[];
      const lo = asNumber(loRaw);
      const hi = asNumber(hiRaw);
      if (a === null || lo === null || hi === null) return fail;
      return a >= lo && a <= hi ? { pass: true } : fail;
    }
    case "eq":
      return valuesEqual(raw, value as number | string) ? { pass: true } : fail;
    case "one_of":
      return (value as (number | string)[]).some((v) => valuesEqual(raw, v)) ? { pass: true } : fail;
  }
}
