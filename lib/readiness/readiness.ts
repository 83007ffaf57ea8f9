import { DEFECT_SEVERITIES, type DefectSeverity } from "@/lib/defects/vocabulary";
import { InputError, requireNonNegative } from "@/lib/errors";
import type { Criterion, LineCategory, LineVariance, VehicleVariance } from "@/lib/variance";

/**
 * Trip readiness: may this vehicle go out, and where.
 *
 * Rigline rules (ours, not any law):
 * - not_ready when the vehicle is grounded or retired, has an open "stop" defect, has a short or
 *   off-spec line in the safety, recovery or communications categories (the gear that brings
 *   people home), or carries an item whose expiry has passed.
 * - limited — town and graded roads only — when the vehicle is in fit-out, has an open
 *   "before next trip" defect, has any other short, off-spec or unproven line (unproven safety,
 *   recovery or communications lines included: the gear is there, the proof is not), has a
 *   must-not-fit item fitted, or has an item expiring within `soonDays` (default 30).
 * - ready otherwise. "watch" defects and a vehicle with no edition are noted but change nothing.
 * Every reason names the thing in a plain sentence, so a driver knows what to fix or ask about.
 */

export const VEHICLE_STATES = ["in_service", "in_fitout", "grounded", "retired"] as const;
export type VehicleState = (typeof VEHICLE_STATES)[number];

export { DEFECT_SEVERITIES, type DefectSeverity };

export type OpenDefect = { id: string; severity: DefectSeverity; title: string };
export type ExpiringItem = { label: string; expiresAt: Date };

export type TripReadinessInput = {
  vehicleState: VehicleState;
  /** The vehicle's variance against its edition; absent when it has no edition. */
  variance?: VehicleVariance | null;
  openDefects: readonly OpenDefect[];
  expiringItems: readonly ExpiringItem[];
  now: Date;
  /** Days ahead within which an expiry limits the vehicle; default 30. */
  soonDays?: number;
};

export type ReadinessState = "ready" | "limited" | "not_ready";
/** What a reason does to the state: not_ready and limited set it, note only informs. */
export type ReasonSeverity = "not_ready" | "limited" | "note";

export type ReasonCode =
  | "vehicle_grounded"
  | "vehicle_retired"
  | "stop_defect"
  | "critical_line_short"
  | "critical_line_off_spec"
  | "item_expired"
  | "vehicle_in_fitout"
  | "before_next_trip_defect"
  | "line_short"
  | "line_off_spec"
  | "line_unproven"
  | "prohibited_item_fitted"
  | "item_expiring_soon"
  | "watch_defect"
  | "no_edition";

export type ReadinessReason = {
  code: ReasonCode;
  message: string;
  severity: ReasonSeverity;
  /** Id of the defect or line the reason is about, when there is one. */
  ref?: string;
};

export type TripReadiness = {
  state: ReadinessState;
  /** One sentence for the top of the page. */
  headline: string;
  /** not_ready reasons first, then limited, then notes; within each, in input order. */
  reasons: ReadinessReason[];
};

export const DEFAULT_SOON_DAYS = 30;
export const LIMITED_ROADS = "town and graded roads only";
const ROADS_SENTENCE = "Town and graded roads only";

/** The categories whose gaps keep a vehicle at the depot. */
export const CRITICAL_CATEGORIES: ReadonlySet<LineCategory> = new Set(["safety", "recovery", "communications"]);

const CATEGORY_WORDS: Record<LineCategory, string> = {
  tyres: "Tyres",
  suspension: "Suspension",
  steering_driveline: "Steering and driveline",
  protection: "Protection",
  recovery: "Recovery",
  water_dust: "Water and dust",
  electrical: "Electrical",
  communications: "Communications",
  storage: "Storage",
  lighting_roof: "Lighting and roof",
  safety: "Safety",
  engineering: "Engineering",
};

const DAY_MS = 86_400_000;

function isoDate(d: Date): string {
  return d.toISOString().slice(0, 10);
}

function withUnit(value: number | string, unit: string | undefined): string {
  return unit ? `${value} ${unit}` : String(value);
}

