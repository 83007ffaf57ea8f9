/**
 * The mass picture of one vehicle, assembled from what the database holds (platform figures,
 * weighbridge masses, fitted and planned items, the organisation's margins) and a loading
 * (occupants, fluids, cargo, trailer). Pure: the server computes the figures of record with it,
 * and the browser runs the same code for instant what-if feedback.
 */
import { z } from "zod";
import { InputError } from "@/lib/errors";
import {
  leverRule,
  positionXMm,
  vehicleMass,
  type MassItem,
  type MassLimit,
  type VehicleMassInput,
  type VehicleMassResult,
  type Zone,
  type ZoneOverrides,
} from "@/lib/mass";
import { constantLoadByAxle, variableLoadByAxle, type SuspensionItem } from "@/lib/suspension";
import { parseTyreSize } from "@/lib/tyres";

/** Where an item sits, in the database's words. */
export const PLAN_ZONES = ["front", "cab", "tub", "roof", "rear_overhang", "towbar"] as const;
export type PlanZone = (typeof PLAN_ZONES)[number];

export const ZONE_LABELS: Record<PlanZone, string> = {
  front: "Front (ahead of the front axle)",
  cab: "Cab",
  tub: "Tub / cargo area",
  roof: "Roof",
  rear_overhang: "Rear overhang",
  towbar: "Towbar",
};

export function toLibZone(zone: PlanZone): Zone {
  return zone === "rear_overhang" ? "rearOverhang" : zone;
}

export type MassKind = "constant" | "variable";

/** A planned (what-if) item. */
export type PlannedItem = {
  id: string;
  label: string;
  massKg: number;
  xMm: number | null;
  zone: PlanZone | null;
  massKind: MassKind;
};

/** An item on the vehicle now; a fitment linked to an edition line takes the line's figures. */
export type FittedItem = {
  id: string;
  label: string;
  lineKey: string | null;
  lineCode: string | null;
  category: string | null;
  quantity: number;
  /** Whole mass of the fitment (line mass × quantity for linked fitments). */
  massKg: number | null;
  xMm: number | null;
  zone: PlanZone | null;
  massKind: MassKind;
  /** ISO date-time. */
  fittedAt: string;
  attributes: Record<string, number | string>;
  /** Evidence kinds the linked line asks for (none for extras and lines that need none). */
  evidenceNeeded: string[];
  evidenceStatus: "accepted" | "lodged" | "rejected" | "none";
};

export type PlatformFigures = {
  make: string;
  model: string;
  variant: string;
  kerbMassKg: number | null;
  kerbFrontKg: number | null;
  gvmKg: number | null;
  gcmKg: number | null;
  frontAxleRatingKg: number | null;
  rearAxleRatingKg: number | null;
  wheelbaseMm: number | null;
  rearOverhangMm: number | null;
  towingCapacityKg: number | null;
  towballLimitKg: number | null;
  roofStaticKg: number | null;
  roofDynamicKg: number | null;
  standardTyreSize: string | null;
  fuelCapacityL: number | null;
  topSpeedKmh: number | null;
};

export type MassSettings = {
  personMassKg: number;
  brakeWarningMarginKg: number;
  springSoftMarginKg: number;
  springStiffMarginKg: number;
  weighbridgeToleranceKg: number;
};

export type MeasuredMasses = { frontKg: number; rearKg: number; grossKg: number | null; measuredAt: string | null };

export type TyresInUse = {
  size: string | null;
  source: "fitted" | "platform" | null;
  loadIndex: number | null;
};

/** Everything the computation needs about one vehicle, serialisable for the browser. */
export type MassContext = {
  vehicle: { id: string; fleetNumber: string; registration: string | null; vin: string | null; depot: string | null };
  platform: PlatformFigures;
  measured: MeasuredMasses | null;
  fitted: FittedItem[];
  planned: PlannedItem[];
  settings: MassSettings;
  tyres: TyresInUse;
  brakeUpgradeFitted: boolean;
};

/** The loading of a what-if: people, fluids beyond the main tank, cargo and a trailer. */
export type Loading = {
  occupants: number;
  fuelL: number;
  waterL: number;
  cargoKg: number;
  trailerAtmKg: number;
  towballKg: number;
};

export const EMPTY_LOADING: Loading = { occupants: 0, fuelL: 0, waterL: 0, cargoKg: 0, trailerAtmKg: 0, towballKg: 0 };

