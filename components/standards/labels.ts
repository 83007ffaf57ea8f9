import type { Criterion, LineCategory, Requirement, Zone } from "@/lib/variance";

/** Rigline's words for the parts of a standard's line. */

export const CATEGORY_LABELS: Record<LineCategory, string> = {
  tyres: "Tyres",
  suspension: "Suspension",
  steering_driveline: "Steering & driveline",
  protection: "Protection",
  recovery: "Recovery",
  water_dust: "Water & dust",
  electrical: "Electrical",
  communications: "Communications",
  storage: "Storage",
  lighting_roof: "Lighting & roof",
  safety: "Safety",
  engineering: "Engineering",
};

export const REQUIREMENT_LABELS: Record<Requirement, string> = {
  must_fit: "Must fit",
  may_fit: "May fit",
  must_not_fit: "Must not fit",
};

export const ZONE_LABELS: Record<Zone, string> = {
  front: "Front",
  cab: "Cab",
  tub: "Tub / cargo",
  roof: "Roof",
  rear_overhang: "Rear overhang",
  towbar: "Towbar",
};

export const EVIDENCE_LABELS: Record<string, string> = {
  photo: "Photo",
  certificate: "Certificate",
  weighbridge_ticket: "Weighbridge ticket",
  engineering_signoff: "Engineering sign-off",
};

export const OP_LABELS: Record<Criterion["op"], string> = {
  gte: "at least (≥)",
  lte: "at most (≤)",
  eq: "equals (=)",
  between: "between",
  one_of: "one of",
};

export const EDITION_STATUS_LABELS = { draft: "Draft", published: "Published", retired: "Retired" } as const;
export const EDITION_STATUS_TONES = { draft: "info", published: "ok", retired: "neutral" } as const;

/** Attributes the trade measures, offered as suggestions on the criteria rows. */
export const COMMON_ATTRIBUTES = [
  { attribute: "tyreSize", label: "Tyre size" },
  { attribute: "loadIndex", label: "Load index" },
  { attribute: "springRatingKg", label: "Spring rating", unit: "kg" },
  { attribute: "cableAreaMm2", label: "Conductor area", unit: "mm²" },
  { attribute: "fuseRatingA", label: "Fuse rating", unit: "A" },
  { attribute: "capacityAh", label: "Battery capacity", unit: "Ah" },
  { attribute: "liftMm", label: "Lift", unit: "mm" },
  { attribute: "ratedPullKg", label: "Rated line pull", unit: "kg" },
] as const;

function withUnit(value: unknown, unit?: string) {
  return unit ? `${String(value)} ${unit}` : String(value);
}

/** "≥ 121", "350–450 kg", "= LT265/75R16": what a criterion asks, without the attribute. */
export function requirementText(c: Pick<Criterion, "op" | "value" | "unit">): string {
  const list = Array.isArray(c.value) ? c.value : [c.value];
  switch (c.op) {
    case "gte":
      return `≥ ${withUnit(c.value, c.unit)}`;
    case "lte":
      return `≤ ${withUnit(c.value, c.unit)}`;
    case "eq":
      return `= ${withUnit(c.value, c.unit)}`;
    case "between":
      return `${list[0]}–${withUnit(list[1], c.unit)}`;
    case "one_of":
      return `one of ${list.join(", ")}${c.unit ? ` ${c.unit}` : ""}`;
  }
}

/** "Load index ≥ 121", "Spring rating 350–450 kg": a criterion in short words. */
export function criterionText(c: Pick<Criterion, "attribute" | "label" | "op" | "value" | "unit">): string {
  return `${c.label ?? c.attribute} ${requirementText(c)}`;
}

export const dollars = (cents: number) => (cents / 100).toLocaleString("en-AU", { style: "currency", currency: "AUD" });

