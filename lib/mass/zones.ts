import { InputError, requireFinite, requirePositive } from "../errors";

/** Where an item sits when its distance behind the front axle is not measured. */
export const ZONES = ["front", "cab", "tub", "roof", "rearOverhang", "towbar"] as const;
export type Zone = (typeof ZONES)[number];

/** A zone's position: a share of the wheelbase, or an offset from one of the axles. */
export type ZonePosition =
  | { kind: "fraction"; fraction: number }
  | { kind: "behindFrontAxle"; mm: number }
  | { kind: "behindRearAxle"; mm: number };

/**
 * Default zone positions (common practice: typical of a dual-cab or wagon four-wheel drive;
 * a platform overrides them with its own measurements):
 * - front: bars and winches sit about 600 mm ahead of the front axle;
 * - cab: seats and cab fittings about 35 % of the wheelbase back;
 * - tub: the tub or cargo area centred over the rear axle;
 * - roof: mid-wheelbase;
 * - rearOverhang: rear bars, spare wheel carriers about 800 mm behind the rear axle;
 * - towbar: the towball about 1100 mm behind the rear axle.
 */
export const DEFAULT_ZONE_POSITIONS: Readonly<Record<Zone, ZonePosition>> = Object.freeze({
  front: { kind: "behindFrontAxle", mm: -600 },
  cab: { kind: "fraction", fraction: 0.35 },
  tub: { kind: "fraction", fraction: 1 },
  roof: { kind: "fraction", fraction: 0.5 },
  rearOverhang: { kind: "behindRearAxle", mm: 800 },
  towbar: { kind: "behindRearAxle", mm: 1100 },
});

export type ZoneOverrides = Partial<Record<Zone, ZonePosition>>;

export function isZone(value: unknown): value is Zone {
  return typeof value === "string" && (ZONES as readonly string[]).includes(value);
}

/** Distance behind the front axle of a zone on this wheelbase, using platform overrides first. */
export function zoneXMm(zone: Zone, wheelbaseMm: number, overrides?: ZoneOverrides, field = "zone"): number {
  if (!isZone(zone)) throw new InputError(field, `unknown zone "${String(zone)}"; expected one of ${ZONES.join(", ")}`);
  const wb = requirePositive("wheelbaseMm", wheelbaseMm);
  const pos = overrides?.[zone] ?? DEFAULT_ZONE_POSITIONS[zone];
  switch (pos.kind) {
    case "fraction":
      return requireFinite(`zonePositions.${zone}.fraction`, pos.fraction) * wb;
    case "behindFrontAxle":
      return requireFinite(`zonePositions.${zone}.mm`, pos.mm);
    case "behindRearAxle":
      return wb + requireFinite(`zonePositions.${zone}.mm`, pos.mm);
    default:
      throw new InputError(`zonePositions.${zone}`, "a zone position must be a fraction or an offset from an axle");
  }
}

/** Position of an item: its measured xMm when given, else its zone's position. */
export function positionXMm(
  place: { xMm?: number | null; zone?: Zone | null },
  wheelbaseMm: number,
  overrides: ZoneOverrides | undefined,
  field: string,
  fallbackZone?: Zone,
): number {
  if (place.xMm !== undefined && place.xMm !== null) return requireFinite(`${field}.xMm`, place.xMm);
  const zone = place.zone ?? fallbackZone;
  if (zone === undefined || zone === null) {
    throw new InputError(`${field}.xMm`, `${field} needs a position: xMm behind the front axle or a zone (${ZONES.join(", ")})`);
  }
  return zoneXMm(zone, wheelbaseMm, overrides, `${field}.zone`);
}