/** "at least 5 W", "between 6 and 10 mm²", "one of Q, R" — the criterion in words. */
export function describeCriterion(c: Criterion): string {
  const list = Array.isArray(c.value) ? c.value : [c.value];
  switch (c.op) {
    case "gte":
      return `at least ${withUnit(String(c.value), c.unit)}`;
    case "lte":
      return `at most ${withUnit(String(c.value), c.unit)}`;
    case "eq":
      return withUnit(String(c.value), c.unit);
    case "between":
      return `between ${list[0]} and ${withUnit(String(list[1]), c.unit)}`;
    case "one_of":
      return `one of ${list.join(", ")}${c.unit ? ` ${c.unit}` : ""}`;
  }
}

function lineName(line: LineVariance): string {
  return `${CATEGORY_WORDS[line.category]} line ${line.code} "${line.title}"`;
}

function shortDetail(line: LineVariance): string {
  const expired = line.expiredFitmentIds.length > 0 ? " (an item on board has expired)" : "";
  const missing = line.missingQuantity;
  return `is short: ${missing} ${missing === 1 ? "item" : "items"} missing${expired}`;
}

function offSpecDetail(line: LineVariance): string {
  const first = line.failing?.[0];
  if (!first) return "is off-spec";
  const name = first.criterion.label ?? first.criterion.attribute;
  const actual =
    first.actual === "not recorded" ? "not recorded" : `${withUnit(first.actual, first.criterion.unit)}`;
  const more = (line.failing?.length ?? 1) > 1 ? ` (and ${(line.failing?.length ?? 1) - 1} more)` : "";
  return `is off-spec: ${name} is ${actual}, needs ${describeCriterion(first.criterion)}${more}`;
}

function checkInput(input: TripReadinessInput): number {
  if (input === null || typeof input !== "object") throw new InputError("input", "input is required");
  if (!(VEHICLE_STATES as readonly string[]).includes(input.vehicleState)) {
    throw new InputError("vehicleState", `vehicleState must be one of ${VEHICLE_STATES.join(", ")}`);
  }
  if (!(input.now instanceof Date) || !Number.isFinite(input.now.getTime())) {
    throw new InputError("now", "now must be a valid date");
  }
  if (!Array.isArray(input.openDefects as unknown)) throw new InputError("openDefects", "openDefects must be a list");
  input.openDefects.forEach((d, i) => {
    if (d === null || typeof d !== "object") throw new InputError(`openDefects.${i}`, "a defect is required");
    if (!(DEFECT_SEVERITIES as readonly string[]).includes(d.severity)) {
      throw new InputError(`openDefects.${i}.severity`, `severity must be one of ${DEFECT_SEVERITIES.join(", ")}`);
    }
    if (typeof d.title !== "string" || d.title.trim() === "") {
      throw new InputError(`openDefects.${i}.title`, "a defect needs a title");
    }
  });
  if (!Array.isArray(input.expiringItems as unknown)) throw new InputError("expiringItems", "expiringItems must be a list");
  input.expiringItems.forEach((item, i) => {
    if (item === null || typeof item !== "object") throw new InputError(`expiringItems.${i}`, "an item is required");
    if (typeof item.label !== "string" || item.label.trim() === "") {
      throw new InputError(`expiringItems.${i}.label`, "an expiring item needs a label");
    }
    if (!(item.expiresAt instanceof Date) || !Number.isFinite(item.expiresAt.getTime())) {
      throw new InputError(`expiringItems.${i}.expiresAt`, "expiresAt must be a valid date");
    }
  });
  const v = input.variance;
  if (v !== null && v !== undefined && (typeof v !== "object" || !Array.isArray(v.lines))) {
    throw new InputError("variance", "variance must be a vehicle variance or absent");
  }
  const soonDays = input.soonDays ?? DEFAULT_SOON_DAYS;
  requireNonNegative("soonDays", soonDays);
  return soonDays;
}