const bounded = (name: string, max: number, unit: string) =>
  z.coerce
    .number({ error: `${name} must be a number` })
    .min(0, { error: `${name} must not be negative` })
    .max(max, { error: `${name} looks wrong: more than ${max} ${unit}` })
    .default(0);

/** Loading as query parameters or form fields (text is coerced; absent means none). */
export const loadingSchema = z
  .object({
    occupants: z.coerce
      .number({ error: "occupants must be a number of people" })
      .int({ error: "occupants must be a whole number of people" })
      .min(0, { error: "occupants must not be negative" })
      .max(20, { error: "occupants must be at most 20" })
      .default(0),
    fuelL: bounded("fuelL", 1000, "L"),
    waterL: bounded("waterL", 1000, "L"),
    cargoKg: bounded("cargoKg", 5000, "kg"),
    trailerAtmKg: bounded("trailerAtmKg", 10_000, "kg"),
    towballKg: bounded("towballKg", 1000, "kg"),
  })
  .refine((l) => l.trailerAtmKg === 0 || l.towballKg <= l.trailerAtmKg, {
    path: ["towballKg"],
    error: "towball download cannot exceed the trailer's ATM",
  })
  .refine((l) => l.trailerAtmKg > 0 || l.towballKg === 0, {
    path: ["trailerAtmKg"],
    error: "give the trailer's ATM with its towball download",
  });

export const LIMIT_LABELS: Record<MassLimit, string> = {
  gvm: "Gross vehicle mass (GVM)",
  front: "Front axle",
  rear: "Rear axle",
  gcm: "Gross combination mass (GCM)",
  towing: "Braked towing capacity",
  towball: "Towball limit",
  frontTyres: "Front tyres",
  rearTyres: "Rear tyres",
  roof: "Roof load (dynamic)",
};

export type Note = { code: string; message: string };

export type AxleSplit = { frontKg: number; rearKg: number; totalKg: number };

/** The computed figures: the library's result plus what the screens and statement show. */
export type MassFigures = VehicleMassResult & {
  includePlanned: boolean;
  bindingLabel: string | null;
  /** Distance of the centre of mass behind the front axle. */
  centreOfMassXMm: number | null;
  /** Constant load over standard by axle from fitted (and planned) accessories: what springs are chosen for. */
  constantByAxle: AxleSplit | null;
  /** Variable load over standard by axle: occupants, fluids, cargo, towball, variable items. */
  variableByAxle: AxleSplit | null;
  /** Items drawn on the side view: every fitted and planned item with its position. */
  marks: Array<{ label: string; massKg: number; xMm: number; status: "fitted" | "planned"; kind: string }>;
};

export type ComputeOptions = {
  includePlanned: boolean;
  /** Items planned for this computation only (e.g. a draft edition's short lines). */
  extraPlanned?: PlannedItem[];
};

/** Common practice: a rear bar's or spare carrier's mass sits about 150 mm in from the rearmost point. */
export const REAR_ITEM_INSET_MM = 150;
/** Common practice: the towball sits about 100 mm behind the rearmost point of the body. */
export const TOWBALL_BEYOND_BODY_MM = 100;

/**
 * Zone positions from the platform's own measurements where it has them: the rear overhang and
 * the towbar follow the body's length behind the rear axle; other zones keep their defaults.
 */
export function zoneOverrides(platform: Pick<PlatformFigures, "rearOverhangMm">): ZoneOverrides | undefined {
  const overhang = platform.rearOverhangMm;
  if (overhang === null || !Number.isFinite(overhang) || overhang <= REAR_ITEM_INSET_MM) return undefined;
  return {
    rearOverhang: { kind: "behindRearAxle", mm: overhang - REAR_ITEM_INSET_MM },
    towbar: { kind: "behindRearAxle", mm: overhang + TOWBALL_BEYOND_BODY_MM },
  };
}

type Placement = { xMm?: number; zone?: Zone };

function placement(item: { xMm: number | null; zone: PlanZone | null }): Placement | null {
  if (item.xMm !== null && Number.isFinite(item.xMm)) return { xMm: item.xMm };
  if (item.zone) return { zone: toLibZone(item.zone) };
  return null;
}

