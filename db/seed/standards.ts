/**
 * Demo fit-out standards, editions, fitments, concessions and evidence. Everything here is
 * invented: the standard, its lines, the masses, costs and positions are plausible demo figures,
 * not any maker's or supplier's data.
 *
 * Mirrabel (the first organisation) gets "Remote duty fit-out": edition 1 published, edition 2 a
 * draft with a few changed lines. Most vehicles are on edition 1 and their fitments give a spread
 * of variance (see VEHICLE_PROFILES). Gidgee gets a small "Parks patrol fit-out".
 */
import { createHash } from "node:crypto";
import { and, asc, eq } from "drizzle-orm";
import { validateDependencies } from "@/lib/editions";
import { addMonths } from "@/lib/readiness";
import type { CriterionRow } from "../schema";
import {
  concessions,
  editionLines,
  editions,
  evidence,
  fitments,
  lineDependencies,
  memberships,
  standards,
  users,
  vehicles,
  EVIDENCE_KINDS,
  LINE_CATEGORIES,
  REQUIREMENTS,
  ZONES,
} from "../schema";
import type { Database } from "../client";

type EvidenceKind = (typeof EVIDENCE_KINDS)[number];

export type SeedLine = {
  key: string;
  code: string;
  category: (typeof LINE_CATEGORIES)[number];
  title: string;
  requirement: (typeof REQUIREMENTS)[number];
  quantity?: number;
  massKg?: number;
  xMm?: number;
  zone?: (typeof ZONES)[number];
  massKind?: "constant" | "variable";
  criteria?: CriterionRow[];
  evidence?: EvidenceKind[];
  costCents: number;
  /** Keys of the lines this one depends on. */
  dependsOn?: string[];
  checkable?: boolean;
  expiryMonths?: number;
  /** Attributes a fitment that meets this line records. */
  good?: Record<string, number | string>;
};

const c = (attribute: string, op: CriterionRow["op"], value: CriterionRow["value"], unit?: string, label?: string): CriterionRow => ({
  attribute,
  op,
  value,
  ...(unit ? { unit } : {}),
  ...(label ? { label } : {}),
});

