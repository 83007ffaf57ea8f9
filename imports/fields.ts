/**
 * The canonical fields of a vehicle register row, in the order the template shows them.
 * `label` is how messages name the field; `header` is the column heading of our template.
 */
export const VEHICLE_FIELDS = [
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
  "kerbMassKg",
  "gvmKg",
  "frontAxleRatingKg",
  "rearAxleRatingKg",
  "notes",
] as const;

export type VehicleField = (typeof VEHICLE_FIELDS)[number];

/** Fields a row cannot do without. */
export const REQUIRED_VEHICLE_FIELDS: readonly VehicleField[] = ["fleetNumber"];

/** The maker's figures that only matter when a row brings in a platform we do not know yet. */
export const PLATFORM_RATING_FIELDS = ["kerbMassKg", "gvmKg", "frontAxleRatingKg", "rearAxleRatingKg"] as const;
export type PlatformRatingField = (typeof PLATFORM_RATING_FIELDS)[number];

/** Vehicle states as Rigline stores them (one list, kept with the readiness rules). */
export { VEHICLE_STATES, type VehicleState } from "@/lib/readiness/readiness";

export interface VehicleFieldInfo {
  /** Name used in messages ("Odometer has ..."). */
  label: string;
  /** Column heading in the import template. */
  header: string;
  required: boolean;
  /** One or two sentences for the template's notes sheet. */
  description: string;
  /** Invented example for the template's example row. */
  example: string | number;
}

export const VEHICLE_FIELD_INFO: Readonly<Record<VehicleField, VehicleFieldInfo>> = {
  fleetNumber: {
    label: "Fleet number",
    header: "Fleet number",
    required: true,
    description: "Your own number for the vehicle, up to 32 characters. Each row needs one and it must be unique in the file.",
    example: "EX-001",
  },
  vin: {
    label: "VIN",
    header: "VIN",
    required: false,
    description: "Vehicle identification number: 17 letters and digits, never I, O or Q. Used first to find an existing vehicle.",
    example: "0RLTD70K5PX100214",
  },
  registration: {
    label: "Registration",
    header: "Registration",
    required: false,
    description: "Number plate as issued, up to 16 characters.",
    example: "XQ 40 MC",
  },
  registrationExpiry: {
    label: "Registration expiry",
    header: "Registration expiry",
    required: false,
    description: "Date the registration runs out: a date cell, 2026-03-31 or 31/03/2026 (day first).",
    example: "2026-03-31",
  },
  make: {
    label: "Make",
    header: "Make",
    required: false,
    description: "Vehicle maker. Make, model and variant together name the platform.",
    example: "Korrawa",
  },
  model: {
    label: "Model",
    header: "Model",
    required: false,
    description: "Model name as the maker gives it.",
    example: "Dunecrest 70",
  },
  variant: {
    label: "Variant",
    header: "Variant",
    required: false,
    description: "Body, cab or trim variant, if the maker has more than one.",
    example: "Single cab chassis",
  },
  buildYear: {
    label: "Build year",
    header: "Build year",
    required: false,
    description: "Year the vehicle was built, from 1950 to next year.",
    example: 2023,
  },
  depot: {
    label: "Depot",
    header: "Depot",
    required: false,
    description: "Depot the vehicle works from, by name or code.",
    example: "Mulga Creek",
  },
  costCentre: {
    label: "Cost centre",
    header: "Cost centre",
    required: false,
    description: "Cost centre that pays for the vehicle, up to 32 characters.",
    example: "CC-4102",
  },
  state: {
    label: "Status",
    header: "Status",
    required: false,
    description: "One of: in service, in fit-out, grounded, retired. Left empty, a new vehicle starts in service.",
    example: "in service",
  },
  odometerKm: {
    label: "Odometer",
    header: "Odometer (km)",
    required: false,
    description: "Odometer reading in whole kilometres (tenths are rounded).",
    example: 18420,
  },
  kerbMassKg: {
    label: "Kerb mass",
    header: "Kerb mass (kg)",
    required: false,
    description: "Maker's kerb mass in kg. Only used when the make, model and variant are new to Rigline.",
    example: 2265,
  },
  gvmKg: {
    label: "GVM",
    header: "GVM (kg)",
    required: false,
    description: "Maker's gross vehicle mass in kg. Only used for a new platform.",
    example: 3510,
  },
  frontAxleRatingKg: {
    label: "Front axle rating",
    header: "Front axle rating (kg)",
    required: false,
    description: "Maker's front axle load rating in kg. Only used for a new platform.",
    example: 1480,
  },
  rearAxleRatingKg: {
    label: "Rear axle rating",
    header: "Rear axle rating (kg)",
    required: false,
    description: "Maker's rear axle load rating in kg. Only used for a new platform.",
    example: 2300,
  },
  notes: {
    label: "Notes",
    header: "Notes",
    required: false,
    description: "Anything else worth keeping with the vehicle, up to 2,000 characters.",
    example: "Example row: replace or delete it before importing.",
  },
};

export function isVehicleField(value: unknown): value is VehicleField {
  return typeof value === "string" && (VEHICLE_FIELDS as readonly string[]).includes(value);
}
