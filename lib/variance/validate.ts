import { InputError, requireFinite, requireNonNegative } from "@/lib/errors";
import { EVIDENCE_STATES as EVIDENCE_STATUSES } from "@/lib/jobs/evidence-states";
import { checkCriterion } from "./criteria";
import {
  EVIDENCE_KINDS,
  LINE_CATEGORIES,
  MASS_KINDS,
  REQUIREMENTS,
  ZONES,
  type Concession,
  type EditionLine,
  type Fitment,
} from "./types";

// Guards for the shapes the database hands us: a bad row throws InputError naming the field,
// so no computation runs on NaN, a missing date or an unknown status.

export function requireDate(field: string, value: unknown): Date {
  if (!(value instanceof Date) || !Number.isFinite(value.getTime())) {
    throw new InputError(field, `${field} must be a valid date`);
  }
  return value;
}

function requireDateOrNull(field: string, value: unknown): void {
  if (value !== null) requireDate(field, value);
}

function requireText(field: string, value: unknown): void {
  if (typeof value !== "string" || value.trim() === "") {
    throw new InputError(field, `${field} must be non-empty text`);
  }
}

function requireOneOf(field: string, value: unknown, allowed: readonly string[]): void {
  if (typeof value !== "string" || !allowed.includes(value)) {
    throw new InputError(field, `${field} must be one of ${allowed.join(", ")}`);
  }
}

function requireIntegerAtLeast(field: string, value: unknown, min: number): void {
  requireFinite(field, value as number);
  if (!Number.isInteger(value) || (value as number) < min) {
    throw new InputError(field, `${field} must be a whole number of at least ${min}`);
  }
}

function requireArray(field: string, value: unknown): asserts value is unknown[] {
  if (!Array.isArray(value)) throw new InputError(field, `${field} must be a list`);
}

export function checkLine(field: string, line: EditionLine): void {
  if (line === null || typeof line !== "object") throw new InputError(field, `${field} must be a line`);
  requireText(`${field}.id`, line.id);
  requireText(`${field}.key`, line.key);
  requireText(`${field}.code`, line.code);
  requireText(`${field}.title`, line.title);
  requireOneOf(`${field}.category`, line.category, LINE_CATEGORIES);
  requireOneOf(`${field}.requirement`, line.requirement, REQUIREMENTS);
  requireIntegerAtLeast(`${field}.quantity`, line.quantity, 1);
  requireNonNegative(`${field}.massKg`, line.massKg);
  if (line.xMm !== null) requireFinite(`${field}.xMm`, line.xMm);
  if (line.zone !== null) requireOneOf(`${field}.zone`, line.zone, ZONES);
  requireOneOf(`${field}.massKind`, line.massKind, MASS_KINDS);
  requireArray(`${field}.criteria`, line.criteria);
  line.criteria.forEach((c, i) => checkCriterion(`${field}.criteria.${i}`, c));
  requireArray(`${field}.evidenceNeeded`, line.evidenceNeeded);
  line.evidenceNeeded.forEach((k, i) => requireOneOf(`${field}.evidenceNeeded.${i}`, k, EVIDENCE_KINDS));
  requireIntegerAtLeast(`${field}.standardCostCents`, line.standardCostCents, 0);
  requireArray(`${field}.dependsOn`, line.dependsOn);
  line.dependsOn.forEach((d, i) => requireText(`${field}.dependsOn.${i}`, d));
  if (line.expiryMonths !== null) requireIntegerAtLeast(`${field}.expiryMonths`, line.expiryMonths, 1);
}


function isDate(value: unknown): boolean {
  return value instanceof Date && Number.isFinite(value.getTime());
}

/**
 * Fast yes/no form of checkFitment for hot loops; when it says no, call checkFitment to get the
 * InputError naming the field.
 */
export function isSoundFitment(f: Fitment): boolean {
  if (f === null || typeof f !== "object") return false;
  if (typeof f.id !== "string" || f.id.trim() === "") return false;
  if (f.lineId !== null && typeof f.lineId !== "string") return false;
  if (!Number.isInteger(f.quantity) || f.quantity < 0) return false;
  if (f.attributes === null || typeof f.attributes !== "object") return false;
  if (!isDate(f.fittedAt)) return false;
  if (f.removedAt !== null && !isDate(f.removedAt)) return false;
  if (f.expiresAt !== null && !isDate(f.expiresAt)) return false;
  if (!Array.isArray(f.evidence)) return false;
  for (const e of f.evidence) {
    if (e === null || typeof e !== "object") return false;
    if (!(EVIDENCE_KINDS as readonly string[]).includes(e.kind) || !EVIDENCE_STATUSES.includes(e.status)) return false;
  }
  return true;
}

export function checkFitment(field: string, fitment: Fitment): void {
  if (fitment === null || typeof fitment !== "object") {
    throw new InputError(field, `${field} must be a fitment`);
  }
  requireText(`${field}.id`, fitment.id);
  if (fitment.lineId !== null && typeof fitment.lineId !== "string") {
    throw new InputError(`${field}.lineId`, `${field}.lineId must be a line id or null`);
  }
  requireIntegerAtLeast(`${field}.quantity`, fitment.quantity, 0);
  if (fitment.attributes === null || typeof fitment.attributes !== "object") {
    throw new InputError(`${field}.attributes`, `${field}.attributes must be a record`);
  }
  requireDate(`${field}.fittedAt`, fitment.fittedAt);
  requireDateOrNull(`${field}.removedAt`, fitment.removedAt);
  requireDateOrNull(`${field}.expiresAt`, fitment.expiresAt);
  requireArray(`${field}.evidence`, fitment.evidence);
  fitment.evidence.forEach((e, i) => {
    requireOneOf(`${field}.evidence.${i}.kind`, e?.kind, EVIDENCE_KINDS);
    requireOneOf(`${field}.evidence.${i}.status`, e?.status, EVIDENCE_STATUSES);
  });
}

export function checkConcession(field: string, concession: Concession): void {
  if (concession === null || typeof concession !== "object") {
    throw new InputError(field, `${field} must be a concession`);
  }
  requireText(`${field}.lineId`, concession.lineId);
  requireDate(`${field}.expiresAt`, concession.expiresAt);
}