function usableTyreSize(size: string | null): string | undefined {
  if (!size) return undefined;
  try {
    parseTyreSize(size, "tyres.size");
    return size;
  } catch {
    return undefined;
  }
}

/** Positions of items, in mm behind the front axle; null when the wheelbase is unknown. */
function xOf(place: Placement, wb: number | undefined, overrides: ZoneOverrides | undefined): number | null {
  if (place.xMm !== undefined) return place.xMm;
  if (wb === undefined || place.zone === undefined) return null;
  return positionXMm(place, wb, overrides, "item");
}

/**
 * Builds the library input for a vehicle and a loading. Items without a recorded position are
 * put mid-wheelbase (and said so); items fitted after the last weighing are added to the weighed
 * figures, since the ticket cannot contain them.
 */
export function buildMassInput(
  ctx: MassContext,
  loading: Loading,
  options: ComputeOptions,
): { input: VehicleMassInput; notes: Note[]; suspensionItems: SuspensionItem[]; overrides: ZoneOverrides | undefined } {
  const p = ctx.platform;
  const wb = p.wheelbaseMm ?? undefined;
  const overrides = zoneOverrides(p);
  const notes: Note[] = [];
  const items: MassItem[] = [];
  const suspensionItems: SuspensionItem[] = [];

  const unplaced: string[] = [];
  const placeOrAssume = (label: string, item: { xMm: number | null; zone: PlanZone | null }): Placement => {
    const placed = placement(item);
    if (placed) return placed;
    unplaced.push(label);
    return wb === undefined ? { zone: "cab" } : { xMm: wb / 2 };
  };

  const measuredAt = ctx.measured?.measuredAt ? Date.parse(ctx.measured.measuredAt) : null;
  let measured = ctx.measured ? { frontKg: ctx.measured.frontKg, rearKg: ctx.measured.rearKg } : undefined;
  const sinceWeighing: string[] = [];

  ctx.fitted.forEach((f) => {
    if (f.massKg === null || f.massKg <= 0) return;
    const where = placeOrAssume(f.label, f);
    const variable = f.massKind === "variable";
    const rackLimit = typeof f.attributes.rackLoadLimitKg === "number" ? f.attributes.rackLoadLimitKg : undefined;
    items.push({
      label: f.label,
      massKg: f.massKg,
      ...where,
      variable,
      status: "fitted",
      ...(rackLimit !== undefined && (where.zone === "roof" || where.zone === undefined) ? { rackLoadLimitKg: rackLimit } : {}),
    });
    if (wb !== undefined) suspensionItems.push({ label: f.label, massKg: f.massKg, ...where, variable });
    // A fitment newer than the weighing is not in the ticket: add it to the weighed figures.
    if (measured && measuredAt !== null && Date.parse(f.fittedAt) > measuredAt && wb !== undefined) {
      const x = xOf(where, wb, overrides);
      if (x !== null) {
        const share = leverRule({ massKg: f.massKg, xMm: x }, wb, "fitted");
        measured = { frontKg: measured.frontKg + share.frontKg, rearKg: measured.rearKg + share.rearKg };
        sinceWeighing.push(f.label);
      }
    }
  });

  const planned = options.includePlanned ? [...ctx.planned, ...(options.extraPlanned ?? [])] : [];
  planned.forEach((item) => {
    const where = placeOrAssume(item.label, item);
    const variable = item.massKind === "variable";
    items.push({ label: item.label, massKg: item.massKg, ...where, variable, status: "planned" });
    if (wb !== undefined) suspensionItems.push({ label: item.label, massKg: item.massKg, ...where, variable });
  });

  if (unplaced.length > 0) {
    notes.push({
      code: "position-assumed",
      message: `No position is recorded for ${unplaced.join(", ")}: taken as mid-wheelbase. Record where ${unplaced.length === 1 ? "it sits" : "they sit"} for true axle loads.`,
    });
  }
  if (sinceWeighing.length > 0) {
    notes.push({
      code: "fitted-since-weighing",
      message: `${sinceWeighing.join(", ")} ${sinceWeighing.length === 1 ? "was" : "were"} fitted after the last weighing and ${sinceWeighing.length === 1 ? "is" : "are"} added to the weighed figures. Weigh the vehicle again to confirm.`,
    });
  }

  const tyreSize = usableTyreSize(ctx.tyres.size);
  const tyres =
    tyreSize !== undefined || ctx.tyres.loadIndex !== null
      ? {
          ...(tyreSize !== undefined ? { size: tyreSize } : {}),
          ...(ctx.tyres.loadIndex !== null ? { frontLoadIndex: ctx.tyres.loadIndex, rearLoadIndex: ctx.tyres.loadIndex } : {}),
        }
      : undefined;

  const input: VehicleMassInput = {
    platform: {
      wheelbaseMm: p.wheelbaseMm,
      kerbMassKg: p.kerbMassKg,
      kerbFrontKg: p.kerbFrontKg,
      gvmKg: p.gvmKg,
      gcmKg: p.gcmKg,
      frontAxleRatingKg: p.frontAxleRatingKg,
      rearAxleRatingKg: p.rearAxleRatingKg,
      towingCapacityKg: p.towingCapacityKg,
      towballMaxKg: p.towballLimitKg,
      roofDynamicLimitKg: p.roofDynamicKg,
      ...(overrides ? { zonePositions: overrides } : {}),
    },
    ...(measured ? { measured: { ...measured, includesFittedItems: true } } : {}),
    items,
    occupants: loading.occupants > 0 ? [{ count: loading.occupants, zone: "cab" }] : [],
    occupantMassKg: ctx.settings.personMassKg,
    ...(loading.fuelL > 0 ? { fuel: { litres: loading.fuelL } } : {}),
    ...(loading.waterL > 0 ? { water: { litres: loading.waterL } } : {}),
    ...(loading.cargoKg > 0 ? { cargo: { massKg: loading.cargoKg } } : {}),
    ...(loading.trailerAtmKg > 0 ? { trailer: { atmKg: loading.trailerAtmKg, towballKg: loading.towballKg } } : {}),
    ...(tyres ? { tyres } : {}),
    brakeUpgradeFitted: ctx.brakeUpgradeFitted,
    aboveStandardWarnKg: ctx.settings.brakeWarningMarginKg,
  };
  return { input, notes, suspensionItems, overrides };
}