/** Edition 1 of "Remote duty fit-out": 64 lines over every category. */
export const REMOTE_DUTY_LINES: SeedLine[] = [
  // Tyres: the size is decided first (it sets the lift height).
  { key: "tyres-all-terrain", code: "TY-01", category: "tyres", title: "All-terrain tyres LT265/75R16", requirement: "must_fit", quantity: 4, costCents: 184_000, criteria: [c("tyreSize", "eq", "LT265/75R16", undefined, "Tyre size"), c("loadIndex", "gte", 121, undefined, "Load index")], evidence: ["photo"], good: { tyreSize: "LT265/75R16", loadIndex: 123 } },
  { key: "wheels-steel-16", code: "TY-02", category: "tyres", title: "16-inch steel wheels, load-rated", requirement: "must_fit", quantity: 5, costCents: 96_000, criteria: [c("rimDiameterIn", "eq", 16, "in", "Rim diameter")], dependsOn: ["tyres-all-terrain"], good: { rimDiameterIn: 16 } },
  { key: "spare-full-size", code: "TY-03", category: "tyres", title: "Full-size spare on a matching wheel", requirement: "must_fit", massKg: 36, zone: "rear_overhang", costCents: 46_000, criteria: [c("tyreSize", "eq", "LT265/75R16", undefined, "Tyre size"), c("loadIndex", "gte", 121, undefined, "Load index")], dependsOn: ["tyres-all-terrain"], checkable: true, good: { tyreSize: "LT265/75R16", loadIndex: 123 } },
  { key: "spare-second", code: "TY-04", category: "tyres", title: "Second spare tyre for long remote runs", requirement: "may_fit", massKg: 36, zone: "roof", costCents: 46_000, dependsOn: ["tyres-all-terrain", "roof-rack"] },
  { key: "tyre-gauge-deflator", code: "TY-05", category: "tyres", title: "Tyre pressure gauge and deflator", requirement: "must_fit", massKg: 0.5, zone: "cab", costCents: 6_500, checkable: true },

  // Suspension: springs are chosen after the accessory masses are known.
  { key: "springs-front", code: "SU-01", category: "suspension", title: "Front springs rated for the constant accessory load", requirement: "must_fit", quantity: 2, costCents: 88_000, criteria: [c("springRatingKg", "between", [120, 220], "kg", "Spring rating (constant load)")], evidence: ["certificate"], dependsOn: ["front-bar", "winch", "tyres-all-terrain"], good: { springRatingKg: 170 } },
  { key: "springs-rear", code: "SU-02", category: "suspension", title: "Rear springs rated for the constant accessory load", requirement: "must_fit", quantity: 2, costCents: 96_000, criteria: [c("springRatingKg", "between", [350, 450], "kg", "Spring rating (constant load)")], evidence: ["certificate"], dependsOn: ["drawers", "water-tank", "dual-battery", "spare-full-size", "tyres-all-terrain"], good: { springRatingKg: 400 } },
  { key: "shocks", code: "SU-03", category: "suspension", title: "Heavy-duty shock absorbers", requirement: "must_fit", quantity: 4, costCents: 124_000, dependsOn: ["springs-front", "springs-rear"], evidence: ["photo"] },
  { key: "airbags-rear", code: "SU-04", category: "suspension", title: "Rear airbag assist for the variable load", requirement: "may_fit", quantity: 2, massKg: 3, zone: "tub", costCents: 68_000, dependsOn: ["springs-rear"] },
  { key: "lift", code: "SU-05", category: "suspension", title: "Suspension lift, 40 mm or less", requirement: "must_fit", costCents: 35_000, criteria: [c("liftMm", "lte", 40, "mm", "Lift")], evidence: ["photo"], dependsOn: ["lift-signoff", "springs-front", "springs-rear"], good: { liftMm: 40 } },

  // Steering and driveline.
  { key: "steering-damper", code: "SD-01", category: "steering_driveline", title: "Heavy-duty steering damper", requirement: "must_fit", massKg: 2.5, zone: "front", costCents: 29_000 },
  { key: "transmission-cooler", code: "SD-02", category: "steering_driveline", title: "Auxiliary transmission cooler", requirement: "must_fit", massKg: 3, zone: "front", costCents: 66_000, evidence: ["photo"] },
  { key: "tie-rod", code: "SD-03", category: "steering_driveline", title: "Heavy-duty tie rod and drag link", requirement: "must_fit", massKg: 4, zone: "front", costCents: 54_000 },
  { key: "centre-bearing-spacer", code: "SD-04", category: "steering_driveline", title: "Driveshaft centre-bearing spacers for the lift", requirement: "must_fit", massKg: 0.5, zone: "cab", costCents: 9_500, dependsOn: ["lift"] },
  { key: "wheel-spacers", code: "SD-05", category: "steering_driveline", title: "Wheel spacers (not permitted)", requirement: "must_not_fit", costCents: 0 },

  // Protection.
  { key: "front-bar", code: "PR-01", category: "protection", title: "Front protection bar, airbag-compatible", requirement: "must_fit", massKg: 72, xMm: -650, zone: "front", costCents: 325_000, evidence: ["photo", "certificate"], good: { airbagCompatible: "yes" }, criteria: [c("airbagCompatible", "eq", "yes", undefined, "Airbag-compatible")] },
  { key: "rock-sliders", code: "PR-02", category: "protection", title: "Rock sliders", requirement: "must_fit", quantity: 2, massKg: 18, zone: "cab", costCents: 112_000, evidence: ["photo"] },
  { key: "sump-guard", code: "PR-03", category: "protection", title: "Sump and transmission guards", requirement: "must_fit", massKg: 16, zone: "front", costCents: 66_000, criteria: [c("plateThicknessMm", "gte", 4, "mm", "Plate thickness")], good: { plateThicknessMm: 5 } },
  { key: "fuel-tank-guard", code: "PR-04", category: "protection", title: "Fuel tank guard", requirement: "must_fit", massKg: 9, zone: "tub", costCents: 46_000 },
  { key: "rear-bar", code: "PR-05", category: "protection", title: "Rear protection bar with wheel carrier", requirement: "may_fit", massKg: 48, zone: "rear_overhang", costCents: 265_000, evidence: ["certificate"] },

  // Recovery.
  { key: "snatch-strap", code: "RC-01", category: "recovery", title: "Snatch strap", requirement: "must_fit", massKg: 2.5, zone: "tub", costCents: 9_000, criteria: [c("minBreakingStrengthKg", "gte", 8000, "kg", "Minimum breaking strength")], checkable: true, good: { minBreakingStrengthKg: 8000 } },
  { key: "soft-shackles", code: "RC-02", category: "recovery", title: "Rated soft shackles", requirement: "must_fit", quantity: 2, massKg: 0.3, zone: "tub", costCents: 7_000, criteria: [c("workingLoadLimitKg", "gte", 4750, "kg", "Working load limit")], checkable: true, good: { workingLoadLimitKg: 5000 } },
  { key: "recovery-boards", code: "RC-03", category: "recovery", title: "Recovery boards", requirement: "must_fit", quantity: 2, massKg: 3.5, zone: "roof", costCents: 31_000, checkable: true, dependsOn: ["roof-rack"] },
  { key: "winch", code: "RC-04", category: "recovery", title: "Electric winch on the front bar", requirement: "must_fit", massKg: 36, xMm: -700, zone: "front", costCents: 245_000, criteria: [c("ratedPullKg", "gte", 4300, "kg", "Rated line pull")], evidence: ["photo", "certificate"], dependsOn: ["front-bar", "winch-cable"], good: { ratedPullKg: 4300 } },
  { key: "winch-kit", code: "RC-05", category: "recovery", title: "Tree-trunk protector, winch damper and gloves", requirement: "must_fit", massKg: 2, zone: "tub", costCents: 12_000, checkable: true, dependsOn: ["winch"] },
  { key: "shovel", code: "RC-06", category: "recovery", title: "Long-handled shovel", requirement: "must_fit", massKg: 2.5, zone: "roof", costCents: 5_500, checkable: true, dependsOn: ["roof-rack"] },
  { key: "recovery-points", code: "RC-07", category: "recovery", title: "Rated recovery points, front and rear", requirement: "must_fit", quantity: 2, massKg: 1.5, zone: "front", costCents: 18_000, evidence: ["certificate"] },

  // Water and dust.
  { key: "snorkel", code: "WD-01", category: "water_dust", title: "Snorkel with pre-cleaner", requirement: "must_fit", massKg: 4, zone: "front", costCents: 56_000, evidence: ["photo"] },
  { key: "breather-extensions", code: "WD-02", category: "water_dust", title: "Axle, gearbox and transfer breather extensions", requirement: "must_fit", massKg: 1, zone: "front", costCents: 31_000 },
  { key: "dust-seals", code: "WD-03", category: "water_dust", title: "Door and tailgate dust seals", requirement: "must_fit", massKg: 1, zone: "cab", costCents: 42_000 },
  { key: "cabin-prefilter", code: "WD-04", category: "water_dust", title: "Cabin air pre-filter", requirement: "may_fit", massKg: 1.5, zone: "cab", costCents: 24_000 },

  // Electrical.
  { key: "dual-battery", code: "EL-01", category: "electrical", title: "Auxiliary battery, lithium iron phosphate", requirement: "must_fit", massKg: 13, zone: "tub", costCents: 142_000, criteria: [c("capacityAh", "gte", 100, "Ah", "Capacity")], evidence: ["photo"], good: { capacityAh: 120 } },
  { key: "dc-dc-charger", code: "EL-02", category: "electrical", title: "DC-DC charger", requirement: "must_fit", massKg: 1.5, zone: "tub", costCents: 56_000, criteria: [c("chargeCurrentA", "gte", 25, "A", "Charge current")], dependsOn: ["dual-battery"], good: { chargeCurrentA: 25 } },
  { key: "winch-cable", code: "EL-03", category: "electrical", title: "Main supply cable, battery to front and rear", requirement: "must_fit", massKg: 4, zone: "cab", costCents: 26_000, criteria: [c("cableAreaMm2", "gte", 16, "mm²", "Conductor area")], dependsOn: ["dual-battery"], good: { cableAreaMm2: 25 } },
  { key: "supply-fuses", code: "EL-04", category: "electrical", title: "Fuses at each supply end", requirement: "must_fit", quantity: 2, massKg: 0.2, zone: "tub", costCents: 8_000, criteria: [c("fuseRatingA", "between", [40, 80], "A", "Fuse rating")], dependsOn: ["winch-cable"], good: { fuseRatingA: 60 } },
  { key: "accessory-outlets", code: "EL-05", category: "electrical", title: "12 V outlets for fridge and radios", requirement: "must_fit", quantity: 2, massKg: 0.3, zone: "tub", costCents: 14_000, dependsOn: ["supply-fuses"] },
  { key: "battery-monitor", code: "EL-06", category: "electrical", title: "Battery monitor with shunt", requirement: "may_fit", massKg: 0.4, zone: "cab", costCents: 32_000, dependsOn: ["dual-battery"] },
  { key: "electrical-check", code: "EL-07", category: "electrical", title: "Auxiliary wiring inspected and tested", requirement: "must_fit", costCents: 22_000, evidence: ["certificate"], dependsOn: ["supply-fuses", "dc-dc-charger", "accessory-outlets"] },

  // Communications.
  { key: "uhf-radio", code: "CM-01", category: "communications", title: "UHF CB radio with antenna", requirement: "must_fit", massKg: 2, zone: "cab", costCents: 66_000, criteria: [c("outputW", "gte", 5, "W", "Transmit power")], checkable: true, dependsOn: ["supply-fuses"], good: { outputW: 5 } },
  { key: "sat-messenger", code: "CM-02", category: "communications", title: "Satellite messenger with SOS", requirement: "must_fit", massKg: 0.2, zone: "cab", costCents: 56_000, checkable: true },
  { key: "hf-radio", code: "CM-03", category: "communications", title: "HF radio for routes beyond UHF range", requirement: "may_fit", massKg: 8, zone: "cab", costCents: 455_000, dependsOn: ["supply-fuses"] },
  { key: "plb", code: "CM-04", category: "communications", title: "Personal locator beacon", requirement: "must_fit", massKg: 0.2, zone: "cab", costCents: 38_000, checkable: true, expiryMonths: 60 },
  { key: "radio-antenna-mount", code: "CM-05", category: "communications", title: "Antenna mount on the front bar", requirement: "must_fit", massKg: 1, zone: "front", costCents: 9_000, dependsOn: ["front-bar"] },

  // Storage.
  { key: "drawers", code: "ST-01", category: "storage", title: "Rear drawer system", requirement: "must_fit", massKg: 65, zone: "tub", costCents: 285_000, evidence: ["photo"] },
  { key: "cargo-barrier", code: "ST-02", category: "storage", title: "Cargo barrier, rated", requirement: "must_fit", massKg: 22, zone: "cab", costCents: 92_000, evidence: ["certificate"] },
  { key: "water-tank", code: "ST-03", category: "storage", title: "Water tank 40 L with pump", requirement: "must_fit", massKg: 46, zone: "tub", massKind: "variable", costCents: 62_000, criteria: [c("capacityL", "gte", 40, "L", "Capacity")], good: { capacityL: 40 } },
  { key: "fridge-slide", code: "ST-04", category: "storage", title: "Fridge slide with tie-downs", requirement: "must_fit", massKg: 18, zone: "tub", costCents: 46_000 },
  { key: "load-straps", code: "ST-05", category: "storage", title: "Load restraint straps", requirement: "must_fit", quantity: 4, massKg: 0.5, zone: "tub", costCents: 6_000, checkable: true },
  { key: "jerry-holders", code: "ST-06", category: "storage", title: "Jerry can holders", requirement: "may_fit", quantity: 2, massKg: 4, zone: "rear_overhang", costCents: 28_000, dependsOn: ["rear-bar"] },

  // Lighting and roof.
  { key: "roof-rack", code: "LR-01", category: "lighting_roof", title: "Platform roof rack", requirement: "must_fit", massKg: 32, zone: "roof", costCents: 195_000, criteria: [c("dynamicRatingKg", "gte", 80, "kg", "Rack dynamic rating")], evidence: ["photo"], good: { dynamicRatingKg: 100 } },
  { key: "driving-lights", code: "LR-02", category: "lighting_roof", title: "LED driving lights, pair", requirement: "must_fit", quantity: 2, massKg: 2, zone: "front", costCents: 62_000, dependsOn: ["front-bar", "supply-fuses"] },
  { key: "rear-work-light", code: "LR-03", category: "lighting_roof", title: "Rear work light", requirement: "must_fit", massKg: 1, zone: "rear_overhang", costCents: 12_000, dependsOn: ["supply-fuses"] },
  { key: "amber-beacon", code: "LR-04", category: "lighting_roof", title: "Amber beacon for roadside work", requirement: "may_fit", massKg: 1.5, zone: "roof", costCents: 21_000, dependsOn: ["roof-rack"] },
  { key: "roof-light-bar", code: "LR-05", category: "lighting_roof", title: "Roof-mounted light bar (not permitted)", requirement: "must_not_fit", costCents: 0 },

  // Safety.
  { key: "first-aid-kit", code: "SF-01", category: "safety", title: "First-aid kit, remote area", requirement: "must_fit", massKg: 3, zone: "cab", costCents: 26_000, checkable: true, expiryMonths: 12 },
  { key: "fire-extinguisher", code: "SF-02", category: "safety", title: "Fire extinguisher, 1.5 kg dry powder", requirement: "must_fit", massKg: 2.5, zone: "cab", costCents: 9_500, criteria: [c("chargeKg", "gte", 1.5, "kg", "Charge")], checkable: true, expiryMonths: 12, good: { chargeKg: 1.5 } },
  { key: "warning-triangles", code: "SF-03", category: "safety", title: "Reflective warning triangles", requirement: "must_fit", quantity: 3, massKg: 0.6, zone: "tub", costCents: 6_000, checkable: true },
  { key: "emergency-water", code: "SF-04", category: "safety", title: "Emergency drinking water, 20 L", requirement: "must_fit", massKg: 21, zone: "tub", massKind: "variable", costCents: 4_500, checkable: true },
  { key: "hi-vis-vests", code: "SF-05", category: "safety", title: "High-visibility vests", requirement: "must_fit", quantity: 2, massKg: 0.2, zone: "cab", costCents: 3_000, checkable: true },
  { key: "wheel-chocks", code: "SF-06", category: "safety", title: "Wheel chocks", requirement: "must_fit", quantity: 2, massKg: 1, zone: "tub", costCents: 4_000, checkable: true },

  // Engineering: advice before the spanners, alignment and checks after.
  { key: "lift-signoff", code: "EN-01", category: "engineering", title: "Engineering sign-off for the lift and tyre change", requirement: "must_fit", costCents: 95_000, evidence: ["engineering_signoff"], dependsOn: ["tyres-all-terrain"] },
  { key: "wheel-alignment", code: "EN-02", category: "engineering", title: "Wheel alignment after suspension work", requirement: "must_fit", costCents: 18_000, evidence: ["certificate"], dependsOn: ["lift", "springs-front", "springs-rear", "shocks", "airbags-rear", "steering-damper", "tie-rod", "transmission-cooler", "centre-bearing-spacer"] },
  { key: "speedo-check", code: "EN-03", category: "engineering", title: "Speedometer accuracy check after the tyre change", requirement: "must_fit", costCents: 12_000, evidence: ["certificate"], dependsOn: ["tyres-all-terrain"] },
  { key: "weighbridge", code: "EN-04", category: "engineering", title: "Weighbridge ticket of the fitted vehicle", requirement: "must_fit", costCents: 15_000, evidence: ["weighbridge_ticket"], dependsOn: ["front-bar", "winch", "drawers", "roof-rack", "water-tank", "dual-battery"] },
  { key: "brake-assessment", code: "EN-05", category: "engineering", title: "Brake upgrade assessment for the heavier vehicle", requirement: "may_fit", costCents: 45_000, evidence: ["certificate"], dependsOn: ["weighbridge"] },
];

