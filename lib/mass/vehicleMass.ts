import { InputError, requireFinite, requireNonNegative, requirePositive } from "../errors";
import { isKnownLoadIndex, LOAD_INDEX_KG, parseTyreSize } from "../tyres";
import { leverRule } from "./lever";
import { isZone, positionXMm, type Zone, type ZoneOverrides } from "./zones";

/** Common practice: planning mass of one occupant. */
export const DEFAULT_OCCUPANT_MASS_KG = 80;
/** Diesel density used in published towing worked cases (70 L × 0.832 kg/L = 58 kg). */
export const DIESEL_DENSITY_KG_PER_L = 0.832;
export const WATER_DENSITY_KG_PER_L = 1;
/** Common practice: a loaded touring fit-out is commonly 500–600 kg above standard. */
export const DEFAULT_ABOVE_STANDARD_WARN_KG = 500;

type Maybe<T> = T | null | undefined;

/** The maker's figures; any may be missing (the result then lists what it could not check). */
export interface PlatformMassFigures {
  wheelbaseMm?: Maybe<number>;
  kerbMassKg?: Maybe<number>;
  kerbFrontKg?: Maybe<number>;
  kerbRearKg?: Maybe<number>;
  gvmKg?: Maybe<number>;
  gcmKg?: Maybe<number>;
  frontAxleRatingKg?: Maybe<number>;
  rearAxleRatingKg?: Maybe<number>;
  /** Braked towing capacity. */
  towingCapacityKg?: Maybe<number>;
  towballMaxKg?: Maybe<number>;
  /** Roof load limit while moving (includes the rack). */
  roofDynamicLimitKg?: Maybe<number>;
  zonePositions?: ZoneOverrides;
}

export interface MassItem {
  label?: string;
  massKg: number;
  xMm?: number;
  zone?: Zone;
  /** Variable mass (touring gear, contents); default constant (fitted accessories). */
  variable?: boolean;
  /** On the vehicle now, or a planned change (what-if). Default "fitted". */
  status?: "fitted" | "planned";
  /** Marks a roof rack: the load it may carry, not counting its own mass. */
  rackLoadLimitKg?: number;
}

export interface Placed {
  xMm?: number;
  zone?: Zone;
}

export interface VehicleMassInput {
  platform: PlatformMassFigures;
  /**
   * Weighbridge axle masses of the vehicle as weighed (no occupants or cargo). They replace the
   * kerb figures; fitted items are taken to be in them unless `includesFittedItems` is false.
   */
  measured?: { frontKg: number; rearKg: number; includesFittedItems?: boolean };
  items?: MassItem[];
  /** Seat rows: count people at a position (default the cab zone). */
  occupants?: Array<{ count: number } & Placed>;
  /** Planning mass per person (default 80 kg, common practice). */
  occupantMassKg?: number;
  /** Fuel beyond what the base mass includes (kerb has a full main tank; tare only 10 L). */
  fuel?: { litres: number; densityKgPerL?: number } & Placed;
  water?: { litres: number } & Placed;
  /** Allowance for touring gear and cargo (default the tub zone). */
  cargo?: { massKg: number } & Placed;
  trailer?: { atmKg: number; towballKg: number };
  /** Towball distance behind the front axle (default the towbar zone). */
  towballXMm?: number;
  tyres?: { size?: string; frontLoadIndex?: number; rearLoadIndex?: number; frontCount?: number; rearCount?: number };
  brakeUpgradeFitted?: boolean;
  /** Warn when the loaded mass is this far above standard without a brake upgrade (default 500). */
  aboveStandardWarnKg?: number;
}

export type MassLimit = "gvm" | "front" | "rear" | "gcm" | "towing" | "towball" | "frontTyres" | "rearTyres" | "roof";

export interface MassCheck {
  limit: MassLimit;
  loadKg: number;
  capacityKg: number;
  headroomKg: number;
  ok: boolean;
}

export interface MassLine {
  label: string;
  kind: "item" | "occupants" | "fuel" | "water" | "cargo" | "towball";
  massKg: number;
  xMm?: number;
  frontKg?: number;
  rearKg?: number;
  variable: boolean;
  status: "fitted" | "planned";
  onRoof: boolean;
  /** False when the mass is already inside the weighbridge figures. */
  counted: boolean;
}

