/**
 * Rigline's words for defects: severities, states and categories. Short, plain words a driver
 * reads at a glance; the codes are what the database stores.
 */

export const DEFECT_SEVERITIES = ["stop", "before_next_trip", "watch"] as const;
export type DefectSeverity = (typeof DEFECT_SEVERITIES)[number];

export const SEVERITY_LABELS: Record<DefectSeverity, string> = {
  stop: "Stop — do not drive",
  before_next_trip: "Before next trip",
  watch: "Watch",
};

/** One line under each severity, so the driver picks the right one. */
export const SEVERITY_HINTS: Record<DefectSeverity, string> = {
  stop: "Unsafe to drive. The vehicle is grounded now and the managers are e-mailed.",
  before_next_trip: "Safe to get home, but fix it before the vehicle goes out again.",
  watch: "Not urgent. Keep an eye on it at each check.",
};

/** Higher is more urgent (a merged report keeps the more urgent severity). */
export const SEVERITY_RANK: Record<DefectSeverity, number> = { stop: 3, before_next_trip: 2, watch: 1 };

export const DEFECT_STATES = ["reported", "triaged", "in_repair", "resolved", "closed", "merged"] as const;
export type DefectState = (typeof DEFECT_STATES)[number];

export const STATE_LABELS: Record<DefectState, string> = {
  reported: "Reported",
  triaged: "Triaged",
  in_repair: "In repair",
  resolved: "Resolved",
  closed: "Closed",
  merged: "Merged",
};

/** What the state means to the driver who reported it. */
export const STATE_HINTS: Record<DefectState, string> = {
  reported: "Sent. A manager has not looked at it yet.",
  triaged: "A manager has seen it and is deciding what to do.",
  in_repair: "A job is open to fix it.",
  resolved: "Fixed. Waiting for a manager to close it.",
  closed: "Closed.",
  merged: "Joined with another report of the same fault.",
};

/** States in which a defect still counts against the vehicle. */
export const OPEN_DEFECT_STATES = ["reported", "triaged", "in_repair"] as const satisfies readonly DefectState[];

export const DEFECT_CATEGORIES = [
  "tyres_wheels",
  "brakes",
  "steering_suspension",
  "engine_fluids",
  "lights_electrical",
  "body_glass",
  "recovery_gear",
  "safety_gear",
  "communications",
  "fit_out",
  "other",
] as const;
export type DefectCategory = (typeof DEFECT_CATEGORIES)[number];

export const CATEGORY_LABELS: Record<DefectCategory, string> = {
  tyres_wheels: "Tyres and wheels",
  brakes: "Brakes",
  steering_suspension: "Steering and suspension",
  engine_fluids: "Engine and fluids",
  lights_electrical: "Lights and electrical",
  body_glass: "Body and glass",
  recovery_gear: "Recovery gear",
  safety_gear: "Safety gear",
  communications: "Radio and comms",
  fit_out: "Fit-out gear",
  other: "Other",
};

export function isSeverity(value: unknown): value is DefectSeverity {
  return typeof value === "string" && (DEFECT_SEVERITIES as readonly string[]).includes(value);
}

export function isDefectState(value: unknown): value is DefectState {
  return typeof value === "string" && (DEFECT_STATES as readonly string[]).includes(value);
}

export function isCategory(value: unknown): value is DefectCategory {
  return typeof value === "string" && (DEFECT_CATEGORIES as readonly string[]).includes(value);
}

/** The label of a stored category; categories from elsewhere (API, older data) show as given. */
export function categoryLabel(value: string): string {
  return isCategory(value) ? CATEGORY_LABELS[value] : value;
}

/** A short title for lists and readiness reasons: "Brakes: pedal goes soft after…". */
export function defectTitle(category: string, description: string, maxChars = 60): string {
  const text = description.trim().replace(/\s+/g, " ");
  const cut = text.length > maxChars ? `${text.slice(0, maxChars - 1).trimEnd()}…` : text;
  return cut ? `${categoryLabel(category)}: ${cut}` : categoryLabel(category);
}
