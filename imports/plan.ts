import { InputError } from "@/lib/errors";
import { isoDate } from "./coerce";
import { PLATFORM_RATING_FIELDS, VEHICLE_FIELD_INFO, type PlatformRatingField, type VehicleState } from "./fields";
import type { ValidRow, VehicleRowValues } from "./vehicle-row";

/**
 * What an import would do to the register, decided before anything is written: each row
 * creates a vehicle, updates one (listing every change), or leaves it as it is.
 */

/** The vehicle fields an import can set (the platform ratings belong to the platform, not here). */
export const UPSERT_FIELDS = [
  "fleetNumber",
  "vin",
  "registration",
  "registrationExpiry",
  "make",
  "model",
  "variant",
  "buildYear",
  "depot",
  "costCentre",
  "state",
  "odometerKm",
  "notes",
] as const;
export type UpsertField = (typeof UPSERT_FIELDS)[number];

/** A vehicle already in the register, as the database holds it. */
export interface ExistingVehicle {
  id: string | number;
  fleetNumber: string;
  vin: string | null;
  registration?: string | null;
  /** A Date is read by its UTC calendar day. */
  registrationExpiry?: string | Date | null;
  make?: string | null;
  model?: string | null;
  variant?: string | null;
  buildYear?: number | null;
  depot?: string | null;
  costCentre?: string | null;
  state?: VehicleState | null;
  odometerKm?: number | null;
  notes?: string | null;
}

export interface KnownPlatform {
  make: string;
  model: string;
  variant?: string | null;
}

export interface PlanOptions {
  /** Platforms already defined; the make/model/variant of existing vehicles count as known too. */
  platforms?: readonly KnownPlatform[];
}

export type FieldValue = string | number | null;

export interface FieldChange {
  field: UpsertField;
  before: FieldValue;
  after: FieldValue;
}

export type MatchedBy = "vin" | "fleetNumber";

export type PlannedRow =
  | { action: "create"; rowNumber: number; values: VehicleRowValues }
  | {
      action: "update";
      rowNumber: number;
      vehicleId: string | number;
      matchedBy: MatchedBy;
      changes: FieldChange[];
      /** Changes worth a second look, in plain words (a VIN replaced). */
      warnings: string[];
    }
  | { action: "unchanged"; rowNumber: number; vehicleId: string | number; matchedBy: MatchedBy }
  | { action: "error"; rowNumber: number; field: "vin" | "fleetNumber"; message: string };

export interface NewPlatform {
  make: string;
  model: string;
  variant: string | null;
  /** Rows that would bring this platform in, in file order. */
  rowNumbers: number[];
  /** Ratings as given, each from the first row that gives it. */
  ratings: Record<PlatformRatingField, number | null>;
  /** The ratings no row gives: the platform can be created but its mass checks wait for them. */
  missingRatings: PlatformRatingField[];
  /** Shown as "ratings missing" when any rating is absent. */
  ratingsMissing: boolean;
}

export interface UpsertPlan {
  rows: PlannedRow[];
  newPlatforms: NewPlatform[];
  counts: { create: number; update: number; unchanged: number; error: number };
}

function vinKey(vin: string | null | undefined): string | null {
  if (vin === null || vin === undefined) return null;
  const key = vin.replace(/\s+/g, "").toUpperCase();
  return key === "" ? null : key;
}

/** Fleet numbers compare without regard to case or spacing: "rh-014 " is RH-014. */
function fleetKey(fleetNumber: string | null | undefined): string | null {
  if (fleetNumber === null || fleetNumber === undefined) return null;
  const key = fleetNumber.replace(/\s+/g, " ").trim().toUpperCase();
  return key === "" ? null : key;
}

function platformKey(make: string, model: string, variant: string | null | undefined): string {
  const part = (text: string | null | undefined) => (text ?? "").replace(/\s+/g, " ").trim().toUpperCase();
  return `${part(make)}\u0000${part(model)}\u0000${part(variant)}`;
}

function stored(vehicle: ExistingVehicle, field: UpsertField): FieldValue {
  const value = vehicle[field];
  if (value === undefined || value === null) return null;
  if (value instanceof Date) return Number.isNaN(value.getTime()) ? null : isoDate(value);
  if (field === "vin" && typeof value === "string") return vinKey(value);
  return value;
}

function sameValue(field: UpsertField, before: FieldValue, after: FieldValue): boolean {
  if (field === "fleetNumber" && typeof before === "string" && typeof after === "string") return before.trim() === after.trim();
  return before === after;
}

function index<K>(vehicles: readonly ExistingVehicle[], keyOf: (vehicle: ExistingVehicle) => K | null): Map<K, ExistingVehicle[]> {
  const map = new Map<K, ExistingVehicle[]>();
  for (const vehicle of vehicles) {
    const key = keyOf(vehicle);
    if (key === null) continue;
    map.set(key, [...(map.get(key) ?? []), vehicle]);
  }
  return map;
}

/**
 * Plans an upsert of validated rows into the register. A row is matched to an existing vehicle
 * by VIN first, then by fleet number; a row whose VIN finds one vehicle and whose fleet number
 * finds another is an error, as is a second row reaching a vehicle already claimed. An empty
 * cell never clears a stored value, so importing the same file twice plans only "unchanged".
 */