export interface MassSplit {
  totalKg: number;
  frontKg?: number;
  rearKg?: number;
}

export interface VehicleMassResult {
  base?: { source: "measured" | "platform"; totalKg: number; frontKg?: number; rearKg?: number };
  frontKg?: number;
  rearKg?: number;
  grossKg?: number;
  /** Vehicle plus trailer on its own axles (vehicle + ATM − towball). */
  combinationKg?: number;
  payload?: { capacityKg: number; usedKg: number; leftKg: number };
  /** Loaded mass above the maker's kerb mass. */
  aboveStandardKg?: number;
  roofLoadKg: number;
  /** Added mass (counted lines) split into constant and variable. */
  constant: MassSplit;
  variable: MassSplit;
  lines: MassLine[];
  checks: MassCheck[];
  binding?: { limit: MassLimit; marginKg: number };
  warnings: Array<{ code: string; message: string }>;
  missing: Array<{ field: string; message: string }>;
  complete: boolean;
}

function opt(field: string, v: Maybe<number>, check: (f: string, x: number) => number): number | undefined {
  return v === undefined || v === null ? undefined : check(field, v);
}

const k = (x: number) => Math.round(x).toString();

function check(limit: MassLimit, loadKg: number, capacityKg: number): MassCheck {
  const headroomKg = capacityKg - loadKg;
  return { limit, loadKg, capacityKg, headroomKg, ok: headroomKg >= -1e-9 };
}

function tyreCapacity(
  input: VehicleMassInput["tyres"],
  axle: "front" | "rear",
  missing: VehicleMassResult["missing"],
): number | undefined {
  if (!input) return undefined;
  const countField = axle === "front" ? "tyres.frontCount" : "tyres.rearCount";
  const count = (axle === "front" ? input.frontCount : input.rearCount) ?? 2;
  if (!Number.isInteger(count) || count < 1 || count > 8) throw new InputError(countField, `${countField} must be a whole number from 1 to 8`);
  const explicit = axle === "front" ? input.frontLoadIndex : input.rearLoadIndex;
  let index = explicit;
  if (index === undefined && input.size !== undefined) {
    const size = parseTyreSize(input.size, "tyres.size");
    index = count > 2 ? (size.loadIndexDual ?? size.loadIndexSingle) : size.loadIndexSingle;
  }
  const liField = axle === "front" ? "tyres.frontLoadIndex" : "tyres.rearLoadIndex";
  if (index === undefined) {
    missing.push({ field: liField, message: `the ${axle} tyres' load index is needed to check their capacity` });
    return undefined;
  }
  if (!isKnownLoadIndex(index)) {
    missing.push({ field: liField, message: `load index ${index} is outside the table (95–130): give the tyres' load in kg another way` });
    return undefined;
  }
  return (LOAD_INDEX_KG[index] ?? 0) * count;
}

/**
 * The full mass picture of one vehicle: base (kerb or weighbridge) plus fitted and planned items,
 * occupants, fluids, cargo and towball download; axle loads by the lever rule; every limit checked
 * with its headroom and the binding one named. Missing maker's figures never throw: the checks
 * that need them are left out and listed in `missing`.
 */
