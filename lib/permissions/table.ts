/**
 * Rigline's one permission table. Every page, route handler and server action asks the CASL
 * ability built from it (see ability.ts); the UI reads the same ability to hide or disable
 * what a role cannot do. Everything is already inside one organisation: the organisation
 * boundary is enforced by every query (db/scope.ts), the table only says who may do what.
 *
 * A rule with `scope` applies only to records assigned to the user:
 *   own       – the record is the user's own (profile, tokens, own reports)
 *   assigned  – a driver's assigned vehicles; a contractor's jobs offered/awarded to their firm
 *               and the vehicles of those jobs
 *   ownFirm   – records of the contractor's own firm
 *   ownDepot  – the driver's depot
 */
import type { Role } from "./roles";

export const SUBJECTS = [
  "OrgSettings",
  "User",
  "Profile",
  "ApiToken",
  "Depot",
  "Firm",
  "Platform",
  "Vehicle",
  "Grounding",
  "Standard",
  "Fitment",
  "Variance",
  "MassPlan",
  "Calculator",
  "WeighbridgeTicket",
  "Job",
  "Quote",
  "QuoteDecision",
  "FinanceApproval",
  "Evidence",
  "PreTripCheck",
  "Defect",
  "Cost",
  "Export",
  "Audit",
  "DevMailbox",
] as const;
export type Subject = (typeof SUBJECTS)[number];

export const ACTIONS = [
  "manage",
  "read",
  "create",
  "update",
  "decide",
  "approve",
  "review",
  "triage",
  "progress",
  "use",
] as const;
export type Action = (typeof ACTIONS)[number];

export type Scope = "own" | "assigned" | "ownFirm" | "ownDepot" | "checkable";

export type PermissionRule = {
  action: Action;
  subject: Subject;
  scope?: Scope;
  /** Why the rule exists, in the table's own words. */
  note?: string;
};

const r = (action: Action, subject: Subject, scope?: Scope, note?: string): PermissionRule => ({
  action,
  subject,
  ...(scope ? { scope } : {}),
  ...(note ? { note } : {}),
});

/** The whole table. Anything not listed is refused. */
export const PERMISSIONS: Record<Role, PermissionRule[]> = {
  admin: [
    r("manage", "OrgSettings"),
    r("manage", "User"),
    r("manage", "Profile", "own"),
    r("manage", "ApiToken", "own"),
    r("manage", "Depot"),
    r("manage", "Firm"),
    r("manage", "Platform"),
    r("manage", "Vehicle"),
    r("manage", "Grounding"),
    r("manage", "Standard"),
    r("manage", "Fitment"),
    r("read", "Variance"),
    r("manage", "MassPlan"),
    r("use", "Calculator"),
    r("manage", "WeighbridgeTicket"),
    r("manage", "Job"),
    r("read", "Quote"),
    r("read", "Evidence"),
    r("read", "PreTripCheck"),
    r("read", "Defect"),
    r("read", "Cost"),
    r("use", "Export"),
    r("read", "Audit"),
    r("read", "DevMailbox", undefined, "development only, never in production"),
  ],
  manager: [
    r("read", "OrgSettings"),
    r("read", "User"),
    r("manage", "Profile", "own"),
    r("manage", "ApiToken", "own"),
    r("read", "Depot"),
    r("manage", "Firm"),
    r("manage", "Platform"),
    r("manage", "Vehicle"),
    r("manage", "Grounding"),
    r("manage", "Standard"),
    r("manage", "Fitment"),
    r("read", "Variance"),
    r("manage", "MassPlan"),
    r("use", "Calculator"),
    r("manage", "WeighbridgeTicket"),
    r("manage", "Job"),
    r("read", "Quote"),
    r("decide", "QuoteDecision"),
    r("read", "Evidence"),
    r("review", "Evidence"),
    r("read", "PreTripCheck"),
    r("read", "Defect"),
    r("triage", "Defect"),
    r("read", "Cost"),
    r("use", "Export"),
    r("read", "Audit", undefined, "per record"),
  ],
  finance: [
    r("read", "OrgSettings"),
    r("manage", "Profile", "own"),
    r("manage", "ApiToken", "own"),
    r("read", "Depot"),
    r("read", "Firm"),
    r("read", "Platform"),
    r("read", "Vehicle"),
    r("read", "Standard"),
    r("read", "Fitment"),
    r("read", "Variance"),
    r("read", "MassPlan"),
    r("use", "Calculator"),
    r("read", "WeighbridgeTicket"),
    r("read", "Job"),
    r("read", "Quote"),
    r("approve", "FinanceApproval"),
    r("read", "Evidence"),
    r("read", "Defect"),
    r("manage", "Cost"),
    r("use", "Export"),
    r("read", "Audit", undefined, "per record"),
  ],
  contractor: [
    r("manage", "Profile", "own"),
    r("manage", "ApiToken", "own"),
    r("read", "Firm", "ownFirm"),
    r("read", "Platform", "assigned"),
    r("read", "Vehicle", "assigned"),
    r("read", "Standard", "assigned", "lines of assigned jobs"),
    r("read", "Variance", "assigned"),
    r("read", "MassPlan", "assigned"),
    r("use", "Calculator"),
    r("create", "WeighbridgeTicket", "assigned"),
    r("read", "Job", "assigned"),
    r("progress", "Job", "assigned", "awarded job → in workshop → evidence lodged"),
    r("manage", "Quote", "ownFirm"),
    r("create", "Evidence", "assigned"),
    r("read", "Evidence", "ownFirm"),
    r("read", "Defect", "assigned", "defects on assigned jobs"),
  ],
  driver: [
    r("manage", "Profile", "own"),
    r("manage", "ApiToken", "own"),
    r("read", "Depot", "ownDepot"),
    r("read", "Platform", "assigned"),
    r("read", "Vehicle", "assigned"),
    r("read", "Standard", "checkable", "checkable lines of assigned vehicles"),
    r("read", "Variance", "assigned", "readiness"),
    r("use", "Calculator"),
    r("read", "Job", "own", "status of jobs from own defects"),
    r("create", "Evidence", "own", "photos on own defects and checks"),
    r("create", "PreTripCheck", "assigned"),
    r("read", "PreTripCheck", "own"),
    r("create", "Defect", "assigned"),
    r("read", "Defect", "own"),
  ],
};
