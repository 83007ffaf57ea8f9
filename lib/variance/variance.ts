import { InputError } from "@/lib/errors";
import { compileCriterion, evaluateCompiled, type CompiledCriterion } from "./criteria";
import type {
  Concession,
  EditionLine,
  EvidenceKind,
  ExtraFitment,
  FailingCriterion,
  Fitment,
  LineStatus,
  LineVariance,
  VarianceSummary,
  VehicleVariance,
  VehicleVarianceInput,
} from "./types";
import { checkConcession, checkFitment, checkLine, isSoundFitment, requireDate } from "./validate";

/**
 * Variance of a vehicle against its edition, line by line.
 *
 * Rigline rules:
 * - A fitment counts at `now` when it was fitted on or before `now` and not removed on or before
 *   `now` (so the same data answers "as at" questions). Removed fitments do not count at all.
 * - A counted fitment whose expiry is on or before `now` stays on the vehicle but does not count
 *   towards the quantity: an expired first-aid kit leaves its line short.
 * - must_fit: short when the unexpired quantity is below the line's quantity; otherwise off_spec
 *   when a fitment fails a criterion; otherwise unproven when a fitment lacks an accepted piece of
 *   each evidence kind the line needs; otherwise meets. Short outranks off_spec, which outranks
 *   unproven (the larger gap is named; failing criteria are still listed).
 * - may_fit: nothing fitted is optional_absent, counted nowhere in the summary. Once fitted it is
 *   judged on criteria and evidence like must_fit (its quantity is a design figure, not a
 *   minimum); fitted but every item expired is short.
 * - must_not_fit: any fitment on the vehicle (expired or not) is prohibited_fitted, else meets.
 * - A concession that expires after `now` turns any of short, off_spec, unproven or
 *   prohibited_fitted into concession. A concession that has lapsed covers nothing: the line
 *   shows what it really is (short when missing).
 * - Fitments with no line, or a line not in this edition, are extras.
 */

const GAP_STATUSES: ReadonlySet<LineStatus> = new Set(["short", "off_spec", "unproven", "prohibited_fitted"]);

function counts(fitment: Fitment, nowMs: number): boolean {
  if (fitment.fittedAt.getTime() > nowMs) return false;
  return fitment.removedAt === null || fitment.removedAt.getTime() > nowMs;
}

function expired(fitment: Fitment, nowMs: number): boolean {
  return fitment.expiresAt !== null && fitment.expiresAt.getTime() <= nowMs;
}

const NO_IDS: readonly string[] = Object.freeze([]);

function hasAccepted(f: Fitment, kind: EvidenceKind): boolean {
  for (const e of f.evidence) if (e.kind === kind && e.status === "accepted") return true;
  return false;
}