export function vehicleMass(input: VehicleMassInput): VehicleMassResult {
  const p = input.platform ?? {};
  const missing: VehicleMassResult["missing"] = [];
  const warnings: VehicleMassResult["warnings"] = [];

  const wb = opt("platform.wheelbaseMm", p.wheelbaseMm, requirePositive);
  const kerbTotal = opt("platform.kerbMassKg", p.kerbMassKg, requirePositive);
  let kerbFront = opt("platform.kerbFrontKg", p.kerbFrontKg, requirePositive);
  let kerbRear = opt("platform.kerbRearKg", p.kerbRearKg, requirePositive);
  if (kerbFront !== undefined && kerbRear === undefined && kerbTotal !== undefined) kerbRear = kerbTotal - kerbFront;
  if (kerbRear !== undefined && kerbFront === undefined && kerbTotal !== undefined) kerbFront = kerbTotal - kerbRear;
  if (kerbFront !== undefined && kerbRear !== undefined && kerbRear <= 0) {
    throw new InputError("platform.kerbFrontKg", "the front kerb mass must be less than the kerb mass");
  }
  const standardKg = kerbFront !== undefined && kerbRear !== undefined ? kerbFront + kerbRear : kerbTotal;
  const gvm = opt("platform.gvmKg", p.gvmKg, requirePositive);
  const gcm = opt("platform.gcmKg", p.gcmKg, requirePositive);
  const frontRating = opt("platform.frontAxleRatingKg", p.frontAxleRatingKg, requirePositive);
  const rearRating = opt("platform.rearAxleRatingKg", p.rearAxleRatingKg, requirePositive);
  const towingCap = opt("platform.towingCapacityKg", p.towingCapacityKg, requireNonNegative);
  const towballMax = opt("platform.towballMaxKg", p.towballMaxKg, requireNonNegative);
  const roofLimit = opt("platform.roofDynamicLimitKg", p.roofDynamicLimitKg, requireNonNegative);
  const overrides = p.zonePositions;

  // Base: weighbridge when present, else the maker's kerb figures.
  let base: VehicleMassResult["base"];
  const measuredIncludesFitted = input.measured?.includesFittedItems ?? true;
  if (input.measured) {
    const f = requireNonNegative("measured.frontKg", input.measured.frontKg);
    const r = requireNonNegative("measured.rearKg", input.measured.rearKg);
    base = { source: "measured", totalKg: f + r, frontKg: f, rearKg: r };
  } else if (kerbFront !== undefined && kerbRear !== undefined) {
    base = { source: "platform", totalKg: kerbFront + kerbRear, frontKg: kerbFront, rearKg: kerbRear };
  } else if (kerbTotal !== undefined) {
    base = { source: "platform", totalKg: kerbTotal };
    missing.push({ field: "platform.kerbFrontKg", message: "front and rear kerb masses (or a weighbridge ticket) are needed for axle loads" });
  } else {
    missing.push({ field: "platform.kerbMassKg", message: "the kerb mass (or a weighbridge ticket) is needed for the vehicle's mass" });
  }
  if (wb === undefined) missing.push({ field: "platform.wheelbaseMm", message: "the wheelbase is needed for axle loads" });

  // Lines: everything added to the base.
  const lines: MassLine[] = [];
  const place = (kind: MassLine["kind"], label: string, massKg: number, where: Placed, field: string, fallback: Zone | undefined, opts: { variable: boolean; status?: "fitted" | "planned"; counted?: boolean; midWheelbase?: boolean }) => {
    if (where.zone !== undefined && !isZone(where.zone)) throw new InputError(`${field}.zone`, `unknown zone "${String(where.zone)}"`);
    let xMm: number | undefined;
    if (where.xMm !== undefined) xMm = requireFinite(`${field}.xMm`, where.xMm);
    else if (wb !== undefined) {
      xMm = opts.midWheelbase && where.zone === undefined ? wb / 2 : positionXMm(where, wb, overrides, field, fallback);
    } else if (where.zone === undefined && fallback === undefined && !opts.midWheelbase) {
      throw new InputError(`${field}.xMm`, `${field} needs a position: xMm behind the front axle or a zone`);
    }
    const share = wb !== undefined && xMm !== undefined ? leverRule({ massKg, xMm }, wb, field) : undefined;
    lines.push({
      label,
      kind,
      massKg,
      ...(xMm === undefined ? {} : { xMm }),
      ...(share ?? {}),
      variable: opts.variable,
      status: opts.status ?? "fitted",
      onRoof: (where.zone ?? fallback) === "roof",
      counted: opts.counted ?? true,
    });
  };

  const racks: Array<{ massKg: number; loadLimitKg: number }> = [];
  (input.items ?? []).forEach((item, i) => {
    const field = `items.${i}`;
    const m = requireNonNegative(`${field}.massKg`, item.massKg);
    const status = item.status ?? "fitted";
    if (status !== "fitted" && status !== "planned") throw new InputError(`${field}.status`, `${field}.status must be "fitted" or "planned"`);
    const isRack = item.rackLoadLimitKg !== undefined;
    if (isRack) {
      racks.push({ massKg: m, loadLimitKg: requireNonNegative(`${field}.rackLoadLimitKg`, item.rackLoadLimitKg ?? 0) });
      if (item.zone !== undefined && item.zone !== "roof") throw new InputError(`${field}.zone`, "a roof rack sits in the roof zone");
    }
    const counted = !(input.measured && measuredIncludesFitted && status === "fitted");
    place("item", item.label ?? `Item ${i + 1}`, m, item, field, isRack ? "roof" : undefined, { variable: item.variable ?? false, status, counted });
  });

  const personKg = input.occupantMassKg === undefined ? DEFAULT_OCCUPANT_MASS_KG : requirePositive("occupantMassKg", input.occupantMassKg);
  (input.occupants ?? []).forEach((row, i) => {
    const field = `occupants.${i}`;
    const n = requireNonNegative(`${field}.count`, row.count);
    if (!Number.isInteger(n) || n > 20) throw new InputError(`${field}.count`, `${field}.count must be a whole number of people (at most 20)`);
    place("occupants", `${n} occupant${n === 1 ? "" : "s"}`, n * personKg, row, field, "cab", { variable: true });
  });

  if (input.fuel) {
    const litres = requireNonNegative("fuel.litres", input.fuel.litres);
    const density = input.fuel.densityKgPerL === undefined ? DIESEL_DENSITY_KG_PER_L : requirePositive("fuel.densityKgPerL", input.fuel.densityKgPerL);
    if (density > 1.5) throw new InputError("fuel.densityKgPerL", "fuel.densityKgPerL looks wrong: more than 1.5 kg/L");
    // Tanks sit between the axles: mid-wheelbase unless placed.
    place("fuel", `Fuel ${k(litres)} L`, litres * density, input.fuel, "fuel", undefined, { variable: true, midWheelbase: true });
  }
  if (input.water) {
    const litres = requireNonNegative("water.litres", input.water.litres);
    place("water", `Water ${k(litres)} L`, litres * WATER_DENSITY_KG_PER_L, input.water, "water", "tub", { variable: true });
  }
  if (input.cargo) {
    const m = requireNonNegative("cargo.massKg", input.cargo.massKg);
    place("cargo", "Cargo allowance", m, input.cargo, "cargo", "tub", { variable: true });
  }
  let trailerOnGroundKg = 0;
  if (input.trailer) {
    const atm = requireNonNegative("trailer.atmKg", input.trailer.atmKg);
    const ball = requireNonNegative("trailer.towballKg", input.trailer.towballKg);
    if (ball > atm) throw new InputError("trailer.towballKg", "towball download cannot exceed the trailer's ATM");
    trailerOnGroundKg = atm - ball;
    place("towball", "Towball download", ball, { xMm: input.towballXMm, zone: "towbar" }, "towball", "towbar", { variable: true });
  }

  // Totals.
  const counted = lines.filter((l) => l.counted);
  const addedKg = counted.reduce((s, l) => s + l.massKg, 0);
  const haveAxles = base?.frontKg !== undefined && base.rearKg !== undefined && wb !== undefined;
  const split = (variable: boolean): MassSplit => {
    const ls = counted.filter((l) => l.variable === variable);
    const totalKg = ls.reduce((s, l) => s + l.massKg, 0);
    if (wb === undefined) return { totalKg };
    return { totalKg, frontKg: ls.reduce((s, l) => s + (l.frontKg ?? 0), 0), rearKg: ls.reduce((s, l) => s + (l.rearKg ?? 0), 0) };
  };
  const constant = split(false);
  const variable = split(true);

  const result: VehicleMassResult = {
    ...(base ? { base } : {}),
    roofLoadKg: lines.filter((l) => l.onRoof).reduce((s, l) => s + l.massKg, 0),
    constant,
    variable,
    lines,
    checks: [],
    warnings,
    missing,
    complete: false,
  };
  const checks = result.checks;

  if (gvm === undefined) missing.push({ field: "platform.gvmKg", message: "the GVM is needed to check the vehicle's mass" });
  if (frontRating === undefined) missing.push({ field: "platform.frontAxleRatingKg", message: "the front axle rating is needed to check the front axle" });
  if (rearRating === undefined) missing.push({ field: "platform.rearAxleRatingKg", message: "the rear axle rating is needed to check the rear axle" });
  if (input.trailer && gcm === undefined) missing.push({ field: "platform.gcmKg", message: "the GCM is needed to check the combination with the trailer" });
  const frontTyreCap = input.tyres ? tyreCapacity(input.tyres, "front", missing) : undefined;
  const rearTyreCap = input.tyres ? tyreCapacity(input.tyres, "rear", missing) : undefined;
  if (!input.tyres) missing.push({ field: "tyres", message: "the tyres' load index is needed to check tyre capacity" });

  if (base) {
    const gross = base.totalKg + addedKg;
    result.grossKg = gross;
    if (haveAxles) {
      result.frontKg = (base.frontKg ?? 0) + (constant.frontKg ?? 0) + (variable.frontKg ?? 0);
      result.rearKg = (base.rearKg ?? 0) + (constant.rearKg ?? 0) + (variable.rearKg ?? 0);
    }
    if (gvm !== undefined) {
      checks.push(check("gvm", gross, gvm));
      if (standardKg !== undefined) {
        result.payload = { capacityKg: gvm - standardKg, usedKg: gross - standardKg, leftKg: gvm - gross };
      }
    }
    if (input.trailer) {
      // A combination may never exceed GCM: vehicle (towball included) + what the trailer's axles carry.
      result.combinationKg = gross + trailerOnGroundKg;
      if (gcm !== undefined) checks.push(check("gcm", result.combinationKg, gcm));
    }
  }

  if (result.frontKg !== undefined && result.rearKg !== undefined) {
    if (frontRating !== undefined) checks.push(check("front", result.frontKg, frontRating));
    if (rearRating !== undefined) checks.push(check("rear", result.rearKg, rearRating));
    if (frontTyreCap !== undefined) checks.push(check("frontTyres", result.frontKg, frontTyreCap));
    if (rearTyreCap !== undefined) checks.push(check("rearTyres", result.rearKg, rearTyreCap));

    if (base?.frontKg !== undefined && result.frontKg < base.frontKg - 0.5) {
      warnings.push({
        code: "front-unloaded",
        message: `The load takes ${k(base.frontKg - result.frontKg)} kg off the front axle (mass far behind the rear axle), which costs steering and braking grip.`,
      });
    }
    if (result.frontKg <= 0) {
      warnings.push({ code: "front-lifted", message: "The front axle carries no load: the figures or positions must be wrong." });
    }
  }

  if (input.trailer) {
    const t = input.trailer;
    if (towingCap !== undefined) checks.push(check("towing", t.atmKg, towingCap));
    else missing.push({ field: "platform.towingCapacityKg", message: "the braked towing capacity is needed to check the trailer" });
    if (towballMax !== undefined) checks.push(check("towball", t.towballKg, towballMax));
    else missing.push({ field: "platform.towballMaxKg", message: "the towball limit is needed to check the download" });
  }

  // Roof: the rack counts against the roof limit; the lower of the vehicle's and the rack's limits applies.
  if (result.roofLoadKg > 0 || racks.length > 0) {
    let capacity = roofLimit;
    for (const rack of racks) {
      // A rack's rating is the load it carries; with its own mass it gives a limit on the whole roof.
      const rackCap = rack.loadLimitKg + rack.massKg;
      capacity = capacity === undefined ? rackCap : Math.min(capacity, rackCap);
    }
    if (roofLimit === undefined) {
      missing.push({ field: "platform.roofDynamicLimitKg", message: "the vehicle's dynamic roof load limit is needed to check the roof load" });
    }
    if (capacity !== undefined) checks.push(check("roof", result.roofLoadKg, capacity));
  }

  // Warnings.
  if (result.grossKg !== undefined && standardKg !== undefined) {
    result.aboveStandardKg = result.grossKg - standardKg;
    const margin = input.aboveStandardWarnKg === undefined ? DEFAULT_ABOVE_STANDARD_WARN_KG : requireNonNegative("aboveStandardWarnKg", input.aboveStandardWarnKg);
    if (result.aboveStandardKg > margin && !input.brakeUpgradeFitted) {
      warnings.push({
        code: "brakes",
        message: `Loaded mass is ${k(result.aboveStandardKg)} kg above standard with no brake upgrade fitted: heavier vehicles on taller tyres need better brakes.`,
      });
    }
  } else if (result.grossKg !== undefined && kerbTotal === undefined && standardKg === undefined) {
    missing.push({ field: "platform.kerbMassKg", message: "the maker's kerb mass is needed to compare the loaded mass with standard" });
  }

  let binding: VehicleMassResult["binding"];
  for (const c of checks) if (!binding || c.headroomKg < binding.marginKg) binding = { limit: c.limit, marginKg: c.headroomKg };
  if (binding) result.binding = binding;
  result.complete = missing.length === 0;
  return result;
}
