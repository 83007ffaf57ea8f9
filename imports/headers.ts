import { InputError } from "@/lib/errors";
import { REQUIRED_VEHICLE_FIELDS, VEHICLE_FIELD_INFO, VEHICLE_FIELDS, isVehicleField, type VehicleField } from "./fields";
import { getOwn, putOwn } from "./own";

/**
 * Column matching: a file's headings are normalised (case, punctuation, accents, units and the
 * many ways of writing "number" set aside) and looked up among the spellings people use.
 */

/** Spellings, already in normalised form (see `normaliseHeader`). */
const SPELLINGS: Readonly<Record<VehicleField, readonly string[]>> = {
  fleetNumber: [
    "fleet number", "fleet", "fleet id", "fleet code", "fleet ref", "unit", "unit number", "unit id",
    "asset number", "asset", "asset id", "vehicle number", "vehicle id",
  ],
  vin: ["vin", "vin number", "chassis number", "chassis", "chassis vin", "vin chassis number", "vehicle identification number"],
  registration: [
    "registration", "registration number", "rego", "rego number", "reg", "reg number", "plate", "plate number",
    "number plate", "licence plate", "license plate", "registration plate",
  ],
  registrationExpiry: [
    "registration expiry", "registration expiry date", "registration expires", "registration due", "registration renewal",
    "rego expiry", "rego expiry date", "rego expires", "rego due", "rego renewal", "expiry", "expiry date",
  ],
  make: ["make", "manufacturer", "brand", "vehicle make"],
  model: ["model", "vehicle model"],
  variant: ["variant", "model variant", "trim", "badge", "grade"],
  buildYear: ["build year", "year", "year built", "year of manufacture", "manufacture year", "yom"],
  depot: ["depot", "depot name", "depot code", "base", "home base", "location", "site"],
  costCentre: ["cost centre", "cost center", "cost centre code", "cost center code", "cost code", "cc"],
  state: ["status", "vehicle status", "service status", "state", "vehicle state", "service state"],
  odometerKm: [
    "odometer", "odometer reading", "current odometer", "odo", "odo reading", "km", "kms", "kilometres",
    "kilometers", "mileage",
  ],
  kerbMassKg: ["kerb mass", "kerb weight", "curb mass", "curb weight", "kerb"],
  gvmKg: ["gvm", "gvm rating", "gross vehicle mass", "gvw", "gross vehicle weight"],
  frontAxleRatingKg: [
    "front axle rating", "front axle", "front axle limit", "front axle capacity", "front axle load rating",
    "front axle mass rating", "front axle max",
  ],
  rearAxleRatingKg: [
    "rear axle rating", "rear axle", "rear axle limit", "rear axle capacity", "rear axle load rating",
    "rear axle mass rating", "rear axle max",
  ],
  notes: ["notes", "note", "comments", "comment", "remarks"],
};


/** Unit words that may trail a heading ("Odometer km", "GVM kg"). */
const UNIT_WORDS = new Set(["kg", "kgs", "kilograms", "km", "kms", "t", "tonnes", "mm"]);
/** Ways of writing "number" after a noun ("Fleet No", "Fleet #", "Unit Nbr"). */
const NUMBER_WORDS = new Set(["no", "num", "nbr", "nr", "number"]);

/**
 * Lower-cased words of a heading with accents, punctuation, bracketed units and trailing unit
 * words removed, and every way of writing "number" spelled "number".
 * "Fleet #" → "fleet number"; "Kerb mass (kg)" → "kerb mass"; "fleetNumber" → "fleet number".
 */
export function normaliseHeader(header: string): string {
  let text = header
    .normalize("NFKD")
    .replace(/[\u0300-\u036f]/g, "")
    .replace(/([a-z])([A-Z])/g, "$1 $2")
    .toLowerCase()
    .replace(/[#№]/g, " number ");
  const withoutBrackets = text.replace(/\([^)]*\)|\[[^\]]*\]/g, " ");
  if (/[a-z0-9]/.test(withoutBrackets)) text = withoutBrackets;
  const words = text.split(/[^a-z0-9]+/).filter((word) => word.length > 0).map((word) => (NUMBER_WORDS.has(word) ? "number" : word));
  while (words.length > 1 && UNIT_WORDS.has(words[words.length - 1] ?? "")) words.pop();
  return words.join(" ");
}

