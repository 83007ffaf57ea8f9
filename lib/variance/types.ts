/**
 * Shapes of a fit-out edition, what is fitted to a vehicle, and the variance between them.
 * The database layer maps its rows to these; every module in variance, readiness and editions
 * works on them.
 */

export const LINE_CATEGORIES = [
  "tyres",
  "suspension",
  "steering_driveline",
  "protection",
  "recovery",
  "water_dust",
  "electrical",
  "communications",
  "storage",
  "lighting_roof",
  "safety",
  "engineering",
] as const;
export type LineCategory = (typeof LINE_CATEGORIES)[number];

export const REQUIREMENTS = ["must_fit", "may_fit", "must_not_fit"] as const;
export type Requirement = (typeof REQUIREMENTS)[number];

export const ZONES = ["front", "cab", "tub", "roof", "rear_overhang", "towbar"] as const;
export type Zone = (typeof ZONES)[number];

export const CRITERION_OPS = ["gte", "lte", "eq", "between", "one_of"] as const;
export type CriterionOp = (typeof CRITERION_OPS)[number];

/** A measurable acceptance criterion on one attribute of a fitment (e.g. loadIndex ≥ 116). */
export type Criterion = {
  attribute: string;
  label?: string;
  unit?: string;
  op: CriterionOp;
  value: number | string | (number | string)[];
};

export const EVIDENCE_KINDS = ["photo", "certificate", "weighbridge_ticket", "engineering_signoff"] as const;
export type EvidenceKind = (typeof EVIDENCE_KINDS)[number];

export const MASS_KINDS = ["constant", "variable"] as const;
export type MassKind = (typeof MASS_KINDS)[number];

export type EvidenceStatus = "lodged" | "accepted" | "rejected";

/** One line of an edition of a fit-out standard. */
export type EditionLine = {
  id: string;
  /** Stable across editions: the same requirement keeps its key when an edition is copied. */
  key: string;
  code: string;
  category: LineCategory;
  title: string;
  requirement: Requirement;
  quantity: number;
  massKg: number;
  /** Distance of the item's centre of mass behind the front axle; negative is ahead of it. */
  xMm: number | null;
  zone: Zone | null;
  massKind: MassKind;
  criteria: Criterion[];
  evidenceNeeded: EvidenceKind[];
  /** Standard cost of the whole line (all of its quantity), fitted. */
  standardCostCents: number;
  /** Ids of lines in the same edition that must be decided or fitted first. */
  dependsOn: string[];
  checkable: boolean;
  expiryMonths: number | null;
};

/** What is actually on a vehicle, linked to a line where it answers one. */
export type Fitment = {
  id: string;
  lineId: string | null;
  label: string;
  quantity: number;
  attributes: Record<string, number | string>;
  fittedAt: Date;
  removedAt: Date | null;
  evidence: { kind: EvidenceKind; status: EvidenceStatus }[];
  expiresAt: Date | null;
};

/** An approved, reasoned exception to one line, until it expires. */
export type Concession = { lineId: string; reason: string; expiresAt: Date; approvedBy: string };

/** Status of one line of a vehicle's variance (Rigline's own words). */
export type LineStatus =
  | "meets"
  | "short"
  | "off_spec"
  | "unproven"
  | "concession"
  | "prohibited_fitted"
  | "optional_absent";

/** A criterion a fitment fails, with the value found ("not recorded" when the attribute is missing). */
export type FailingCriterion = {
  criterion: Criterion;
  actual: number | string;
  fitmentId: string;
};

export type LineVariance = {
  lineId: string;
  key: string;
  code: string;
  title: string;
  category: LineCategory;
  requirement: Requirement;
  status: LineStatus;
  /** Set when at least one counted fitment fails a criterion (even when the line is also short). */
  failing?: FailingCriterion[] | undefined;
  /** Quantity of fitments that count: fitted, not removed, not expired. */
  fittedQuantity: number;
  /** Quantity the line demands: its quantity for must-fit, 0 for may-fit and must-not-fit. */
  requiredQuantity: number;
  /** Quantity still to fit when the line is short, else 0. */
  missingQuantity: number;
  /** Fitments on the vehicle for this line (including expired ones, excluding removed ones). */
  fitmentIds: readonly string[];
  /** Fitments for this line whose expiry has passed. */
  expiredFitmentIds: readonly string[];
  /** Evidence kinds the line needs that some unexpired fitment lacks an accepted piece of. */
  evidenceMissing?: EvidenceKind[] | undefined;
  /** The concession that covers the line, when status is "concession". */
  concession?: Concession | undefined;
  /** Latest expiry of a concession that has lapsed, when no current one covers the line. */
  concessionExpiredAt?: Date | undefined;
  massKg: number;
  standardCostCents: number;
};

export type VarianceSummary = {
  meets: number;
  short: number;
  offSpec: number;
  unproven: number;
  concession: number;
  prohibitedFitted: number;
  extra: number;
};

export type ExtraFitment = { fitmentId: string; label: string };

export type VehicleVariance = {
  /** Counts of lines by status; optional_absent lines are counted nowhere. */
  summary: VarianceSummary;
  lines: LineVariance[];
  extras: ExtraFitment[];
};

export type VehicleVarianceInput = {
  lines: readonly EditionLine[];
  fitments: readonly Fitment[];
  concessions: readonly Concession[];
  now: Date;
};

/** Whether a vehicle fully meets its edition, for filtering a fleet list. */
export type VehicleVarianceStatus = "meets_standard" | "gaps" | "no_edition";
