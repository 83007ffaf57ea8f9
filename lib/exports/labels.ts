import { LINE_CATEGORIES, type LineCategory } from "@/lib/variance/types";

/** Costs are booked against the standard's categories. */
export const COST_CATEGORIES = LINE_CATEGORIES;
export type CostCategory = LineCategory;

export const COST_KINDS = ["capital", "operating"] as const;
export type CostKind = (typeof COST_KINDS)[number];

export const COST_SOURCES = ["job", "manual", "adjustment"] as const;
export type CostSource = (typeof COST_SOURCES)[number];

export const CATEGORY_LABELS: Record<CostCategory, string> = {
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

export const KIND_LABELS: Record<CostKind, string> = { capital: "Capital", operating: "Operating" };

export const SOURCE_LABELS: Record<CostSource, string> = {
  job: "Signed-off job",
  manual: "Invoice entered",
  adjustment: "Adjustment",
};