/** Judges one checked line from its own (checked) fitments and concessions. */
function judgeLine(
  line: EditionLine,
  criteria: readonly CompiledCriterion[],
  lineFitments: readonly Fitment[],
  lineConcessions: readonly Concession[],
  nowMs: number,
): LineVariance {
  // Hot path (a fleet is thousands of vehicles × dozens of lines): plain loops, few allocations,
  // and one object literal of fixed shape at the end.
  let fitmentIds: readonly string[] = NO_IDS;
  let expiredFitmentIds: readonly string[] = NO_IDS;
  let fittedQuantity = 0;
  let currentCount = 0;
  for (const f of lineFitments) {
    if (!counts(f, nowMs)) continue;
    fitmentIds = fitmentIds === NO_IDS ? [f.id] : [...fitmentIds, f.id];
    if (expired(f, nowMs)) {
      expiredFitmentIds = expiredFitmentIds === NO_IDS ? [f.id] : [...expiredFitmentIds, f.id];
    } else {
      fittedQuantity += f.quantity;
      currentCount += 1;
    }
  }

  let status: LineStatus;
  let failing: FailingCriterion[] | undefined;
  let evidenceMissing: EvidenceKind[] | undefined;
  let missingQuantity = 0;
  if (line.requirement === "must_not_fit") {
    status = fitmentIds.length > 0 ? "prohibited_fitted" : "meets";
  } else if (line.requirement === "may_fit" && fitmentIds.length === 0) {
    status = "optional_absent";
  } else {
    const isShort = line.requirement === "must_fit" ? fittedQuantity < line.quantity : currentCount === 0;
    if (currentCount > 0 && (line.criteria.length > 0 || line.evidenceNeeded.length > 0)) {
      for (const f of lineFitments) {
        if (!counts(f, nowMs) || expired(f, nowMs)) continue;
        for (const compiled of criteria) {
          const r = evaluateCompiled(compiled, f.attributes);
          if (!r.pass) (failing ??= []).push({ criterion: compiled.criterion, actual: r.actual, fitmentId: f.id });
        }
        for (const kind of line.evidenceNeeded) {
          if (evidenceMissing?.includes(kind)) continue;
          if (!hasAccepted(f, kind)) (evidenceMissing ??= []).push(kind);
        }
      }
    }
    if (isShort) {
      status = "short";
      missingQuantity = Math.max(0, line.quantity - fittedQuantity);
    } else if (failing) status = "off_spec";
    else if (evidenceMissing) status = "unproven";
    else status = "meets";
  }

  let concession: Concession | undefined;
  let concessionExpiredAt: Date | undefined;
  if (lineConcessions.length > 0 && GAP_STATUSES.has(status)) {
    let lapsedAtMs = -Infinity;
    for (const c of lineConcessions) {
      const t = c.expiresAt.getTime();
      if (t > nowMs) {
        if (!concession || t > concession.expiresAt.getTime()) concession = c;
      } else if (t > lapsedAtMs) lapsedAtMs = t;
    }
    if (concession) status = "concession";
    else concessionExpiredAt = new Date(lapsedAtMs);
  }

  return {
    lineId: line.id,
    key: line.key,
    code: line.code,
    title: line.title,
    category: line.category,
    requirement: line.requirement,
    status,
    failing,
    fittedQuantity,
    requiredQuantity: line.requirement === "must_fit" ? line.quantity : 0,
    missingQuantity,
    fitmentIds,
    expiredFitmentIds,
    evidenceMissing,
    concession,
    concessionExpiredAt,
    massKg: line.massKg,
    standardCostCents: line.standardCostCents,
  };
}

/**
 * Variance of one line. `fitments` and `concessions` may be the vehicle's full lists: only those
 * pointing at this line are used.
 */
export function lineVariance(
  line: EditionLine,
  fitments: readonly Fitment[],
  concessions: readonly Concession[],
  now: Date,
): LineVariance {
  requireDate("now", now);
  checkLine("line", line);
  if (!Array.isArray(fitments as unknown)) throw new InputError("fitments", "fitments must be a list");
  if (!Array.isArray(concessions as unknown)) throw new InputError("concessions", "concessions must be a list");
  const own: Fitment[] = [];
  fitments.forEach((f, i) => {
    checkFitment(`fitments.${i}`, f);
    if (f.lineId === line.id) own.push(f);
  });
  const ownConcessions: Concession[] = [];
  concessions.forEach((c, i) => {
    checkConcession(`concessions.${i}`, c);
    if (c.lineId === line.id) ownConcessions.push(c);
  });
  return judgeLine(line, line.criteria.map(compileCriterion), own, ownConcessions, now.getTime());
}

export function emptySummary(): VarianceSummary {
  return { meets: 0, short: 0, offSpec: 0, unproven: 0, concession: 0, prohibitedFitted: 0, extra: 0 };
}

/** Adds one line's status to a summary (optional_absent is counted nowhere). */
export function countStatus(summary: VarianceSummary, status: LineStatus): void {
  switch (status) {
    case "meets":
      summary.meets += 1;
      break;
    case "short":
      summary.short += 1;
      break;
    case "off_spec":
      summary.offSpec += 1;
      break;
    case "unproven":
      summary.unproven += 1;
      break;
    case "concession":
      summary.concession += 1;
      break;
    case "prohibited_fitted":
      summary.prohibitedFitted += 1;
      break;
    case "optional_absent":
      break;
  }
}

