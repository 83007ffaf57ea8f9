import "server-only";
import { z } from "zod";
import { axleLoadsCalc, batteryCalcOp, cableRunCalc, tyreChangeCalc } from "@/app/api/calc/operations";
import { getCheck, getChecklist, listChecksQuery, readCheckPhoto, submitCheck } from "@/lib/commands/checks";
import {
  createBudget,
  createManualCost,
  deleteBudget,
  exportLedger,
  exportVariance,
  ledgerSummary,
  listBudgets,
  listLedger,
  updateBudget,
} from "@/lib/commands/costs";
import { grantConcession, listFitments, recordFitment, removeFitment } from "@/lib/commands/fitments";
import { getDefect, listDefectsQuery, readDefectPhoto, submitDefect, triageDefect } from "@/lib/commands/defects";
import { evidenceFile, lodgeEvidence, reviewEvidence } from "@/lib/commands/evidence";
import { getImportFile, importTemplate, listImports, readVehicleUpload } from "@/lib/commands/imports";
import { cancelJob, closeJob, getJob, listJobs, offerJob, progressJob, raiseJob, signOffJob } from "@/lib/commands/jobs";
import {
  addPlannedItem,
  electricalPlanQuery,
  listPlanQuery,
  listWeighbridgeQuery,
  planEdition,
  recordWeighbridgeTicket,
  removePlannedItem,
  saveElectricalPlan,
  statementQuery,
  updatePlannedItem,
  vehicleMassQuery,
  weighbridgeTicketFile,
} from "@/lib/commands/mass";
import { listMembers } from "@/lib/commands/organisation";
import { createPlatform, getPlatform, listPlatforms, updatePlatform } from "@/lib/commands/platforms";
import { createQuote, decideQuote, financeApproval, getQuote, listQuotes, submitQuote, updateQuote, withdrawQuote } from "@/lib/commands/quotes";
import { getVehicleReadiness } from "@/lib/commands/readiness";
import { chooseRuleSet, copyRuleSet, listRuleSetsQuery, updateRuleSet } from "@/lib/commands/rules";
import {
  addLine,
  compareEditionsQuery,
  confirmRollout,
  createStandard,
  deleteLine,
  getEdition,
  getStandard,
  listStandardsQuery,
  publishEdition,
  retireEdition,
  startDraft,
  updateLine,
} from "@/lib/commands/standards";
import { createApiToken, listApiTokens, revokeApiToken } from "@/lib/commands/tokens";
import { getVehicleVariance } from "@/lib/commands/variance";
import { bulkUpdateVehicles, createVehicle, getVehicle, listVehicles, updateVehicle } from "@/lib/commands/vehicles";
import type { ApiRoute } from "./build";

/**
 * Every public route under app/api, each with the operation it runs: the input schema shown in
 * the document is the one the route validates with. A route added under app/api must be added
 * here too; tests/integration/openapi-coverage.test.ts walks the folder and fails otherwise.
 */