/** Edition 2 (draft): what changes from edition 1, by key. */
export const REMOTE_DUTY_EDITION_2 = {
  changed: {
    "hf-radio": { requirement: "must_fit" as const, title: "HF radio for routes beyond UHF range (now required)" },
    "snatch-strap": { criteria: [c("minBreakingStrengthKg", "gte", 11000, "kg", "Minimum breaking strength")], costCents: 11_500 },
    "first-aid-kit": { title: "First-aid kit, remote area, with trauma module", costCents: 34_000, massKg: 3.8 },
  } satisfies Record<string, Partial<SeedLine>>,
  removed: ["rear-work-light"],
  added: [
    { key: "snake-bite-kit", code: "SF-07", category: "safety", title: "Snake-bite kit with compression bandages", requirement: "must_fit", massKg: 0.4, zone: "cab", costCents: 5_500, checkable: true, expiryMonths: 24 },
  ] satisfies SeedLine[],
};

/** The small standard of the second organisation. */
export const PARKS_PATROL_LINES: SeedLine[] = [
  { key: "pp-tyres", code: "TY-01", category: "tyres", title: "All-terrain tyres, light-truck construction", requirement: "must_fit", quantity: 4, costCents: 176_000, criteria: [c("loadIndex", "gte", 116, undefined, "Load index")], good: { loadIndex: 118 } },
  { key: "pp-uhf", code: "CM-01", category: "communications", title: "UHF CB radio", requirement: "must_fit", massKg: 2, zone: "cab", costCents: 62_000, checkable: true },
  { key: "pp-first-aid", code: "SF-01", category: "safety", title: "First-aid kit", requirement: "must_fit", massKg: 2.5, zone: "cab", costCents: 19_000, checkable: true, expiryMonths: 12 },
  { key: "pp-extinguisher", code: "SF-02", category: "safety", title: "Fire extinguisher", requirement: "must_fit", massKg: 2.5, zone: "cab", costCents: 9_000, checkable: true, expiryMonths: 12 },
  { key: "pp-fire-unit", code: "ST-01", category: "storage", title: "Slip-on fire-fighting unit mounts", requirement: "must_fit", massKg: 12, zone: "tub", costCents: 88_000, evidence: ["certificate"] },
  { key: "pp-recovery-kit", code: "RC-01", category: "recovery", title: "Recovery kit: strap, shackles, gloves", requirement: "must_fit", massKg: 5, zone: "tub", costCents: 21_000, checkable: true },
  { key: "pp-snorkel", code: "WD-01", category: "water_dust", title: "Snorkel", requirement: "must_fit", massKg: 4, zone: "front", costCents: 54_000 },
  { key: "pp-light-bar", code: "LR-01", category: "lighting_roof", title: "Roof light bar (not permitted)", requirement: "must_not_fit", costCents: 0 },
];