/** The full figures for a vehicle and loading: axle loads, checks, binding limit, springs' loads. */
export function computeMass(ctx: MassContext, loading: Loading, options: ComputeOptions): MassFigures {
  const { input, notes, suspensionItems, overrides } = buildMassInput(ctx, loading, options);
  const result = vehicleMass(input);
  const wb = ctx.platform.wheelbaseMm ?? undefined;

  let constantByAxle: AxleSplit | null = null;
  let variableByAxle: AxleSplit | null = null;
  if (wb !== undefined) {
    constantByAxle = constantLoadByAxle(suspensionItems, wb, overrides);
    const variableItems = variableLoadByAxle(suspensionItems, wb, overrides);
    const loadLines = result.lines.filter((l) => l.kind !== "item" && l.counted);
    variableByAxle = {
      frontKg: variableItems.frontKg + loadLines.reduce((s, l) => s + (l.frontKg ?? 0), 0),
      rearKg: variableItems.rearKg + loadLines.reduce((s, l) => s + (l.rearKg ?? 0), 0),
      totalKg: variableItems.totalKg + loadLines.reduce((s, l) => s + l.massKg, 0),
    };
  }

  const centreOfMassXMm =
    wb !== undefined && result.rearKg !== undefined && result.grossKg !== undefined && result.grossKg > 0
      ? (result.rearKg * wb) / result.grossKg
      : null;

  const marks = result.lines
    .filter((l) => l.xMm !== undefined)
    .map((l) => ({ label: l.label, massKg: l.massKg, xMm: l.xMm as number, status: l.status, kind: l.kind }));

  return {
    ...result,
    warnings: [...result.warnings, ...notes],
    includePlanned: options.includePlanned,
    bindingLabel: result.binding ? LIMIT_LABELS[result.binding.limit] : null,
    centreOfMassXMm,
    constantByAxle,
    variableByAxle,
    marks,
  };
}

/** Like computeMass, but an input the library refuses comes back as the message instead. */
export function tryComputeMass(
  ctx: MassContext,
  loading: Loading,
  options: ComputeOptions,
): { figures: MassFigures; error: null } | { figures: null; error: { field: string; message: string } } {
  try {
    return { figures: computeMass(ctx, loading, options), error: null };
  } catch (error) {
    if (error instanceof InputError) return { figures: null, error: { field: error.field, message: error.message } };
    throw error;
  }
}
