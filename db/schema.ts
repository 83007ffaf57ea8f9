/**
 * Rigline's data model: one SQLite/libSQL database, every row owned by one organisation
 * (`orgId`), money in integer cents, masses in kilograms and lengths in millimetres with the unit
 * in the column name, timestamps as real timestamps (milliseconds since the epoch).
 */
import { sql } from "drizzle-orm";
import {
  index,
  integer,
  primaryKey,
  real,
  sqliteTable,
  text,
  uniqueIndex,
  type AnySQLiteColumn,
} from "drizzle-orm/sqlite-core";
import { DEFECT_SEVERITIES, DEFECT_STATES } from "@/lib/defects/vocabulary";
import type { ElectricalPlan } from "@/lib/electrical/plan";
import { COST_KINDS, COST_SOURCES } from "@/lib/exports/labels";
import { RECORDED_DECISIONS } from "@/lib/jobs/decisions";
import { GST_METHODS } from "@/lib/money/quote";
import { EVIDENCE_STATES } from "@/lib/jobs/evidence-states";
import { JOB_STATES } from "@/lib/jobs/job-states";
import { QUOTE_STATES } from "@/lib/jobs/quote-states";
import { ROLES } from "@/lib/permissions/roles";
import { VEHICLE_STATES, type VehicleState } from "@/lib/readiness/readiness";
import { EVIDENCE_KINDS, LINE_CATEGORIES, MASS_KINDS, REQUIREMENTS, ZONES } from "@/lib/variance/types";

// The value lists live in the pure modules (one source of truth); re-exported for the data layer.
export { DEFECT_SEVERITIES, DEFECT_STATES, EVIDENCE_KINDS, JOB_STATES, LINE_CATEGORIES, QUOTE_STATES, REQUIREMENTS, VEHICLE_STATES, ZONES };
export type { VehicleState };

const id = () =>
  text("id")
    .primaryKey()
    .$defaultFn(() => crypto.randomUUID());
const createdAt = () =>
  integer("created_at", { mode: "timestamp_ms" })
    .notNull()
    .$defaultFn(() => new Date());
const updatedAt = () =>
  integer("updated_at", { mode: "timestamp_ms" })
    .notNull()
    .$defaultFn(() => new Date())
    .$onUpdateFn(() => new Date());
const orgRef = () =>
  text("org_id")
    .notNull()
    .references(() => organisations.id, { onDelete: "cascade" });
const json = <T>(name: string) => text(name, { mode: "json" }).$type<T>();


// ─── Organisation, people, sign-in ─────────────────────────────────────────────

export const organisations = sqliteTable("organisations", {
  id: id(),
  name: text("name").notNull(),
  slug: text("slug").notNull().unique(),
  /** Quotes above this total (incl. GST) also need a finance approval. */
  approvalThresholdCents: integer("approval_threshold_cents").notNull().default(500_000),
  ruleSetId: text("rule_set_id"),
  personMassKg: real("person_mass_kg").notNull().default(80),
  brakeWarningMarginKg: real("brake_warning_margin_kg").notNull().default(500),
  springSoftMarginKg: real("spring_soft_margin_kg").notNull().default(0),
  springStiffMarginKg: real("spring_stiff_margin_kg").notNull().default(500),
  weighbridgeToleranceKg: real("weighbridge_tolerance_kg").notNull().default(50),
  gstMethod: text("gst_method", { enum: GST_METHODS })
    .notNull()
    .default("per-line"),
  /** IANA time zone the organisation's instants are shown in (lib/format/dates.ts). */
  timeZone: text("time_zone").notNull().default("Australia/Adelaide"),
  createdAt: createdAt(),
});

export const users = sqliteTable("users", {
  id: id(),
  email: text("email").notNull().unique(),
  name: text("name").notNull(),
  passwordHash: text("password_hash"),
  /** Raised to end every session of the user at once (password change, deactivation). */
  sessionVersion: integer("session_version").notNull().default(1),
  notifyNonEssential: integer("notify_non_essential", { mode: "boolean" }).notNull().default(true),
  lastSignInAt: integer("last_sign_in_at", { mode: "timestamp_ms" }),
  createdAt: createdAt(),
});