/**
 * How each Mirrabel vehicle (by index, MH-001 = 0) is fitted against edition 1. Vehicles 36–38
 * have no edition; 39 (retired) is on edition 1 with nothing recorded.
 */
export type VehicleProfile = {
  /** Must-fit lines left unfitted. "all-but-tyres" leaves every must-fit line but the tyres and wheels. */
  skip?: string[] | "all-but-tyres";
  /** Attribute overrides for a line's fitment. */
  attributes?: Record<string, Record<string, number | string>>;
  /** Lines whose evidence is lodged but not yet accepted. */
  lodged?: string[];
  /** Lines whose fitment expired (fitted long ago). */
  expired?: string[];
  /** Must-not-fit lines fitted anyway. */
  prohibited?: string[];
  /** May-fit lines fitted. */
  optional?: string[];
  concession?: { key: string; daysToExpiry: number; reason: string };
  extras?: { label: string; massKg: number; zone: (typeof ZONES)[number] }[];
};

const SHORT_POOL = ["sat-messenger", "cargo-barrier", "recovery-boards", "breather-extensions", "fridge-slide", "driving-lights", "sump-guard"];

export function vehicleProfile(i: number): VehicleProfile | null {
  if (i >= 36 && i <= 38) return null; // no edition
  if (i === 39) return { skip: "all-but-tyres" }; // retired (left out of fleet figures)
  if (i % 10 === 4) return { skip: "all-but-tyres" }; // in fit-out: only tyres and wheels so far
  switch (i) {
    case 0:
      return { optional: ["airbags-rear"], extras: [{ label: "Dash camera", massKg: 0.3, zone: "cab" }] };
    case 6:
      return { attributes: { "tyres-all-terrain": { tyreSize: "LT265/75R16", loadIndex: 116 } } };
    case 7:
      return { skip: ["shocks"] };
    case 8:
      return { lodged: ["front-bar", "lift-signoff"] };
    case 9:
      return { skip: ["snorkel"], concession: { key: "snorkel", daysToExpiry: 60, reason: "Snorkel on back order from the supplier; vehicle kept to sealed and dry roads until fitted" } };
    case 10:
      return { expired: ["first-aid-kit"] };
    case 11:
      return { prohibited: ["wheel-spacers"], extras: [{ label: "Camp fridge, 60 L", massKg: 24, zone: "tub" }] };
    case 12:
      return { skip: ["snorkel"], concession: { key: "snorkel", daysToExpiry: -10, reason: "Snorkel deferred until the wet season ends" } };
    case 30:
      return { optional: ["hf-radio", "battery-monitor"], extras: [{ label: "Rooftop awning", massKg: 14, zone: "roof" }] };
  }
  if (i <= 5 || (i >= 31 && i <= 35)) return i % 3 === 0 ? { optional: ["airbags-rear"] } : {};
  // The rest are short a few common lines: 1–4 of them.
  const count = 1 + (i % 4);
  const start = i % SHORT_POOL.length;
  const skip = Array.from({ length: count }, (_, k) => SHORT_POOL[(start + k) % SHORT_POOL.length]!);
  return { skip };
}

