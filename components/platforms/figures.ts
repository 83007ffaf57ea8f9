/**
 * The maker's figures of a platform, in one list: the form, the details page, the "ratings
 * missing" notice and the server's validation all read it, so a figure is named the same way
 * everywhere. No framework imports: the server uses it too.
 */

export type PlatformFigureKey =
  | "kerbMassKg"
  | "kerbFrontKg"
  | "gvmKg"
  | "gcmKg"
  | "frontAxleRatingKg"
  | "rearAxleRatingKg"
  | "wheelbaseMm"
  | "rearOverhangMm"
  | "towingCapacityKg"
  | "towballLimitKg"
  | "roofStaticKg"
  | "roofDynamicKg"
  | "fuelCapacityL"
  | "topSpeedKmh";

export type PlatformFigure = {
  key: PlatformFigureKey;
  label: string;
  unit: "kg" | "mm" | "L" | "km/h";
  /** Part of the ratings every mass check needs; a platform without it is "ratings missing". */
  rating: boolean;
  /** Zero is a real answer ("the maker allows none"), not a missing figure. */
  zeroAllowed: boolean;
  hint?: string;
  group: "mass" | "dimensions" | "towing" | "roof" | "other";
};

export const PLATFORM_FIGURES: readonly PlatformFigure[] = [
  { key: "kerbMassKg", label: "Kerb mass", unit: "kg", rating: true, zeroAllowed: false, group: "mass" },
  {
    key: "kerbFrontKg",
    label: "Kerb mass on the front axle",
    unit: "kg",
    rating: false,
    zeroAllowed: false,
    hint: "If the maker publishes it; otherwise leave blank.",
    group: "mass",
  },
  { key: "gvmKg", label: "GVM", unit: "kg", rating: true, zeroAllowed: false, hint: "The maker's maximum laden mass.", group: "mass" },
  {
    key: "gcmKg",
    label: "GCM",
    unit: "kg",
    rating: true,
    zeroAllowed: false,
    hint: "The maker's maximum for the vehicle and what it tows together.",
    group: "mass",
  },
  { key: "frontAxleRatingKg", label: "Front axle rating", unit: "kg", rating: true, zeroAllowed: false, group: "mass" },
  { key: "rearAxleRatingKg", label: "Rear axle rating", unit: "kg", rating: true, zeroAllowed: false, group: "mass" },
  { key: "wheelbaseMm", label: "Wheelbase", unit: "mm", rating: true, zeroAllowed: false, group: "dimensions" },
  {
    key: "rearOverhangMm",
    label: "Rear overhang",
    unit: "mm",
    rating: false,
    zeroAllowed: true,
    hint: "From the rear axle to the back of the body.",
    group: "dimensions",
  },
  {
    key: "towingCapacityKg",
    label: "Braked towing capacity",
    unit: "kg",
    rating: false,
    zeroAllowed: true,
    hint: "0 if the maker allows no towing.",
    group: "towing",
  },
  { key: "towballLimitKg", label: "Towball limit", unit: "kg", rating: false, zeroAllowed: true, hint: "0 if the maker allows no towing.", group: "towing" },
  {
    key: "roofStaticKg",
    label: "Roof load, static",
    unit: "kg",
    rating: false,
    zeroAllowed: true,
    hint: "Parked (for a rooftop tent). 0 if the maker allows no roof load.",
    group: "roof",
  },
  {
    key: "roofDynamicKg",
    label: "Roof load, dynamic",
    unit: "kg",
    rating: false,
    zeroAllowed: true,
    hint: "On the move, including the rack. 0 if the maker allows no roof load.",
    group: "roof",
  },
  { key: "fuelCapacityL", label: "Fuel capacity", unit: "L", rating: false, zeroAllowed: false, group: "other" },
  { key: "topSpeedKmh", label: "Top speed", unit: "km/h", rating: false, zeroAllowed: false, group: "other" },
];

export const PLATFORM_FIGURE_GROUPS: { group: PlatformFigure["group"]; title: string }[] = [
  { group: "mass", title: "Masses and axle ratings" },
  { group: "dimensions", title: "Dimensions" },
  { group: "towing", title: "Towing" },
  { group: "roof", title: "Roof" },
  { group: "other", title: "Tyres, fuel and speed" },
];

export type PlatformFigures = Record<PlatformFigureKey, number | null>;

/** The ratings a platform still lacks (empty when every mass check has what it needs). */
export function missingRatings(figures: Partial<Record<PlatformFigureKey, number | null | undefined>>): PlatformFigure[] {
  return PLATFORM_FIGURES.filter((f) => f.rating && (figures[f.key] === null || figures[f.key] === undefined));
}

export function platformName(p: { make: string; model: string; variant?: string | null }): string {
  return [p.make, p.model, p.variant].filter((s) => s && s.trim() !== "").join(" ");
}