export const memberships = sqliteTable(
  "memberships",
  {
    id: id(),
    orgId: orgRef(),
    userId: text("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    role: text("role", { enum: ROLES }).notNull(),
    active: integer("active", { mode: "boolean" }).notNull().default(true),
    /** The contractor firm a contractor user works for. */
    firmId: text("firm_id").references(() => contractorFirms.id, { onDelete: "set null" }),
    /** A driver's home depot. */
    depotId: text("depot_id").references(() => depots.id, { onDelete: "set null" }),
    createdAt: createdAt(),
  },
  (t) => [
    uniqueIndex("memberships_org_user").on(t.orgId, t.userId),
    index("memberships_user").on(t.userId),
  ],
);

/** Single-use, expiring links: invitations and password resets. Only the hash is stored. */
export const passwordTokens = sqliteTable(
  "password_tokens",
  {
    id: id(),
    userId: text("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    purpose: text("purpose", { enum: ["invite", "reset"] }).notNull(),
    tokenHash: text("token_hash").notNull().unique(),
    expiresAt: integer("expires_at", { mode: "timestamp_ms" }).notNull(),
    usedAt: integer("used_at", { mode: "timestamp_ms" }),
    createdAt: createdAt(),
  },
  (t) => [index("password_tokens_user").on(t.userId)],
);

/** Fixed-window counters for rate limits (sign-in per e-mail and per client). */
export const rateLimits = sqliteTable("rate_limits", {
  key: text("key").primaryKey(),
  count: integer("count").notNull(),
  resetAt: integer("reset_at", { mode: "timestamp_ms" }).notNull(),
});

export const apiTokens = sqliteTable(
  "api_tokens",
  {
    id: id(),
    orgId: orgRef(),
    userId: text("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    prefix: text("prefix").notNull(),
    tokenHash: text("token_hash").notNull().unique(),
    lastUsedAt: integer("last_used_at", { mode: "timestamp_ms" }),
    revokedAt: integer("revoked_at", { mode: "timestamp_ms" }),
    createdAt: createdAt(),
  },
  (t) => [index("api_tokens_user").on(t.userId)],
);

export const depots = sqliteTable(
  "depots",
  {
    id: id(),
    orgId: orgRef(),
    name: text("name").notNull(),
    code: text("code").notNull(),
    region: text("region"),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("depots_org_code").on(t.orgId, t.code)],
);

export const contractorFirms = sqliteTable(
  "contractor_firms",
  {
    id: id(),
    orgId: orgRef(),
    name: text("name").notNull(),
    abn: text("abn"),
    email: text("email").notNull(),
    phone: text("phone"),
    active: integer("active", { mode: "boolean" }).notNull().default(true),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("firms_org_name").on(t.orgId, t.name)],
);

/** Jurisdiction rule sets: shipped examples have orgId null; an admin's edited copy has one. */
export const ruleSets = sqliteTable("rule_sets", {
  id: id(),
  orgId: text("org_id").references(() => organisations.id, { onDelete: "cascade" }),
  name: text("name").notNull(),
  exampleOnly: integer("example_only", { mode: "boolean" }).notNull().default(true),
  limits: json<Record<string, unknown>>("limits").notNull(),
  createdAt: createdAt(),
});

// ─── Fleet register ─────────────────────────────────────────────────────────────

export const platforms = sqliteTable(
  "platforms",
  {
    id: id(),
    orgId: orgRef(),
    make: text("make").notNull(),
    model: text("model").notNull(),
    variant: text("variant").notNull().default(""),
    kerbMassKg: real("kerb_mass_kg"),
    gvmKg: real("gvm_kg"),
    gcmKg: real("gcm_kg"),
    frontAxleRatingKg: real("front_axle_rating_kg"),
    rearAxleRatingKg: real("rear_axle_rating_kg"),
    kerbFrontKg: real("kerb_front_kg"),
    wheelbaseMm: real("wheelbase_mm"),
    rearOverhangMm: real("rear_overhang_mm"),
    towingCapacityKg: real("towing_capacity_kg"),
    towballLimitKg: real("towball_limit_kg"),
    roofStaticKg: real("roof_static_kg"),
    roofDynamicKg: real("roof_dynamic_kg"),
    standardTyreSize: text("standard_tyre_size"),
    fuelCapacityL: real("fuel_capacity_l"),
    topSpeedKmh: real("top_speed_kmh"),
    /** Created from an import row: the maker's figures still need to be entered. */
    ratingsMissing: integer("ratings_missing", { mode: "boolean" }).notNull().default(false),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [uniqueIndex("platforms_org_name").on(t.orgId, t.make, t.model, t.variant)],
);

export const vehicles = sqliteTable(
  "vehicles",
  {
    id: id(),
    orgId: orgRef(),
    fleetNumber: text("fleet_number").notNull(),
    vin: text("vin"),
    registration: text("registration"),
    registrationExpiry: integer("registration_expiry", { mode: "timestamp_ms" }),
    platformId: text("platform_id")
      .notNull()
      .references(() => platforms.id),
    depotId: text("depot_id").references(() => depots.id, { onDelete: "set null" }),
    costCentre: text("cost_centre"),
    editionId: text("edition_id").references((): AnySQLiteColumn => editions.id, {
      onDelete: "set null",
    }),
    state: text("state", { enum: VEHICLE_STATES }).notNull().default("in_service"),
    groundedReason: text("grounded_reason"),
    odometerKm: integer("odometer_km"),
    buildYear: integer("build_year"),
    measuredFrontKg: real("measured_front_kg"),
    measuredRearKg: real("measured_rear_kg"),
    measuredGrossKg: real("measured_gross_kg"),
    measuredAt: integer("measured_at", { mode: "timestamp_ms" }),
    notes: text("notes"),
    version: integer("version").notNull().default(1),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [
    uniqueIndex("vehicles_org_fleet_number").on(t.orgId, t.fleetNumber),
    uniqueIndex("vehicles_org_vin").on(t.orgId, t.vin),
    index("vehicles_org_depot").on(t.orgId, t.depotId),
    index("vehicles_org_platform").on(t.orgId, t.platformId),
    index("vehicles_org_state").on(t.orgId, t.state),
    // "These few vehicles of this organisation" (org_id = ? and id in (…), as the variance
    // badges of a register page ask): vehicles_org_id answers it directly; where SQLite prefers
    // to walk the organisation by edition or by fleet number instead, the trailing id lets it
    // filter inside the index rather than read every vehicle row of the organisation.
    index("vehicles_org_edition").on(t.orgId, t.editionId, t.id),
    index("vehicles_org_registration").on(t.orgId, t.registration),
    index("vehicles_org_id").on(t.orgId, t.id),
    index("vehicles_org_fleet_number_id").on(t.orgId, t.fleetNumber, t.id),
  ],
);

export const vehicleDrivers = sqliteTable(
  "vehicle_drivers",
  {
    vehicleId: text("vehicle_id")
      .notNull()
      .references(() => vehicles.id, { onDelete: "cascade" }),
    userId: text("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
  },
  (t) => [primaryKey({ columns: [t.vehicleId, t.userId] }), index("vehicle_drivers_user").on(t.userId)],
);

// ─── Standards ──────────────────────────────────────────────────────────────────

export const standards = sqliteTable(
  "standards",
  {
    id: id(),
    orgId: orgRef(),
    name: text("name").notNull(),
    description: text("description"),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("standards_org_name").on(t.orgId, t.name)],
);

export const EDITION_STATES = ["draft", "published", "retired"] as const;

export const editions = sqliteTable(
  "editions",
  {
    id: id(),
    orgId: orgRef(),
    standardId: text("standard_id")
      .notNull()
      .references(() => standards.id, { onDelete: "cascade" }),
    number: integer("number").notNull(),
    status: text("status", { enum: EDITION_STATES }).notNull().default("draft"),
    notes: text("notes"),
    copiedFromId: text("copied_from_id"),
    publishedAt: integer("published_at", { mode: "timestamp_ms" }),
    publishedBy: text("published_by").references(() => users.id),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("editions_standard_number").on(t.standardId, t.number)],
);


export type CriterionRow = {
  attribute: string;
  label?: string;
  unit?: string;
  op: "gte" | "lte" | "eq" | "between" | "one_of";
  value: number | string | (number | string)[];
};

export const editionLines = sqliteTable(
  "edition_lines",
  {
    id: id(),
    orgId: orgRef(),
    editionId: text("edition_id")
      .notNull()
      .references(() => editions.id, { onDelete: "cascade" }),
    /** Stable identity of a line across editions (compare, roll-out). */
    key: text("key").notNull(),
    code: text("code").notNull(),
    category: text("category", { enum: LINE_CATEGORIES }).notNull(),
    title: text("title").notNull(),
    requirement: text("requirement", { enum: REQUIREMENTS }).notNull(),
    quantity: integer("quantity").notNull().default(1),
    massKg: real("mass_kg").notNull().default(0),
    xMm: real("x_mm"),
    zone: text("zone", { enum: ZONES }),
    massKind: text("mass_kind", { enum: MASS_KINDS })
      .notNull()
      .default("constant"),
    criteria: json<CriterionRow[]>("criteria").notNull().default(sql`'[]'`),
    evidenceNeeded: json<(typeof EVIDENCE_KINDS)[number][]>("evidence_needed")
      .notNull()
      .default(sql`'[]'`),
    standardCostCents: integer("standard_cost_cents").notNull().default(0),
    checkable: integer("checkable", { mode: "boolean" }).notNull().default(false),
    expiryMonths: integer("expiry_months"),
    sortOrder: integer("sort_order").notNull().default(0),
  },
  (t) => [
    index("edition_lines_edition").on(t.editionId, t.sortOrder),
    uniqueIndex("edition_lines_edition_code").on(t.editionId, t.code),
  ],
);

export const lineDependencies = sqliteTable(
  "line_dependencies",
  {
    lineId: text("line_id")
      .notNull()
      .references(() => editionLines.id, { onDelete: "cascade" }),
    dependsOnLineId: text("depends_on_line_id")
      .notNull()
      .references(() => editionLines.id, { onDelete: "cascade" }),
  },
  (t) => [primaryKey({ columns: [t.lineId, t.dependsOnLineId] })],
);

export const fitments = sqliteTable(
  "fitments",
  {
    id: id(),
    orgId: orgRef(),
    vehicleId: text("vehicle_id")
      .notNull()
      .references(() => vehicles.id, { onDelete: "cascade" }),
    /** The edition line this answers (by key, so it survives a new edition); null = extra. */
    lineKey: text("line_key"),
    label: text("label").notNull(),
    quantity: integer("quantity").notNull().default(1),
    attributes: json<Record<string, number | string>>("attributes").notNull().default(sql`'{}'`),
    massKg: real("mass_kg"),
    xMm: real("x_mm"),
    zone: text("zone", { enum: ZONES }),
    massKind: text("mass_kind", { enum: MASS_KINDS }),
    fittedAt: integer("fitted_at", { mode: "timestamp_ms" }).notNull(),
    removedAt: integer("removed_at", { mode: "timestamp_ms" }),
    expiresAt: integer("expires_at", { mode: "timestamp_ms" }),
    recordedBy: text("recorded_by").references(() => users.id),
    createdAt: createdAt(),
  },
  (t) => [index("fitments_vehicle").on(t.vehicleId), index("fitments_org").on(t.orgId)],
);

export const concessions = sqliteTable(
  "concessions",
  {
    id: id(),
    orgId: orgRef(),
    vehicleId: text("vehicle_id")
      .notNull()
      .references(() => vehicles.id, { onDelete: "cascade" }),
    lineKey: text("line_key").notNull(),
    reason: text("reason").notNull(),
    expiresAt: integer("expires_at", { mode: "timestamp_ms" }).notNull(),
    approvedBy: text("approved_by")
      .notNull()
      .references(() => users.id),
    createdAt: createdAt(),
  },
  (t) => [index("concessions_vehicle").on(t.vehicleId)],
);

/**
 * Each vehicle's variance figures as last judged (db/variance-summary.ts), so the fleet view
 * reads one row per vehicle instead of every fitment. A cache, never the truth: the triggers of
 * migration `variance_summary_triggers` delete a vehicle's row whenever anything the judgement
 * reads changes, and a row is used only while `computedAt <= now < validUntil` (`validUntil` =
 * the next instant at which time alone changes the judgement: a fitment fitted, removed or
 * expiring, a concession lapsing; null when nothing is due). A row with a null status is a
 * refresh's claim, not yet judged.
 */
export const vehicleVarianceSummaries = sqliteTable(
  "vehicle_variance_summaries",
  {
    vehicleId: text("vehicle_id")
      .primaryKey()
      .references(() => vehicles.id, { onDelete: "cascade" }),
    orgId: orgRef(),
    /** The edition the figures were judged against. */
    editionId: text("edition_id")
      .notNull()
      .references(() => editions.id, { onDelete: "cascade" }),
    status: text("status", { enum: ["meets_standard", "gaps"] }),
    meets: integer("meets").notNull().default(0),
    short: integer("short").notNull().default(0),
    offSpec: integer("off_spec").notNull().default(0),
    unproven: integer("unproven").notNull().default(0),
    concession: integer("concession").notNull().default(0),
    prohibitedFitted: integer("prohibited_fitted").notNull().default(0),
    extra: integer("extra").notNull().default(0),
    costToCloseCents: integer("cost_to_close_cents").notNull().default(0),
    /** Mass to close, in whole grams (the fleet figures are reported to the gram). */
    massToCloseG: integer("mass_to_close_g").notNull().default(0),
    /** Short or off-spec lines in the critical categories (trip readiness in brief, lib/readiness/brief.ts). */
    criticalGaps: integer("critical_gaps").notNull().default(0),
    /** The earliest expiry among the vehicle's fitments (own date, else its line's expiry in months). */
    earliestExpiryAt: integer("earliest_expiry_at", { mode: "timestamp_ms" }),
    /** The instant the figures were judged at. */
    computedAt: integer("computed_at", { mode: "timestamp_ms" }).notNull(),
    validUntil: integer("valid_until", { mode: "timestamp_ms" }),
    /** The refresh that claimed the row (it writes its figures only while its claim stands). */
    claim: text("claim"),
    /** The version of the judgement's rules the figures were made by (SUMMARY_RULES_VERSION). */
    rulesVersion: integer("rules_version").notNull().default(0),
  },
  (t) => [index("vehicle_variance_summaries_org").on(t.orgId), index("vehicle_variance_summaries_edition").on(t.editionId)],
);

/**
 * One row: a number raised by triggers (migration 0007) whenever anything the vehicle register
 * shows changes, so a register page computed at one revision is known current while it holds.
 */
export const registerRevision = sqliteTable("register_revision", {
  id: integer("id").primaryKey(),
  revision: integer("revision").notNull().default(0),
});

/** What-if items: planned but not fitted, shown in the mass planner before anything is bought. */
export const plannedItems = sqliteTable(
  "planned_items",
  {
    id: id(),
    orgId: orgRef(),
    vehicleId: text("vehicle_id")
      .notNull()
      .references(() => vehicles.id, { onDelete: "cascade" }),
    label: text("label").notNull(),
    massKg: real("mass_kg").notNull(),
    xMm: real("x_mm"),
    zone: text("zone", { enum: ZONES }),
    massKind: text("mass_kind", { enum: MASS_KINDS })
      .notNull()
      .default("constant"),
    createdBy: text("created_by").references(() => users.id),
    createdAt: createdAt(),
  },
  (t) => [index("planned_items_vehicle").on(t.vehicleId)],
);

/**
 * The vehicle's current 12 V plan, one per vehicle: the inputs (consumers, days of autonomy,
 * chemistry, charging sources, cable runs) as one JSON document validated by
 * `electricalPlanSchema` (lib/electrical/plan.ts) on every save and load. Results are not
 * stored: they are recomputed from the inputs, so a change to a calculator never leaves a
 * stale figure. `version` counts saves.
 */
export const electricalPlans = sqliteTable(
  "electrical_plans",
  {
    id: id(),
    orgId: orgRef(),
    vehicleId: text("vehicle_id")
      .notNull()
      .references(() => vehicles.id, { onDelete: "cascade" }),
    plan: json<ElectricalPlan>("plan").notNull(),
    version: integer("version").notNull().default(1),
    updatedBy: text("updated_by").references(() => users.id),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [uniqueIndex("electrical_plans_vehicle").on(t.vehicleId), index("electrical_plans_org").on(t.orgId)],
);

export const weighbridgeTickets = sqliteTable(
  "weighbridge_tickets",
  {
    id: id(),
    orgId: orgRef(),
    vehicleId: text("vehicle_id")
      .notNull()
      .references(() => vehicles.id, { onDelete: "cascade" }),
    jobId: text("job_id").references((): AnySQLiteColumn => jobs.id, { onDelete: "set null" }),
    ticketNumber: text("ticket_number").notNull(),
    weighedAt: integer("weighed_at", { mode: "timestamp_ms" }).notNull(),
    frontKg: real("front_kg").notNull(),
    rearKg: real("rear_kg").notNull(),
    grossKg: real("gross_kg").notNull(),
    evidenceId: text("evidence_id"),
    recordedBy: text("recorded_by").references(() => users.id),
    createdAt: createdAt(),
  },
  (t) => [index("weighbridge_vehicle").on(t.vehicleId, t.weighedAt)],
);

// ─── Jobs, quotes, decisions ───────────────────────────────────────────────────


export const jobs = sqliteTable(
  "jobs",
  {
    id: id(),
    orgId: orgRef(),
    number: integer("number").notNull(),
    vehicleId: text("vehicle_id")
      .notNull()
      .references(() => vehicles.id),
    title: text("title").notNull(),
    state: text("state", { enum: JOB_STATES }).notNull().default("open"),
    dueAt: integer("due_at", { mode: "timestamp_ms" }),
    costKind: text("cost_kind", { enum: COST_KINDS })
      .notNull()
      .default("capital"),
    awardedFirmId: text("awarded_firm_id").references(() => contractorFirms.id),
    cancelReason: text("cancel_reason"),
    createdBy: text("created_by").references(() => users.id),
    version: integer("version").notNull().default(1),
    signedOffAt: integer("signed_off_at", { mode: "timestamp_ms" }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [
    uniqueIndex("jobs_org_number").on(t.orgId, t.number),
    index("jobs_org_state").on(t.orgId, t.state),
    index("jobs_vehicle").on(t.vehicleId),
  ],
);

export const jobLines = sqliteTable(
  "job_lines",
  {
    id: id(),
    jobId: text("job_id")
      .notNull()
      .references(() => jobs.id, { onDelete: "cascade" }),
    lineKey: text("line_key"),
    description: text("description").notNull(),
    sortOrder: integer("sort_order").notNull().default(0),
  },
  (t) => [index("job_lines_job").on(t.jobId)],
);

export const jobOffers = sqliteTable(
  "job_offers",
  {
    jobId: text("job_id")
      .notNull()
      .references(() => jobs.id, { onDelete: "cascade" }),
    firmId: text("firm_id")
      .notNull()
      .references(() => contractorFirms.id),
    dueAt: integer("due_at", { mode: "timestamp_ms" }),
    offeredAt: createdAt(),
  },
  (t) => [primaryKey({ columns: [t.jobId, t.firmId] }), index("job_offers_firm").on(t.firmId)],
);


export const quotes = sqliteTable(
  "quotes",
  {
    id: id(),
    orgId: orgRef(),
    jobId: text("job_id")
      .notNull()
      .references(() => jobs.id, { onDelete: "cascade" }),
    firmId: text("firm_id")
      .notNull()
      .references(() => contractorFirms.id),
    revision: integer("revision").notNull().default(1),
    status: text("status", { enum: QUOTE_STATES }).notNull().default("draft"),
    validUntil: integer("valid_until", { mode: "timestamp_ms" }),
    notes: text("notes"),
    gstMethod: text("gst_method", { enum: GST_METHODS })
      .notNull()
      .default("per-line"),
    subtotalCents: integer("subtotal_cents").notNull().default(0),
    gstCents: integer("gst_cents").notNull().default(0),
    totalCents: integer("total_cents").notNull().default(0),
    submittedBy: text("submitted_by").references(() => users.id),
    submittedAt: integer("submitted_at", { mode: "timestamp_ms" }),
    /** Optimistic concurrency: every decision names the version it saw. */
    version: integer("version").notNull().default(1),
    createdBy: text("created_by").references(() => users.id),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index("quotes_job").on(t.jobId), index("quotes_org_status").on(t.orgId, t.status)],
);

export const quoteLines = sqliteTable(
  "quote_lines",
  {
    id: id(),
    quoteId: text("quote_id")
      .notNull()
      .references(() => quotes.id, { onDelete: "cascade" }),
    kind: text("kind", { enum: ["part", "labour", "other"] }).notNull(),
    description: text("description").notNull(),
    quantity: real("quantity").notNull().default(1),
    unitPriceCents: integer("unit_price_cents").notNull().default(0),
    hours: real("hours"),
    rateCents: integer("rate_cents"),
    taxable: integer("taxable", { mode: "boolean" }).notNull().default(true),
    lineKey: text("line_key"),
    amountCents: integer("amount_cents").notNull().default(0),
    gstCents: integer("gst_cents").notNull().default(0),
    sortOrder: integer("sort_order").notNull().default(0),
  },
  (t) => [index("quote_lines_quote").on(t.quoteId)],
);

/** Past revisions of a quote, kept as snapshots when the contractor revises. */
export const quoteRevisions = sqliteTable(
  "quote_revisions",
  {
    id: id(),
    quoteId: text("quote_id")
      .notNull()
      .references(() => quotes.id, { onDelete: "cascade" }),
    revision: integer("revision").notNull(),
    snapshot: json<Record<string, unknown>>("snapshot").notNull(),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("quote_revisions_quote_rev").on(t.quoteId, t.revision)],
);

export const decisions = sqliteTable(
  "decisions",
  {
    id: id(),
    orgId: orgRef(),
    quoteId: text("quote_id")
      .notNull()
      .references(() => quotes.id, { onDelete: "cascade" }),
    decision: text("decision", { enum: RECORDED_DECISIONS }).notNull(),
    reason: text("reason"),
    quoteVersion: integer("quote_version").notNull(),
    decidedBy: text("decided_by")
      .notNull()
      .references(() => users.id),
    decidedAt: createdAt(),
  },
  (t) => [
    index("decisions_quote").on(t.quoteId),
    // Exactly-once: one decision per quote version.
    uniqueIndex("decisions_quote_version").on(t.quoteId, t.quoteVersion),
  ],
);

// ─── Evidence, defects, checks ─────────────────────────────────────────────────

export const evidence = sqliteTable(
  "evidence",
  {
    id: id(),
    orgId: orgRef(),
    jobId: text("job_id").references(() => jobs.id, { onDelete: "cascade" }),
    defectId: text("defect_id").references((): AnySQLiteColumn => defects.id, {
      onDelete: "cascade",
    }),
    checkId: text("check_id"),
    fitmentId: text("fitment_id").references(() => fitments.id, { onDelete: "set null" }),
    lineKey: text("line_key"),
    kind: text("kind", { enum: EVIDENCE_KINDS }).notNull(),
    status: text("status", { enum: EVIDENCE_STATES })
      .notNull()
      .default("lodged"),
    filename: text("filename").notNull(),
    contentType: text("content_type").notNull(),
    sizeBytes: integer("size_bytes").notNull(),
    sha256: text("sha256").notNull(),
    storageKey: text("storage_key").notNull(),
    uploadedBy: text("uploaded_by").references(() => users.id),
    reviewedBy: text("reviewed_by").references(() => users.id),
    reviewedAt: integer("reviewed_at", { mode: "timestamp_ms" }),
    reviewReason: text("review_reason"),
    createdAt: createdAt(),
  },
  (t) => [index("evidence_job").on(t.jobId), index("evidence_defect").on(t.defectId)],
);


export const defects = sqliteTable(
  "defects",
  {
    id: id(),
    orgId: orgRef(),
    vehicleId: text("vehicle_id")
      .notNull()
      .references(() => vehicles.id, { onDelete: "cascade" }),
    /** Generated on the device, so a retried offline report never creates a duplicate. */
    clientId: text("client_id").notNull(),
    reportedBy: text("reported_by").references(() => users.id),
    severity: text("severity", { enum: DEFECT_SEVERITIES }).notNull(),
    category: text("category").notNull(),
    description: text("description").notNull(),
    odometerKm: integer("odometer_km"),
    latitude: real("latitude"),
    longitude: real("longitude"),
    state: text("state", { enum: DEFECT_STATES }).notNull().default("reported"),
    jobId: text("job_id").references(() => jobs.id, { onDelete: "set null" }),
    mergedIntoId: text("merged_into_id"),
    closeReason: text("close_reason"),
    version: integer("version").notNull().default(1),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [
    uniqueIndex("defects_org_client").on(t.orgId, t.clientId),
    index("defects_vehicle").on(t.vehicleId, t.state),
    index("defects_org_state").on(t.orgId, t.state),
  ],
);

export const preTripChecks = sqliteTable(
  "pre_trip_checks",
  {
    id: id(),
    orgId: orgRef(),
    vehicleId: text("vehicle_id")
      .notNull()
      .references(() => vehicles.id, { onDelete: "cascade" }),
    driverId: text("driver_id")
      .notNull()
      .references(() => users.id),
    clientId: text("client_id").notNull(),
    /**
     * The answers in checklist order. `key` names the checklist item ("general.tyres",
     * "line.<line key>"); photos of an item are evidence rows with this check's id, listed in
     * `photoIds`; `defectClientId` is the device id of a defect raised from the item.
     */
    items: json<
      {
        key?: string;
        label: string;
        lineKey?: string;
        result: "pass" | "fail" | "na";
        note?: string;
        photoIds?: string[];
        defectClientId?: string;
      }[]
    >("items").notNull(),
    completedAt: integer("completed_at", { mode: "timestamp_ms" }).notNull(),
    createdAt: createdAt(),
  },
  (t) => [
    uniqueIndex("checks_org_client").on(t.orgId, t.clientId),
    index("checks_vehicle").on(t.vehicleId, t.completedAt),
  ],
);

// ─── Money ──────────────────────────────────────────────────────────────────────

export const costs = sqliteTable(
  "costs",
  {
    id: id(),
    orgId: orgRef(),
    vehicleId: text("vehicle_id").references(() => vehicles.id, { onDelete: "set null" }),
    costCentre: text("cost_centre").notNull(),
    depotId: text("depot_id").references(() => depots.id, { onDelete: "set null" }),
    category: text("category", { enum: LINE_CATEGORIES }).notNull(),
    kind: text("kind", { enum: COST_KINDS }).notNull(),
    amountExGstCents: integer("amount_ex_gst_cents").notNull(),
    gstCents: integer("gst_cents").notNull(),
    incurredOn: integer("incurred_on", { mode: "timestamp_ms" }).notNull(),
    source: text("source", { enum: COST_SOURCES }).notNull(),
    jobId: text("job_id").references(() => jobs.id, { onDelete: "set null" }),
    /** One booking per accepted quote, enforced by the database. */
    quoteId: text("quote_id")
      .unique()
      .references(() => quotes.id, { onDelete: "set null" }),
    reference: text("reference"),
    description: text("description").notNull(),
    createdBy: text("created_by").references(() => users.id),
    createdAt: createdAt(),
  },
  (t) => [
    index("costs_org_incurred").on(t.orgId, t.incurredOn),
    index("costs_org_centre").on(t.orgId, t.costCentre),
    index("costs_vehicle").on(t.vehicleId),
  ],
);

export const budgets = sqliteTable(
  "budgets",
  {
    id: id(),
    orgId: orgRef(),
    costCentre: text("cost_centre").notNull(),
    periodStart: integer("period_start", { mode: "timestamp_ms" }).notNull(),
    periodEnd: integer("period_end", { mode: "timestamp_ms" }).notNull(),
    amountCents: integer("amount_cents").notNull(),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("budgets_org_centre_period").on(t.orgId, t.costCentre, t.periodStart)],
);

// ─── Records of what happened ──────────────────────────────────────────────────

export const auditEntries = sqliteTable(
  "audit_entries",
  {
    id: id(),
    orgId: orgRef(),
    actorId: text("actor_id").references(() => users.id, { onDelete: "set null" }),
    action: text("action").notNull(),
    entityType: text("entity_type").notNull(),
    entityId: text("entity_id"),
    before: json<unknown>("before"),
    after: json<unknown>("after"),
    reason: text("reason"),
    at: createdAt(),
  },
  (t) => [
    index("audit_org_at").on(t.orgId, t.at),
    index("audit_entity").on(t.entityType, t.entityId),
  ],
);

export const OUTBOX_STATES = ["pending", "sent", "dead"] as const;

export const outboxMessages = sqliteTable(
  "outbox_messages",
  {
    id: id(),
    orgId: text("org_id").references(() => organisations.id, { onDelete: "cascade" }),
    toAddress: text("to_address").notNull(),
    subject: text("subject").notNull(),
    textBody: text("text_body").notNull(),
    htmlBody: text("html_body").notNull(),
    kind: text("kind").notNull(),
    status: text("status", { enum: OUTBOX_STATES }).notNull().default("pending"),
    attempts: integer("attempts").notNull().default(0),
    nextAttemptAt: integer("next_attempt_at", { mode: "timestamp_ms" })
      .notNull()
      .$defaultFn(() => new Date()),
    lastError: text("last_error"),
    /** Set while one sender holds the message, so two senders never deliver it twice. */
    lockedUntil: integer("locked_until", { mode: "timestamp_ms" }),
    sentAt: integer("sent_at", { mode: "timestamp_ms" }),
    createdAt: createdAt(),
  },
  (t) => [
    index("outbox_due").on(t.status, t.nextAttemptAt),
    index("outbox_org_created").on(t.orgId, t.createdAt),
  ],
);

export const imports = sqliteTable(
  "imports",
  {
    id: id(),
    orgId: orgRef(),
    filename: text("filename").notNull(),
    format: text("format", { enum: ["csv", "xlsx"] }).notNull(),
    storageKey: text("storage_key"),
    sha256: text("sha256").notNull(),
    sizeBytes: integer("size_bytes").notNull(),
    dryRun: integer("dry_run", { mode: "boolean" }).notNull(),
    totalRows: integer("total_rows").notNull(),
    created: integer("created").notNull().default(0),
    updated: integer("updated").notNull().default(0),
    unchanged: integer("unchanged").notNull().default(0),
    errorCount: integer("error_count").notNull().default(0),
    errors: json<{ row: number; column: string; message: string }[]>("errors")
      .notNull()
      .default(sql`'[]'`),
    mapping: json<Record<string, string | null>>("mapping"),
    createdBy: text("created_by").references(() => users.id),
    createdAt: createdAt(),
  },
  (t) => [index("imports_org_created").on(t.orgId, t.createdAt)],
);

export const importMappings = sqliteTable(
  "import_mappings",
  {
    id: id(),
    orgId: orgRef(),
    /** The header row the mapping was made for, normalised; next upload of the same shape reuses it. */
    headerSignature: text("header_signature").notNull(),
    mapping: json<Record<string, string | null>>("mapping").notNull(),
    updatedAt: updatedAt(),
  },
  (t) => [uniqueIndex("import_mappings_org_sig").on(t.orgId, t.headerSignature)],
);

/** Daily fleet figures for the charts of readiness and variance over time. */
export const fleetSnapshots = sqliteTable(
  "fleet_snapshots",
  {
    orgId: orgRef(),
    day: text("day").notNull(),
    ready: integer("ready").notNull(),
    limited: integer("limited").notNull(),
    notReady: integer("not_ready").notNull(),
    meetingStandard: integer("meeting_standard").notNull(),
    openGaps: integer("open_gaps").notNull(),
  },
  (t) => [primaryKey({ columns: [t.orgId, t.day] })],
);

/** Messages caught by the local SMTP stand-in (development, demo and tests only). */
export const devMailbox = sqliteTable(
  "dev_mailbox",
  {
    id: id(),
    toAddress: text("to_address").notNull(),
    fromAddress: text("from_address").notNull(),
    subject: text("subject").notNull(),
    textBody: text("text_body").notNull(),
    htmlBody: text("html_body"),
    receivedAt: createdAt(),
  },
  (t) => [index("dev_mailbox_received").on(t.receivedAt), index("dev_mailbox_to").on(t.toAddress)],
);