export function tripReadiness(input: TripReadinessInput): TripReadiness {
  const soonDays = checkInput(input);
  const nowMs = input.now.getTime();
  const stop: ReadinessReason[] = [];
  const limit: ReadinessReason[] = [];
  const notes: ReadinessReason[] = [];
  const limited = (code: ReasonCode, message: string, ref?: string) =>
    limit.push({ code, message, severity: "limited", ...(ref ? { ref } : {}) });
  const until = (what: string) => ` ${ROADS_SENTENCE} until ${what}.`;

  switch (input.vehicleState) {
    case "grounded":
      stop.push({ code: "vehicle_grounded", message: "Vehicle is grounded: it stays at the depot until a manager returns it to service.", severity: "not_ready" });
      break;
    case "retired":
      stop.push({ code: "vehicle_retired", message: "Vehicle is retired from the fleet and is not to be driven.", severity: "not_ready" });
      break;
    case "in_fitout":
      limited("vehicle_in_fitout", `Vehicle is in fit-out: ${LIMITED_ROADS} until the work is signed off.`);
      break;
    case "in_service":
      break;
  }

  for (const d of input.openDefects) {
    if (d.severity === "stop") {
      stop.push({ code: "stop_defect", message: `Defect "${d.title}" is a stop defect: fix it before the vehicle moves.`, severity: "not_ready", ref: d.id });
    } else if (d.severity === "before_next_trip") {
      limited("before_next_trip_defect", `Defect "${d.title}" must be fixed before the next trip; until then, ${LIMITED_ROADS}.`, d.id);
    } else {
      notes.push({ code: "watch_defect", message: `Defect "${d.title}" is on watch: check it on the pre-trip walk-round.`, severity: "note", ref: d.id });
    }
  }

  const variance = input.variance;
  if (variance === null || variance === undefined) {
    notes.push({ code: "no_edition", message: "No fit-out standard is assigned to this vehicle, so its gear is not checked.", severity: "note" });
  } else {
    for (const line of variance.lines) {
      const critical = CRITICAL_CATEGORIES.has(line.category);
      if (line.status === "short") {
        if (critical) {
          stop.push({ code: "critical_line_short", message: `${lineName(line)} ${shortDetail(line)}.`, severity: "not_ready", ref: line.lineId });
        } else limited("line_short", `${lineName(line)} ${shortDetail(line)}.${until("it is fitted")}`, line.lineId);
      } else if (line.status === "off_spec") {
        if (critical) {
          stop.push({ code: "critical_line_off_spec", message: `${lineName(line)} ${offSpecDetail(line)}.`, severity: "not_ready", ref: line.lineId });
        } else limited("line_off_spec", `${lineName(line)} ${offSpecDetail(line)}.${until("it is put right")}`, line.lineId);
      } else if (line.status === "unproven") {
        const kinds = (line.evidenceMissing ?? []).map((k) => k.replace(/_/g, " ")).join(", ");
        const awaiting = kinds ? ` (awaiting ${kinds})` : "";
        limited("line_unproven", `${lineName(line)} is fitted but not yet proven${awaiting}.${until("the evidence is accepted")}`, line.lineId);
      } else if (line.status === "prohibited_fitted") {
        limited("prohibited_item_fitted", `${lineName(line)} must not be fitted, but is.${until("it is removed")}`, line.lineId);
      }
    }
  }

  const soonMs = soonDays * DAY_MS;
  for (const item of input.expiringItems) {
    const leftMs = item.expiresAt.getTime() - nowMs;
    if (leftMs <= 0) {
      stop.push({ code: "item_expired", message: `${item.label} expired on ${isoDate(item.expiresAt)}: replace it before the trip.`, severity: "not_ready" });
    } else if (leftMs <= soonMs) {
      const days = Math.ceil(leftMs / DAY_MS);
      const inDays = `in ${days} ${days === 1 ? "day" : "days"}`;
      limited("item_expiring_soon", `${item.label} expires on ${isoDate(item.expiresAt)} (${inDays}).${until("it is replaced")}`);
    }
  }

  const state: ReadinessState = stop.length > 0 ? "not_ready" : limit.length > 0 ? "limited" : "ready";
  const headline =
    state === "not_ready"
      ? "Not ready: this vehicle does not go out."
      : state === "limited"
        ? `Limited: ${LIMITED_ROADS}.`
        : "Ready for the trip.";
  return { state, headline, reasons: [...stop, ...limit, ...notes] };
}