const FIELD_BY_SPELLING: ReadonlyMap<string, VehicleField> = (() => {
  const map = new Map<string, VehicleField>();
  for (const field of VEHICLE_FIELDS) {
    for (const spelling of SPELLINGS[field]) map.set(spelling, field);
    // Our own template headings and the field names themselves always match.
    map.set(normaliseHeader(VEHICLE_FIELD_INFO[field].header), field);
    map.set(normaliseHeader(field), field);
  }
  return map;
})();

/** The field a heading names on its own, or null. */
export function suggestField(header: string): VehicleField | null {
  return FIELD_BY_SPELLING.get(normaliseHeader(header)) ?? null;
}

/** True when a heading is one we recognise; used to find the header row under a title. */
export function isKnownHeader(header: string): boolean {
  return suggestField(header) !== null;
}

/** Which file heading feeds which field; null means the column is not imported. */
export type HeaderMapping = Record<string, VehicleField | null>;

export interface DuplicateClaim {
  field: VehicleField;
  /** Every heading that claimed the field, in file order. */
  headers: string[];
  /** The heading kept in the mapping (the user's choice first, then the leftmost). */
  kept: string;
}

export interface HeaderMatch {
  mapping: HeaderMapping;
  /** How each mapped heading got its field. */
  sources: Record<string, "saved" | "automatic">;
  /** Headings we could not match and the user did not map: they are not imported. */
  unknown: string[];
  /** Fields claimed by more than one heading; all but `kept` are set to null. */
  duplicates: DuplicateClaim[];
  /** Required fields no heading feeds. */
  missingRequired: VehicleField[];
  /** True when rows can be validated with this mapping (every required field is fed). */
  ready: boolean;
}

/**
 * Matches a file's headings to our fields. A saved or user-corrected mapping (same shape as the
 * result's `mapping`) wins for every heading it names, including null for "do not import";
 * headings it does not name are matched automatically; names of headings absent from this file
 * are ignored, so a mapping saved from last month's file can be reused.
 */
export function matchHeaders(headers: readonly string[], savedMapping?: Readonly<Record<string, string | null>>): HeaderMatch {
  const mapping: HeaderMapping = {};
  const sources: Record<string, "saved" | "automatic"> = {};
  const unknown: string[] = [];
  const claims = new Map<VehicleField, { header: string; saved: boolean }[]>();

  headers.forEach((header) => {
    const saved = savedMapping === undefined ? undefined : getOwn(savedMapping, header);
    let field: VehicleField | null;
    let fromSaved = false;
    if (saved !== undefined) {
      if (saved !== null && !isVehicleField(saved)) {
        throw new InputError(`mapping.${header}`, `"${saved}" is not a vehicle field`);
      }
      field = saved;
      fromSaved = true;
    } else {
      field = suggestField(header);
    }
    putOwn<VehicleField | null>(mapping, header, field);
    if (field === null) {
      if (!fromSaved) unknown.push(header);
      return;
    }
    putOwn(sources, header, fromSaved ? "saved" : "automatic");
    const list = claims.get(field) ?? [];
    list.push({ header, saved: fromSaved });
    claims.set(field, list);
  });

  const duplicates: DuplicateClaim[] = [];
  for (const [field, list] of claims) {
    if (list.length < 2) continue;
    const kept = (list.find((claim) => claim.saved) ?? list[0])!.header;
    for (const claim of list) {
      if (claim.header === kept) continue;
      putOwn<VehicleField | null>(mapping, claim.header, null);
      delete sources[claim.header];
    }
    duplicates.push({ field, headers: list.map((claim) => claim.header), kept });
  }
  duplicates.sort((a, b) => VEHICLE_FIELDS.indexOf(a.field) - VEHICLE_FIELDS.indexOf(b.field));

  const fed = new Set(Object.values(mapping).filter((field): field is VehicleField => field !== null));
  const missingRequired = REQUIRED_VEHICLE_FIELDS.filter((field) => !fed.has(field));
  return { mapping, sources, unknown, duplicates, missingRequired, ready: missingRequired.length === 0 };
}