const DAY_MS = 86_400_000;

type Ctx = { orgId: string; slug: string; managerId: string; contractorId: string | null; now: Date };

async function insertEdition(
  tx: Database,
  ctx: Ctx,
  standardId: string,
  number: number,
  status: "draft" | "published",
  lines: SeedLine[],
  copiedFromId: string | null,
  notes: string,
) {
  const [edition] = await tx
    .insert(editions)
    .values({
      orgId: ctx.orgId,
      standardId,
      number,
      status,
      notes,
      copiedFromId,
      publishedAt: status === "published" ? new Date(ctx.now.getTime() - 400 * DAY_MS) : null,
      publishedBy: status === "published" ? ctx.managerId : null,
    })
    .returning();
  if (!edition) throw new Error("edition insert failed");
  const rows = await tx
    .insert(editionLines)
    .values(
      lines.map((l, i) => ({
        orgId: ctx.orgId,
        editionId: edition.id,
        key: l.key,
        code: l.code,
        category: l.category,
        title: l.title,
        requirement: l.requirement,
        quantity: l.quantity ?? 1,
        massKg: l.massKg ?? 0,
        xMm: l.xMm ?? null,
        zone: l.zone ?? null,
        massKind: l.massKind ?? "constant",
        criteria: l.criteria ?? [],
        evidenceNeeded: l.evidence ?? [],
        standardCostCents: l.costCents,
        checkable: l.checkable ?? false,
        expiryMonths: l.expiryMonths ?? null,
        sortOrder: (i + 1) * 10,
      })),
    )
    .returning({ id: editionLines.id, key: editionLines.key });
  const idByKey = new Map(rows.map((r) => [r.key, r.id]));
  const deps = lines.flatMap((l) =>
    (l.dependsOn ?? []).filter((k) => idByKey.has(k)).map((k) => ({ lineId: idByKey.get(l.key)!, dependsOnLineId: idByKey.get(k)! })),
  );
  if (deps.length > 0) await tx.insert(lineDependencies).values(deps);
  // The demo must never ship a circle of dependencies.
  validateDependencies(
    lines.map((l) => ({
      id: idByKey.get(l.key)!,
      key: l.key,
      code: l.code,
      category: l.category,
      title: l.title,
      requirement: l.requirement,
      quantity: l.quantity ?? 1,
      massKg: l.massKg ?? 0,
      xMm: l.xMm ?? null,
      zone: l.zone ?? null,
      massKind: l.massKind ?? "constant",
      criteria: l.criteria ?? [],
      evidenceNeeded: l.evidence ?? [],
      standardCostCents: l.costCents,
      dependsOn: (l.dependsOn ?? []).filter((k) => idByKey.has(k)).map((k) => idByKey.get(k)!),
      checkable: l.checkable ?? false,
      expiryMonths: l.expiryMonths ?? null,
    })),
  );
  return edition;
}