export function planUpsert(
  validRows: readonly ValidRow[],
  existing: readonly ExistingVehicle[],
  options: PlanOptions = {},
): UpsertPlan {
  const seenIds = new Set<string | number>();
  for (const [at, vehicle] of existing.entries()) {
    if (seenIds.has(vehicle.id)) throw new InputError(`existing.${at}.id`, `Vehicle id ${vehicle.id} appears twice`);
    seenIds.add(vehicle.id);
  }
  const byVin = index(existing, (vehicle) => vinKey(vehicle.vin));
  const byFleet = index(existing, (vehicle) => fleetKey(vehicle.fleetNumber));
  const claimedBy = new Map<string | number, number>();
  const rows: PlannedRow[] = [];
  // The make/model/variant each accepted row leaves its vehicle with (an empty cell keeps the stored value).
  const platformOf = new Map<number, PlatformKeyParts>();

  for (const { rowNumber, values } of validRows) {
    const vin = vinKey(values.vin);
    const fleet = fleetKey(values.fleetNumber);
    const vinMatches = vin === null ? [] : (byVin.get(vin) ?? []);
    const fleetMatches = fleet === null ? [] : (byFleet.get(fleet) ?? []);
    const error = (field: "vin" | "fleetNumber", message: string) => rows.push({ action: "error", rowNumber, field, message });

    if (vinMatches.length > 1) {
      error("vin", `VIN ${vin} belongs to ${vinMatches.length} vehicles in the register; sort that out first`);
      continue;
    }
    if (fleetMatches.length > 1 && vinMatches.length === 0) {
      error("fleetNumber", `Fleet number ${values.fleetNumber} belongs to ${fleetMatches.length} vehicles in the register; sort that out first`);
      continue;
    }
    const viaVin = vinMatches[0];
    const viaFleet = fleetMatches.find((vehicle) => vehicle !== viaVin) ?? fleetMatches[0];
    if (viaVin !== undefined && viaFleet !== undefined && viaFleet.id !== viaVin.id) {
      error(
        "fleetNumber",
        `VIN ${vin} is vehicle ${viaVin.fleetNumber}, but fleet number ${values.fleetNumber} is another vehicle; correct one of them`,
      );
      continue;
    }
    const target = viaVin ?? viaFleet;
    if (target === undefined) {
      rows.push({ action: "create", rowNumber, values });
      platformOf.set(rowNumber, { make: values.make, model: values.model, variant: values.variant });
      continue;
    }
    const matchedBy: MatchedBy = viaVin !== undefined ? "vin" : "fleetNumber";
    const earlier = claimedBy.get(target.id);
    if (earlier !== undefined) {
      error(matchedBy, `Row ${earlier} already updates vehicle ${target.fleetNumber}; one row per vehicle`);
      continue;
    }
    claimedBy.set(target.id, rowNumber);
    platformOf.set(rowNumber, {
      make: values.make ?? target.make ?? null,
      model: values.model ?? target.model ?? null,
      variant: values.variant ?? target.variant ?? null,
    });

    const changes: FieldChange[] = [];
    for (const field of UPSERT_FIELDS) {
      const after = values[field];
      if (after === null) continue;
      const before = stored(target, field);
      if (!sameValue(field, before, after)) changes.push({ field, before, after });
    }
    if (changes.length === 0) {
      rows.push({ action: "unchanged", rowNumber, vehicleId: target.id, matchedBy });
      continue;
    }
    const warnings: string[] = [];
    const vinChange = changes.find((change) => change.field === "vin");
    if (vinChange !== undefined && vinChange.before !== null) {
      warnings.push(`VIN changes from ${vinChange.before} to ${vinChange.after}; check this is the same vehicle`);
    }
    const fleetChange = changes.find((change) => change.field === "fleetNumber");
    if (fleetChange !== undefined) {
      warnings.push(`${VEHICLE_FIELD_INFO.fleetNumber.label} changes from ${fleetChange.before} to ${fleetChange.after}`);
    }
    rows.push({ action: "update", rowNumber, vehicleId: target.id, matchedBy, changes, warnings });
  }

  const newPlatforms = plannedPlatforms(validRows, platformOf, existing, options.platforms ?? []);
  const counts = { create: 0, update: 0, unchanged: 0, error: 0 };
  for (const row of rows) counts[row.action]++;
  return { rows, newPlatforms, counts };
}

interface PlatformKeyParts {
  make: string | null;
  model: string | null;
  variant: string | null;
}

/**
 * Make/model/variant combinations that accepted rows would leave on a vehicle and nobody has
 * defined yet. A row that names no make or model brings no platform.
 */
function plannedPlatforms(
  validRows: readonly ValidRow[],
  platformOf: ReadonlyMap<number, PlatformKeyParts>,
  existing: readonly ExistingVehicle[],
  platforms: readonly KnownPlatform[],
): NewPlatform[] {
  const known = new Set<string>();
  for (const platform of platforms) known.add(platformKey(platform.make, platform.model, platform.variant));
  for (const vehicle of existing) {
    if (vehicle.make && vehicle.model) known.add(platformKey(vehicle.make, vehicle.model, vehicle.variant));
  }
  const found = new Map<string, NewPlatform>();
  for (const { rowNumber, values } of validRows) {
    const parts = platformOf.get(rowNumber);
    if (parts === undefined || parts.make === null || parts.model === null) continue;
    const key = platformKey(parts.make, parts.model, parts.variant);
    if (known.has(key)) continue;
    let platform = found.get(key);
    if (platform === undefined) {
      platform = {
        make: parts.make,
        model: parts.model,
        variant: parts.variant,
        rowNumbers: [],
        ratings: { kerbMassKg: null, gvmKg: null, frontAxleRatingKg: null, rearAxleRatingKg: null },
        missingRatings: [],
        ratingsMissing: false,
      };
      found.set(key, platform);
    }
    platform.rowNumbers.push(rowNumber);
    for (const field of PLATFORM_RATING_FIELDS) platform.ratings[field] ??= values[field];
  }
  return [...found.values()].map((platform) => {
    const missingRatings = PLATFORM_RATING_FIELDS.filter((field) => platform.ratings[field] === null);
    return { ...platform, missingRatings, ratingsMissing: missingRatings.length > 0 };
  });
}