export const API_ROUTES: ApiRoute[] = [
  // ─── Service ──────────────────────────────────────────────────────────────
  { method: "get", path: "/api/health", summary: "Liveness and database reachability", tag: "Service", in: "none", public: true, success: { description: "The app and its database answer" } },
  { method: "get", path: "/api/openapi.json", summary: "This OpenAPI 3.1 document", tag: "Service", in: "none", public: true, success: { description: "The document" } },

  // ─── People and tokens ───────────────────────────────────────────────────
  { method: "get", path: "/api/users", summary: "The organisation's people and their roles", tag: "People", op: listMembers, in: "none", success: { description: "{ items }" } },
  { method: "get", path: "/api/tokens", summary: "Your API tokens (never their secrets)", tag: "API tokens", op: listApiTokens, in: "none", success: { description: "{ items }" } },
  {
    method: "post",
    path: "/api/tokens",
    summary: "Create an API token (from a signed-in session only)",
    description: "The answer holds the token in `token`: the only time it is shown. Send it as `Authorization: Bearer <token>`; it carries your role and never more.",
    tag: "API tokens",
    op: createApiToken,
    in: "json",
    conflicts: true,
    success: { status: 201, description: "The token, shown once" },
  },
  { method: "delete", path: "/api/tokens/{id}", summary: "Revoke one of your API tokens", tag: "API tokens", op: revokeApiToken, in: "none", conflicts: true, success: { description: "Revoked; the token stops working at once" } },

  // ─── Costs and budgets ───────────────────────────────────────────────────
  { method: "get", path: "/api/costs", summary: "One page of the cost ledger with the totals of every matching entry", tag: "Costs", op: listLedger, in: "query", success: { description: "{ items, page, pageSize, total, pageCount, totals }" } },
  { method: "post", path: "/api/costs", summary: "Book an invoice or adjustment entered by hand (finance)", tag: "Costs", op: createManualCost, in: "json", success: { status: 201, description: "The booked entry with its amounts in cents" } },
  { method: "get", path: "/api/costs/summary", summary: "Totals and spend by month and category for the filtered ledger", tag: "Costs", op: ledgerSummary, in: "query", success: { description: "{ totals, byMonth, byCategory }" } },
  {
    method: "get",
    path: "/api/costs/export",
    summary: "The filtered ledger as CSV or XLSX",
    description: "Every text cell is neutralised against formula injection; amounts are numbers in dollars, dates real dates (XLSX) or YYYY-MM-DD (CSV); a totals row ends the sheet. Usable with a personal API token.",
    tag: "Costs",
    op: exportLedger,
    in: "query",
    success: { description: "The file, as an attachment", kind: "csv-or-xlsx" },
  },
  { method: "get", path: "/api/budgets", summary: "Budgets overlapping a period, each against its actual spend", tag: "Costs", op: listBudgets, in: "query", success: { description: "{ items, totals }" } },
  { method: "post", path: "/api/budgets", summary: "Set a budget for a cost centre and period (finance)", tag: "Costs", op: createBudget, in: "json", conflicts: true, success: { status: 201, description: "The budget" } },
  { method: "patch", path: "/api/budgets/{id}", summary: "Change a budget (finance)", tag: "Costs", op: updateBudget, in: "json", conflicts: true, success: { description: "The budget" } },
  { method: "delete", path: "/api/budgets/{id}", summary: "Remove a budget (finance)", tag: "Costs", op: deleteBudget, in: "none", success: { description: "Removed" } },

  {
    method: "get",
    path: "/api/variance/export",
    summary: "Every vehicle's variance against its edition as CSV or XLSX",
    description: "One row per vehicle: depot, platform, standard and edition, status, line counts by status, cost and mass to close, and a totals row. Text cells neutralised against formula injection. Usable with a personal API token.",
    tag: "Standards and variance",
    op: exportVariance,
    in: "query",
    success: { description: "The file, as an attachment", kind: "csv-or-xlsx" },
  },

  // ─── Standards, editions, fitments, variance ─────────────────────────────
  { method: "get", path: "/api/standards", summary: "Fit-out standards with their editions", tag: "Standards and variance", op: listStandardsQuery, in: "none", success: { description: "The standards" } },
  { method: "post", path: "/api/standards", summary: "Create a standard with its first draft edition", tag: "Standards and variance", op: createStandard, in: "json", conflicts: true, success: { status: 201, description: "The standard" } },
  { method: "get", path: "/api/standards/{id}", summary: "One standard", tag: "Standards and variance", op: getStandard, in: "none", success: { description: "The standard" } },
  { method: "post", path: "/api/standards/{id}/editions", summary: "Start a new draft copied from a published edition", tag: "Standards and variance", op: startDraft, params: { id: "standardId" }, in: "json", conflicts: true, success: { status: 201, description: "The draft" } },
  { method: "get", path: "/api/editions/compare", summary: "Compare two editions line by line (?a=&b=)", tag: "Standards and variance", op: compareEditionsQuery, in: "query", success: { description: "Added, removed and changed lines" } },
  { method: "get", path: "/api/editions/{id}", summary: "One edition with its lines", tag: "Standards and variance", op: getEdition, in: "none", success: { description: "The edition" } },
  { method: "post", path: "/api/editions/{id}/lines", summary: "Add a line to a draft edition", tag: "Standards and variance", op: addLine, params: { id: "editionId" }, in: "json", conflicts: true, success: { status: 201, description: "The line" } },
  { method: "patch", path: "/api/editions/{id}/lines/{lineId}", summary: "Change a draft's line", tag: "Standards and variance", op: updateLine, params: { id: "editionId" }, in: "json", conflicts: true, success: { description: "The line" } },
  { method: "delete", path: "/api/editions/{id}/lines/{lineId}", summary: "Delete a draft's line", tag: "Standards and variance", op: deleteLine, params: { id: "editionId" }, in: "none", conflicts: true, success: { description: "Deleted" } },
  { method: "post", path: "/api/editions/{id}/publish", summary: "Publish a draft edition (frozen from then on)", tag: "Standards and variance", op: publishEdition, in: "none", conflicts: true, success: { description: "The edition" } },
  { method: "post", path: "/api/editions/{id}/retire", summary: "Retire a published edition", tag: "Standards and variance", op: retireEdition, in: "none", conflicts: true, success: { description: "The edition" } },
  {
    method: "post",
    path: "/api/editions/{id}/rollout",
    summary: "Preview (dryRun, the default) or confirm assigning the edition to vehicles",
    tag: "Standards and variance",
    op: confirmRollout,
    params: { id: "editionId" },
    in: "json",
    conflicts: true,
    success: { description: "The preview, or the vehicles assigned" },
  },
  { method: "get", path: "/api/vehicles/{id}/variance", summary: "The vehicle's variance against its edition, line by line", tag: "Standards and variance", op: getVehicleVariance, params: { id: "vehicleId" }, in: "none", success: { description: "{ editionId, summary, lines }" } },
  { method: "post", path: "/api/vehicles/{id}/variance/concessions", summary: "Grant a concession on one line (reason and expiry)", tag: "Standards and variance", op: grantConcession, params: { id: "vehicleId" }, in: "json", conflicts: true, success: { status: 201, description: "The concession" } },
  { method: "get", path: "/api/vehicles/{id}/fitments", summary: "What is fitted to the vehicle", tag: "Standards and variance", op: listFitments, params: { id: "vehicleId" }, in: "query", success: { description: "The fitments" } },
  { method: "post", path: "/api/vehicles/{id}/fitments", summary: "Record a fitment", tag: "Standards and variance", op: recordFitment, params: { id: "vehicleId" }, in: "json", success: { status: 201, description: "The fitment" } },
  { method: "delete", path: "/api/fitments/{id}", summary: "Remove a fitment (the record stays, with its removal date)", tag: "Standards and variance", op: removeFitment, in: "query", success: { description: "Removed" } },

  // ─── Calculators ─────────────────────────────────────────────────────────
  { method: "post", path: "/api/calc/axle-loads", summary: "Axle loads by the lever rule, with the binding limit", tag: "Calculators", op: axleLoadsCalc, in: "json", success: { description: "The result with its caution" } },
  { method: "post", path: "/api/calc/tyre-change", summary: "Tyre change: diameter, speedometer, load and lift checks", tag: "Calculators", op: tyreChangeCalc, in: "json", success: { description: "The result with its caution" } },
  { method: "post", path: "/api/calc/cable", summary: "Cable run: conductor size for the voltage drop, fuse", tag: "Calculators", op: cableRunCalc, in: "json", success: { description: "The result with its caution" } },
  { method: "post", path: "/api/calc/battery", summary: "12 V battery capacity for the days of autonomy", tag: "Calculators", op: batteryCalcOp, in: "json", success: { description: "The result with its caution" } },

  // ─── Vehicles and platforms ──────────────────────────────────────────────
  { method: "get", path: "/api/vehicles", summary: "The vehicle register, paged, sorted and filtered", tag: "Vehicles", op: listVehicles, in: "query", success: { description: "{ items, page, pageSize, total, pageCount }" } },
  { method: "post", path: "/api/vehicles", summary: "Add a vehicle to the register", tag: "Vehicles", op: createVehicle, in: "json", conflicts: true, success: { status: 201, description: "The vehicle" } },
  { method: "post", path: "/api/vehicles/bulk", summary: "Assign an edition or move depot for many vehicles at once", tag: "Vehicles", op: bulkUpdateVehicles, in: "json", success: { description: "Counts" } },
  { method: "post", path: "/api/vehicles/import", summary: "Import the register from a CSV or XLSX file (multipart)", tag: "Vehicles", op: readVehicleUpload, in: "multipart", conflicts: true, success: { description: "What was created, updated and refused, row by row" } },
  { method: "get", path: "/api/vehicles/{id}", summary: "One vehicle", tag: "Vehicles", op: getVehicle, in: "none", success: { description: "The vehicle" } },
  { method: "patch", path: "/api/vehicles/{id}", summary: "Change a vehicle (with the version it was based on)", tag: "Vehicles", op: updateVehicle, in: "json", conflicts: true, success: { description: "The vehicle" } },
  { method: "get", path: "/api/vehicles/{id}/checklist", summary: "The vehicle's pre-trip checklist", tag: "Checks and defects", op: getChecklist, params: { id: "vehicleId" }, in: "none", success: { description: "The checklist" } },
  { method: "get", path: "/api/vehicles/{id}/readiness", summary: "Trip readiness with its reasons", tag: "Vehicles", op: getVehicleReadiness, in: "none", success: { description: "State, headline and reasons" } },
  { method: "get", path: "/api/vehicles/{id}/mass", summary: "Axle loads and headroom for a loading given in the query", tag: "Mass", op: vehicleMassQuery, in: "query", success: { description: "The mass figures with the caution" } },
  { method: "get", path: "/api/vehicles/{id}/statement", summary: "The printable mass statement (PDF)", tag: "Mass", op: statementQuery, in: "query", success: { description: "The statement", kind: "pdf" } },
  { method: "get", path: "/api/vehicles/{id}/plan", summary: "Planned items (what-if) on the vehicle", tag: "Mass", op: listPlanQuery, in: "none", success: { description: "The plan" } },
  {
    method: "post",
    path: "/api/vehicles/{id}/plan",
    summary: "Plan an item, or plan an edition's short lines at once (body with editionId)",
    tag: "Mass",
    op: { input: z.union([addPlannedItem.input, planEdition.input]), permission: addPlannedItem.permission },
    in: "json",
    success: { status: 201, description: "The plan" },
  },
  { method: "patch", path: "/api/vehicles/{id}/plan/{itemId}", summary: "Change a planned item", tag: "Mass", op: updatePlannedItem, in: "json", success: { description: "The plan" } },
  { method: "delete", path: "/api/vehicles/{id}/plan/{itemId}", summary: "Remove a planned item", tag: "Mass", op: removePlannedItem, in: "none", success: { description: "The plan" } },
  { method: "get", path: "/api/vehicles/{id}/weighbridge", summary: "Weighbridge tickets of the vehicle", tag: "Mass", op: listWeighbridgeQuery, in: "none", success: { description: "The tickets" } },
  {
    method: "post",
    path: "/api/vehicles/{id}/weighbridge",
    summary: "Record a weighbridge ticket, with its file (multipart)",
    description:
      "multipart/form-data (or JSON without a file). `file` is optional: a PDF, JPEG, PNG or WebP of at most 10 MiB, checked by its content as any evidence file (another type answers 415 naming `file`, a larger file 413); photos are re-encoded without EXIF or location data and the stored file's SHA-256 is kept. The file is fetched only through GET /api/vehicles/{id}/weighbridge/{ticketId}/file.",
    tag: "Mass",
    op: recordWeighbridgeTicket,
    in: "multipart",
    conflicts: true,
    success: { status: 201, description: "The ticket (with its file's name, type, size, SHA-256 and download address) and its reconciliation" },
  },
  { method: "get", path: "/api/vehicles/{id}/weighbridge/{ticketId}/file", summary: "The file of a weighbridge ticket", tag: "Mass", op: weighbridgeTicketFile, in: "none", success: { description: "The stored file", kind: "file" } },
  { method: "get", path: "/api/vehicles/{id}/electrical-plan", summary: "The vehicle's saved 12 V plan with its results", tag: "Mass", op: electricalPlanQuery, in: "none", success: { description: "{ plan, summary, version, updatedAt, updatedBy, caution } (plan null when none is saved)" } },
  {
    method: "put",
    path: "/api/vehicles/{id}/electrical-plan",
    summary: "Save the vehicle's 12 V plan (replaces the current one)",
    tag: "Mass",
    op: saveElectricalPlan,
    in: "json",
    success: { description: "The saved plan with its results (daily Ah, battery, recharge, cable runs with size, drop and fuse)" },
  },
  { method: "get", path: "/api/platforms", summary: "Platforms with the maker's figures", tag: "Vehicles", op: listPlatforms, in: "none", success: { description: "{ items }" } },
  { method: "post", path: "/api/platforms", summary: "Add a platform", tag: "Vehicles", op: createPlatform, in: "json", conflicts: true, success: { status: 201, description: "The platform" } },
  { method: "get", path: "/api/platforms/{id}", summary: "One platform", tag: "Vehicles", op: getPlatform, in: "none", success: { description: "The platform" } },
  { method: "patch", path: "/api/platforms/{id}", summary: "Change a platform's figures", tag: "Vehicles", op: updatePlatform, in: "json", conflicts: true, success: { description: "The platform" } },
  { method: "get", path: "/api/imports", summary: "The organisation's import history", tag: "Vehicles", op: listImports, in: "none", success: { description: "{ items }" } },
  { method: "get", path: "/api/imports/template", summary: "The XLSX import template", tag: "Vehicles", op: importTemplate, in: "none", success: { description: "The template", kind: "xlsx" } },
  { method: "get", path: "/api/imports/{id}/file", summary: "The original file of an import", tag: "Vehicles", op: getImportFile, in: "none", success: { description: "The file", kind: "file" } },

  // ─── Rule sets ───────────────────────────────────────────────────────────
  { method: "get", path: "/api/rule-sets", summary: "Rule sets (shipped examples and the organisation's own)", tag: "Rule sets", op: listRuleSetsQuery, in: "none", success: { description: "The rule sets" } },
  { method: "post", path: "/api/rule-sets", summary: "Copy a rule set into one the organisation may edit", tag: "Rule sets", op: copyRuleSet, in: "json", success: { status: 201, description: "The copy" } },
  { method: "patch", path: "/api/rule-sets/{id}", summary: "Edit one of the organisation's rule sets", tag: "Rule sets", op: updateRuleSet, in: "json", conflicts: true, success: { description: "The rule set" } },
  { method: "post", path: "/api/rule-sets/{id}/choose", summary: "Use this rule set for the organisation's checks", tag: "Rule sets", op: chooseRuleSet, params: { id: "ruleSetId" }, in: "none", success: { description: "Chosen" } },

  // ─── Jobs, quotes, evidence ──────────────────────────────────────────────
  { method: "get", path: "/api/jobs", summary: "Jobs the caller may see", tag: "Jobs", op: listJobs, in: "query", success: { description: "{ items }" } },
  { method: "post", path: "/api/jobs", summary: "Raise a job on a vehicle", tag: "Jobs", op: raiseJob, in: "json", success: { status: 201, description: "The job" } },
  { method: "get", path: "/api/jobs/{id}", summary: "One job", tag: "Jobs", op: getJob, in: "none", success: { description: "The job" } },
  { method: "post", path: "/api/jobs/{id}/offers", summary: "Offer the job to workshops", tag: "Jobs", op: offerJob, in: "json", conflicts: true, success: { description: "The job" } },
  { method: "post", path: "/api/jobs/{id}/progress", summary: "Move an awarded job on (workshop)", tag: "Jobs", op: progressJob, in: "json", conflicts: true, success: { description: "The job" } },
  { method: "post", path: "/api/jobs/{id}/sign-off", summary: "Sign the job off and book its cost", tag: "Jobs", op: signOffJob, in: "json", conflicts: true, success: { description: "The job" } },
  { method: "post", path: "/api/jobs/{id}/close", summary: "Close a signed-off job", tag: "Jobs", op: closeJob, in: "json", conflicts: true, success: { description: "The job" } },
  { method: "post", path: "/api/jobs/{id}/cancel", summary: "Cancel the job, with a reason", tag: "Jobs", op: cancelJob, in: "json", conflicts: true, success: { description: "The job" } },
  { method: "post", path: "/api/jobs/{id}/evidence", summary: "Lodge evidence on the job (multipart)", tag: "Jobs", op: lodgeEvidence, params: { id: "jobId" }, in: "multipart", conflicts: true, success: { status: 201, description: "The evidence" } },
  { method: "post", path: "/api/evidence/{id}/review", summary: "Accept or reject evidence", tag: "Jobs", op: reviewEvidence, in: "json", conflicts: true, success: { description: "The evidence" } },
  { method: "get", path: "/api/evidence/{id}/file", summary: "The evidence file", tag: "Jobs", op: evidenceFile, in: "none", success: { description: "The file", kind: "file" } },
  { method: "get", path: "/api/quotes", summary: "Quotes the caller may see", tag: "Jobs", op: listQuotes, in: "query", success: { description: "{ items }" } },
  { method: "post", path: "/api/quotes", summary: "Start a quote (workshop)", tag: "Jobs", op: createQuote, in: "json", conflicts: true, success: { status: 201, description: "The quote" } },
  { method: "get", path: "/api/quotes/{id}", summary: "One quote", tag: "Jobs", op: getQuote, in: "none", success: { description: "The quote" } },
  { method: "patch", path: "/api/quotes/{id}", summary: "Replace a draft or returned quote's lines", tag: "Jobs", op: updateQuote, in: "json", conflicts: true, success: { description: "The quote" } },
  { method: "post", path: "/api/quotes/{id}/submit", summary: "Submit the quote", tag: "Jobs", op: submitQuote, in: "json", conflicts: true, success: { description: "The quote" } },
  { method: "post", path: "/api/quotes/{id}/withdraw", summary: "Withdraw the quote", tag: "Jobs", op: withdrawQuote, in: "json", conflicts: true, success: { description: "The quote" } },
  { method: "post", path: "/api/quotes/{id}/decision", summary: "Accept, decline or return a quote (manager)", tag: "Jobs", op: decideQuote, in: "json", conflicts: true, success: { description: "The decision" } },
  { method: "post", path: "/api/quotes/{id}/finance-approval", summary: "Approve or decline a quote above the threshold (finance)", tag: "Jobs", op: financeApproval, in: "json", conflicts: true, success: { description: "The decision" } },

  // ─── Checks and defects ──────────────────────────────────────────────────
  { method: "get", path: "/api/checks", summary: "Pre-trip checks the caller may see", tag: "Checks and defects", op: listChecksQuery, in: "query", success: { description: "The checks" } },
  { method: "post", path: "/api/checks", summary: "Submit a finished pre-trip check (JSON, or multipart with photos); idempotent on clientId", tag: "Checks and defects", op: submitCheck, in: "json", success: { status: 201, description: "The check (200 with the one already held on a repeat)" } },
  { method: "get", path: "/api/checks/{id}", summary: "One pre-trip check", tag: "Checks and defects", op: getCheck, in: "none", success: { description: "The check" } },
  { method: "get", path: "/api/checks/{id}/photos/{photoId}", summary: "A photo of a check item", tag: "Checks and defects", op: readCheckPhoto, in: "none", success: { description: "The photo", kind: "file" } },
  { method: "get", path: "/api/defects", summary: "Defects the caller may see", tag: "Checks and defects", op: listDefectsQuery, in: "query", success: { description: "The defects" } },
  { method: "post", path: "/api/defects", summary: "Report a defect (JSON, or multipart with photos); idempotent on clientId", tag: "Checks and defects", op: submitDefect, in: "json", success: { status: 201, description: "The defect (200 with the one already held on a repeat)" } },
  { method: "get", path: "/api/defects/{id}", summary: "One defect", tag: "Checks and defects", op: getDefect, in: "none", success: { description: "The defect" } },
  { method: "post", path: "/api/defects/{id}/moves", summary: "Triage, repair, resolve, close or merge a defect (manager)", tag: "Checks and defects", op: triageDefect, in: "json", conflicts: true, success: { description: "The defect" } },
  { method: "get", path: "/api/defects/{id}/photos/{photoId}", summary: "A photo of a defect", tag: "Checks and defects", op: readDefectPhoto, in: "none", success: { description: "The photo", kind: "file" } },
];

/** Route files under app/api that are not part of the public API, with the reason. */
export const UNDOCUMENTED_ROUTES: Record<string, string> = {
  "/api/auth/{nextauth}": "Auth.js sign-in and session endpoints, used by the sign-in pages only",
};