function sha(text: string): string {
  return createHash("sha256").update(text).digest("hex");
}

type VehicleRef = { id: string; fleetNumber: string };

/** Fitments (with their evidence), concessions and extras of one vehicle under a profile. */
async function fitVehicle(tx: Database, ctx: Ctx, vehicle: VehicleRef, index: number, lines: SeedLine[], profile: VehicleProfile) {
  const fittedAt = new Date(ctx.now.getTime() - (120 + index * 3) * DAY_MS);
  const skip = new Set(
    profile.skip === "all-but-tyres"
      ? lines.filter((l) => l.requirement === "must_fit" && l.category !== "tyres").map((l) => l.key).concat(["spare-full-size", "tyre-gauge-deflator"])
      : (profile.skip ?? []),
  );
  const chosen = lines.filter(
    (l) =>
      (l.requirement === "must_fit" && !skip.has(l.key)) ||
      (l.requirement === "may_fit" && profile.optional?.includes(l.key)) ||
      (l.requirement === "must_not_fit" && profile.prohibited?.includes(l.key)),
  );
  if (chosen.length === 0 && !profile.extras) return;
  const values: (typeof fitments.$inferInsert)[] = chosen.map((l) => {
    const expired = profile.expired?.includes(l.key) ?? false;
    const at = expired ? new Date(ctx.now.getTime() - 400 * DAY_MS) : fittedAt;
    return {
      orgId: ctx.orgId,
      vehicleId: vehicle.id,
      lineKey: l.key,
      label: l.title,
      quantity: l.quantity ?? 1,
      attributes: profile.attributes?.[l.key] ?? l.good ?? {},
      fittedAt: at,
      expiresAt: l.expiryMonths ? addMonths(at, l.expiryMonths) : null,
      recordedBy: ctx.managerId,
    };
  });
  for (const extra of profile.extras ?? []) {
    values.push({
      orgId: ctx.orgId,
      vehicleId: vehicle.id,
      lineKey: null,
      label: extra.label,
      quantity: 1,
      attributes: {},
      massKg: extra.massKg,
      zone: extra.zone,
      massKind: "constant",
      fittedAt,
      expiresAt: null,
      recordedBy: ctx.managerId,
    });
  }
  const rows = await tx.insert(fitments).values(values).returning({ id: fitments.id, lineKey: fitments.lineKey });
  const lineByKey = new Map(lines.map((l) => [l.key, l]));
  const evidenceRows = rows.flatMap((row) => {
    const line = row.lineKey ? lineByKey.get(row.lineKey) : undefined;
    if (!line?.evidence) return [];
    const lodged = profile.lodged?.includes(line.key) ?? false;
    return line.evidence.map((kind) => {
      const name = `${vehicle.fleetNumber.toLowerCase()}-${line.code.toLowerCase()}-${kind.replaceAll("_", "-")}`;
      const pdf = kind !== "photo";
      return {
        orgId: ctx.orgId,
        fitmentId: row.id,
        lineKey: line.key,
        kind,
        status: lodged ? ("lodged" as const) : ("accepted" as const),
        filename: `${name}.${pdf ? "pdf" : "jpg"}`,
        contentType: pdf ? "application/pdf" : "image/jpeg",
        sizeBytes: 48_000 + name.length * 97,
        sha256: sha(`demo evidence ${ctx.slug} ${name}`),
        storageKey: `evidence/${ctx.slug}/demo/${name}.${pdf ? "pdf" : "jpg"}`,
        uploadedBy: ctx.contractorId ?? ctx.managerId,
        reviewedBy: lodged ? null : ctx.managerId,
        reviewedAt: lodged ? null : new Date(fittedAt.getTime() + 2 * DAY_MS),
      };
    });
  });
  if (evidenceRows.length > 0) await tx.insert(evidence).values(evidenceRows);
  if (profile.concession) {
    await tx.insert(concessions).values({
      orgId: ctx.orgId,
      vehicleId: vehicle.id,
      lineKey: profile.concession.key,
      reason: profile.concession.reason,
      expiresAt: new Date(ctx.now.getTime() + profile.concession.daysToExpiry * DAY_MS),
      approvedBy: ctx.managerId,
    });
  }
}