// A fleet run passes the same edition's lines array for every vehicle: check it once. The cache
// holds each line object and its id, so a changed array or a swapped line is checked again
// (lines are read as frozen, like a published edition, between calls).
type CheckedEdition = {
  lines: EditionLine[];
  ids: string[];
  indexOf: Map<string, number>;
  criteria: CompiledCriterion[][];
};
const checkedEditions = new WeakMap<readonly EditionLine[], CheckedEdition>();
const NONE: readonly never[] = Object.freeze([]);

function checkedEdition(lines: readonly EditionLine[]): CheckedEdition {
  const cached = checkedEditions.get(lines);
  if (cached && cached.lines.length === lines.length) {
    let same = true;
    for (let i = 0; i < lines.length && same; i++) {
      const line = lines[i];
      same = line === cached.lines[i] && line !== undefined && line.id === cached.ids[i];
    }
    if (same) return cached;
  }
  const indexOf = new Map<string, number>();
  lines.forEach((line, i) => {
    checkLine(`lines.${i}`, line);
    if (indexOf.has(line.id)) throw new InputError(`lines.${i}.id`, `line id ${line.id} appears twice`);
    indexOf.set(line.id, i);
  });
  const checked = {
    lines: [...lines],
    ids: lines.map((l) => l.id),
    indexOf,
    criteria: lines.map((l) => l.criteria.map(compileCriterion)),
  };
  checkedEditions.set(lines, checked);
  return checked;
}

/** Variance of a vehicle: every line of its edition, plus the fitments the edition does not ask for. */
export function vehicleVariance(input: VehicleVarianceInput): VehicleVariance {
  if (input === null || typeof input !== "object") throw new InputError("input", "input is required");
  const { lines, fitments, concessions, now } = input;
  requireDate("now", now);
  if (!Array.isArray(lines as unknown)) throw new InputError("lines", "lines must be a list");
  if (!Array.isArray(fitments as unknown)) throw new InputError("fitments", "fitments must be a list");
  if (!Array.isArray(concessions as unknown)) throw new InputError("concessions", "concessions must be a list");
  const nowMs = now.getTime();

  const edition = checkedEdition(lines);

  // Index once by line position so a vehicle costs O(lines + fitments), not O(lines × fitments).
  const byLine: (Fitment[] | undefined)[] = new Array(lines.length);
  const extras: ExtraFitment[] = [];
  for (let i = 0; i < fitments.length; i++) {
    const f = fitments[i] as Fitment;
    // Build the dotted field name only when the fitment is bad (this loop is hot).
    if (!isSoundFitment(f)) checkFitment(`fitments.${i}`, f);
    const at = f.lineId === null ? undefined : edition.indexOf.get(f.lineId);
    if (at !== undefined) {
      const list = byLine[at];
      if (list) list.push(f);
      else byLine[at] = [f];
    } else if (counts(f, nowMs)) {
      extras.push({ fitmentId: f.id, label: f.label });
    }
  }
  let concessionsByLine: (Concession[] | undefined)[] | undefined;
  for (let i = 0; i < concessions.length; i++) {
    const c = concessions[i] as Concession;
    checkConcession(`concessions.${i}`, c);
    const at = edition.indexOf.get(c.lineId);
    if (at === undefined) continue; // a concession for a line of another edition covers nothing here
    concessionsByLine ??= new Array(lines.length);
    const list = concessionsByLine[at];
    if (list) list.push(c);
    else concessionsByLine[at] = [c];
  }

  const summary = emptySummary();
  const results: LineVariance[] = new Array(lines.length);
  for (let i = 0; i < lines.length; i++) {
    const r = judgeLine(lines[i] as EditionLine, edition.criteria[i] ?? NONE, byLine[i] ?? NONE, concessionsByLine?.[i] ?? NONE, nowMs);
    countStatus(summary, r.status);
    results[i] = r;
  }
  summary.extra = extras.length;
  return { summary, lines: results, extras };
}