function applyEdition2(lines: SeedLine[]): SeedLine[] {
  const changed: Record<string, Partial<SeedLine>> = REMOTE_DUTY_EDITION_2.changed;
  return lines
    .filter((l) => !REMOTE_DUTY_EDITION_2.removed.includes(l.key))
    .map((l) => ({ ...l, ...(changed[l.key] ?? {}) }))
    .concat(REMOTE_DUTY_EDITION_2.added);
}

/**
 * Seeds the organisation's standards, editions, fitments, concessions and evidence. Idempotent:
 * an organisation that already has a standard is left alone.
 */
export async function seedStandards(tx: Database, orgId: string, slug: string, now: Date = new Date()): Promise<void> {
  const existing = await tx.query.standards.findFirst({ where: eq(standards.orgId, orgId) });
  if (existing) return;
  const people = await tx
    .select({ id: users.id, role: memberships.role })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(eq(memberships.orgId, orgId))
    .orderBy(asc(users.email));
  const managerId = people.find((p) => p.role === "manager")?.id ?? people[0]?.id;
  if (!managerId) return;
  const ctx: Ctx = { orgId, slug, managerId, contractorId: people.find((p) => p.role === "contractor")?.id ?? null, now };
  const fleet = await tx
    .select({ id: vehicles.id, fleetNumber: vehicles.fleetNumber })
    .from(vehicles)
    .where(and(eq(vehicles.orgId, orgId)))
    .orderBy(asc(vehicles.fleetNumber));

  if (slug === "mirrabel-health") {
    const [standard] = await tx
      .insert(standards)
      .values({ orgId, name: "Remote duty fit-out", description: "Vehicles for clinics and outreach beyond the sealed roads: self-recovery, two ways to call for help, and a 12 V system for days away." })
      .returning();
    const e1 = await insertEdition(tx, ctx, standard!.id, 1, "published", REMOTE_DUTY_LINES, null, "First published edition for the remote clinic fleet.");
    await insertEdition(tx, ctx, standard!.id, 2, "draft", applyEdition2(REMOTE_DUTY_LINES), e1.id, "HF radio becomes required; stronger snatch strap; trauma module in the first-aid kit; snake-bite kit.");
    for (const [i, vehicle] of fleet.entries()) {
      const profile = vehicleProfile(i);
      if (!profile) continue;
      await tx.update(vehicles).set({ editionId: e1.id }).where(eq(vehicles.id, vehicle.id));
      await fitVehicle(tx, ctx, vehicle, i, REMOTE_DUTY_LINES, profile);
    }
    return;
  }

  const [standard] = await tx
    .insert(standards)
    .values({ orgId, name: "Parks patrol fit-out", description: "Patrol and fire-response vehicles on park tracks." })
    .returning();
  const e1 = await insertEdition(tx, ctx, standard!.id, 1, "published", PARKS_PATROL_LINES, null, "Patrol vehicles, first edition.");
  for (const [i, vehicle] of fleet.slice(0, 6).entries()) {
    await tx.update(vehicles).set({ editionId: e1.id }).where(eq(vehicles.id, vehicle.id));
    await fitVehicle(tx, ctx, vehicle, i, PARKS_PATROL_LINES, i < 3 ? {} : { skip: ["pp-snorkel"] });
  }
}
