import "server-only";
import { and, eq, or, sql } from "drizzle-orm";
import { z } from "zod";
import { db, type DbOrTx } from "@/db/client";
import { editionShortLines, listPlannedItems, listTickets, loadElectricalPlan, loadMassContext, plannableEditions, ticketFileRow, toPlannedItem } from "@/db/mass";
import { ruleSetInUse } from "@/db/rule-sets";
import { electricalPlans, evidence, jobOffers, jobs, plannedItems, vehicles, weighbridgeTickets } from "@/db/schema";
import { BRAKE_CAUTION, ELECTRICAL_CAUTION, MASS_CAUTION, RULE_SET_LABEL, WEIGHBRIDGE_CAUTION } from "@/components/mass/cautions";
import {
  computeMass,
  EMPTY_LOADING,
  LIMIT_LABELS,
  loadingSchema,
  PLAN_ZONES,
  ZONE_LABELS,
  type Loading,
  type MassContext,
  type MassFigures,
  type PlannedItem,
} from "@/components/mass/model";
import { electricalPlanSchema, summariseElectricalPlan, type ElectricalPlan, type ElectricalPlanSummary } from "@/lib/electrical";
import { reconcileWeighbridge, type ReconcileResult } from "@/lib/mass";
import type { Actor } from "@/lib/permissions";
import type { StatementData } from "@/lib/statement";
import { springAdvice } from "@/lib/suspension";
import { AppError, notFound } from "@/lib/server/errors";
import { command, query } from "@/lib/server/operation";
import { sha256OfBytes, storage } from "@/lib/server/storage";
import { acceptedTypesInWords, displayFileName, EVIDENCE_MAX_BYTES, evidenceStorageKey, EXTENSIONS, type AcceptedType } from "@/lib/uploads";
import { prepareUpload } from "./evidence";
import { formatDay } from "@/lib/format/dates";

/**
 * Mass and fit-out of one vehicle: the figures of record (axle loads, checks, binding limit),
 * the what-if plan, weighbridge tickets and their reconciliation.
 */

const vehicleId = z.string({ error: "id is required" }).trim().min(1, { error: "id is required" }).max(64, { error: "id is too long" });
const flag = z
  .union([z.boolean(), z.string()])
  .optional()
  .transform((v) => v === true || v === "1" || v === "true" || v === "on" || v === "yes");

async function contextOrNotFound(database: DbOrTx, actor: Actor, id: string) {
  const loaded = await loadMassContext(database, actor, id);
  if (!loaded) throw notFound("That vehicle");
  return loaded;
}

type RuleSetSummary = { id: string; name: string; note: string; exampleOnly: true; label: string; chosen: boolean };

async function ruleSetSummary(database: DbOrTx, orgId: string): Promise<RuleSetSummary & { rules: Awaited<ReturnType<typeof ruleSetInUse>>["rules"] }> {
  const set = await ruleSetInUse(database, orgId);
  return { id: set.id, name: set.name, note: set.rules.note, exampleOnly: true, label: RULE_SET_LABEL, chosen: set.chosen, rules: set.rules };
}

export type MassResponse = MassFigures & {
  vehicle: MassContext["vehicle"] & { platform: string };
  loading: Loading;
  edition: { id: string; label: string; plannedLines: number } | null;
  /** The planned items inside these figures (saved ones, then an edition's short lines). */
  planned: PlannedItem[];
  ruleSet: RuleSetSummary;
  caution: string;
};

/** GET /api/vehicles/{id}/mass */
export const vehicleMassQuery = query({
  name: "mass.read",
  input: loadingSchema.and(
    z.object({
      id: vehicleId,
      includePlanned: flag,
      editionId: z.string().trim().max(64, { error: "editionId is too long" }).optional(),
    }),
  ),
  permission: ["read", "MassPlan"],
  run: async ({ user, input }): Promise<MassResponse> => {
    const { context } = await contextOrNotFound(db(), user, input.id);
    let edition: MassResponse["edition"] = null;
    let extraPlanned: PlannedItem[] = [];
    if (input.editionId) {
      const short = await editionShortLines(db(), user.orgId, input.editionId, context.fitted);
      if (!short) throw new AppError("validation_failed", "That edition was not found", [{ field: "editionId", message: "Choose an edition of this organisation" }]);
      extraPlanned = short.items;
      edition = { id: short.edition.id, label: short.edition.label, plannedLines: short.items.length };
    }
    const loading: Loading = {
      occupants: input.occupants,
      fuelL: input.fuelL,
      waterL: input.waterL,
      cargoKg: input.cargoKg,
      trailerAtmKg: input.trailerAtmKg,
      towballKg: input.towballKg,
    };
    // Saved planned items count only when asked for; an edition's short lines count when it is named.
    const includePlanned = input.includePlanned || Boolean(input.editionId);
    const planContext = input.includePlanned ? context : { ...context, planned: [] };
    const figures = computeMass(planContext, loading, { includePlanned, extraPlanned });
    const { rules: _rules, ...ruleSet } = await ruleSetSummary(db(), user.orgId);
    const p = context.platform;
    return {
      ...figures,
      vehicle: { ...context.vehicle, platform: `${p.make} ${p.model} ${p.variant}`.trim() },
      loading,
      edition,
      planned: includePlanned ? [...planContext.planned, ...extraPlanned] : [],
      ruleSet,
      caution: MASS_CAUTION,
    };
  },
});

// ─── What-if plan ────────────────────────────────────────────────────────────

const optionalNumber = (label: string, min: number, max: number, unit: string) =>
  z
    .union([z.number(), z.string(), z.null()])
    .optional()
    .transform((v, ctx) => {
      if (v === undefined) return undefined;
      if (v === null) return null;
      if (typeof v === "string" && v.trim() === "") return null;
      const n = typeof v === "number" ? v : Number(v.trim());
      if (!Number.isFinite(n)) {
        ctx.addIssue({ code: "custom", message: `Enter ${label} as a number of ${unit}` });
        return z.NEVER;
      }
      if (n < min || n > max) {
        ctx.addIssue({ code: "custom", message: `${label.charAt(0).toUpperCase()}${label.slice(1)} must be between ${min.toLocaleString("en-AU")} and ${max.toLocaleString("en-AU")} ${unit}` });
        return z.NEVER;
      }
      return n;
    });

const zoneField = z
  .union([z.enum(PLAN_ZONES, { error: `zone must be one of ${PLAN_ZONES.join(", ")}` }), z.literal(""), z.null()])
  .optional()
  .transform((v) => (v === "" ? null : v));

const itemFields = {
  label: z
    .string({ error: "Give the item a name" })
    .trim()
    .min(1, { error: "Give the item a name" })
    .max(120, { error: "The name is too long (at most 120 characters)" }),
  massKg: z.coerce
    .number({ error: "Enter the mass in kg" })
    .positive({ error: "Enter a mass above zero kg" })
    .max(3000, { error: "That mass looks wrong: more than 3,000 kg" }),
  xMm: optionalNumber("the distance behind the front axle", -3000, 12_000, "mm"),
  zone: zoneField,
  massKind: z.enum(["constant", "variable"], { error: 'massKind must be "constant" or "variable"' }).default("constant"),
};

export const planItemInputSchema = z
  .object({ id: vehicleId, ...itemFields })
  .refine((v) => (v.xMm !== undefined && v.xMm !== null) || (v.zone !== undefined && v.zone !== null), {
    path: ["xMm"],
    error: "Give the distance behind the front axle in mm, or choose a zone",
  });

async function vehicleInScope(tx: DbOrTx, actor: Actor, id: string) {
  const loaded = await loadMassContext(tx, actor, id);
  if (!loaded) throw notFound("That vehicle");
  return loaded;
}

/** POST /api/vehicles/{id}/plan */
export const addPlannedItem = command({
  name: "plan.add",
  input: planItemInputSchema,
  permission: ["manage", "MassPlan"],
  run: async ({ user, input, tx, audit }) => {
    await vehicleInScope(tx, user, input.id);
    const [row] = await tx
      .insert(plannedItems)
      .values({
        orgId: user.orgId,
        vehicleId: input.id,
        label: input.label,
        massKg: input.massKg,
        xMm: input.xMm ?? null,
        zone: input.zone ?? null,
        massKind: input.massKind,
        createdBy: user.userId,
      })
      .returning();
    if (!row) throw new Error("planned item insert returned nothing");
    const item = toPlannedItem(row);
    await audit({ action: "plan.add", entityType: "planned_item", entityId: row.id, after: { vehicleId: input.id, ...item } });
    return item;
  },
});

export const planItemUpdateSchema = z.object({
  id: vehicleId,
  itemId: z.string({ error: "itemId is required" }).trim().min(1, { error: "itemId is required" }).max(64),
  label: itemFields.label.optional(),
  massKg: itemFields.massKg.optional(),
  xMm: itemFields.xMm,
  zone: itemFields.zone,
  massKind: z.enum(["constant", "variable"], { error: 'massKind must be "constant" or "variable"' }).optional(),
});

async function plannedRow(tx: DbOrTx, orgId: string, vehicle: string, itemId: string) {
  const row = await tx.query.plannedItems.findFirst({
    where: and(eq(plannedItems.id, itemId), eq(plannedItems.orgId, orgId), eq(plannedItems.vehicleId, vehicle)),
  });
  if (!row) throw notFound("That planned item");
  return row;
}

/** PATCH /api/vehicles/{id}/plan/{itemId}: rename, re-weigh or move an item. */
export const updatePlannedItem = command({
  name: "plan.update",
  input: planItemUpdateSchema,
  permission: ["manage", "MassPlan"],
  run: async ({ user, input, tx, audit }) => {
    await vehicleInScope(tx, user, input.id);
    const before = await plannedRow(tx, user.orgId, input.id, input.itemId);
    const next = {
      label: input.label ?? before.label,
      massKg: input.massKg ?? before.massKg,
      xMm: input.xMm === undefined ? before.xMm : input.xMm,
      zone: input.zone === undefined ? before.zone : input.zone,
      massKind: input.massKind ?? before.massKind,
    };
    if (next.xMm === null && next.zone === null) {
      throw new AppError("validation_failed", "Some fields need attention", [
        { field: "xMm", message: "Give the distance behind the front axle in mm, or choose a zone" },
      ]);
    }
    const [row] = await tx.update(plannedItems).set(next).where(eq(plannedItems.id, before.id)).returning();
    if (!row) throw new Error("planned item update returned nothing");
    const item = toPlannedItem(row);
    await audit({ action: "plan.update", entityType: "planned_item", entityId: row.id, before: toPlannedItem(before), after: item });
    return item;
  },
});

/** DELETE /api/vehicles/{id}/plan/{itemId} */
export const removePlannedItem = command({
  name: "plan.remove",
  input: z.object({ id: vehicleId, itemId: planItemUpdateSchema.shape.itemId }),
  permission: ["manage", "MassPlan"],
  run: async ({ user, input, tx, audit }) => {
    await vehicleInScope(tx, user, input.id);
    const before = await plannedRow(tx, user.orgId, input.id, input.itemId);
    await tx.delete(plannedItems).where(eq(plannedItems.id, before.id));
    await audit({ action: "plan.remove", entityType: "planned_item", entityId: before.id, before: toPlannedItem(before) });
    return { id: before.id, removed: true };
  },
});

/** POST /api/vehicles/{id}/plan with { editionId }: the edition's short lines become planned items at once. */
export const planEdition = command({
  name: "plan.edition",
  input: z.object({
    id: vehicleId,
    editionId: z.string({ error: "Choose an edition" }).trim().min(1, { error: "Choose an edition" }).max(64),
  }),
  permission: ["manage", "MassPlan"],
  run: async ({ user, input, tx, audit }) => {
    const { context } = await vehicleInScope(tx, user, input.id);
    const short = await editionShortLines(tx, user.orgId, input.editionId, context.fitted);
    if (!short) throw new AppError("validation_failed", "That edition was not found", [{ field: "editionId", message: "Choose an edition of this organisation" }]);
    // An edition planned twice adds nothing twice: lines already planned under the same name are kept.
    const existing = new Set(context.planned.map((p) => p.label));
    const fresh = short.items.filter((item) => !existing.has(item.label));
    const added: PlannedItem[] = [];
    for (const item of fresh) {
      const [row] = await tx
        .insert(plannedItems)
        .values({
          orgId: user.orgId,
          vehicleId: input.id,
          label: item.label,
          massKg: item.massKg,
          // Planned items need a place: lines without one are taken as mid-wheelbase.
          xMm: item.xMm ?? (item.zone ? null : (context.platform.wheelbaseMm ?? 0) / 2),
          zone: item.zone,
          massKind: item.massKind,
          createdBy: user.userId,
        })
        .returning();
      if (row) added.push(toPlannedItem(row));
    }
    await audit({
      action: "plan.edition",
      entityType: "vehicle",
      entityId: input.id,
      after: { editionId: short.edition.id, added: added.map((a) => ({ id: a.id, label: a.label, massKg: a.massKg })) },
    });
    return { edition: short.edition, added, skipped: short.items.length - fresh.length };
  },
});

export const listPlanQuery = query({
  name: "plan.list",
  input: z.object({ id: vehicleId }),
  permission: ["read", "MassPlan"],
  run: async ({ user, input }) => {
    const { context } = await contextOrNotFound(db(), user, input.id);
    return { items: await listPlannedItems(db(), user.orgId, context.vehicle.id) };
  },
});

// ─── Weighbridge ─────────────────────────────────────────────────────────────

const ticketKg = (what: string) =>
  z.coerce
    .number({ error: `Enter the ${what} mass from the ticket in kg` })
    .positive({ error: `Enter the ${what} mass from the ticket in kg` })
    .max(20_000, { error: `The ${what} mass looks wrong: more than 20,000 kg` });

/** The ticket's file may be a PDF or a photo of the paper, as any evidence of its kind (ACCEPTED_TYPES); the bytes decide, not the name. */
export const TICKET_FILE_MAX_BYTES = EVIDENCE_MAX_BYTES;

/** An empty file input (no file chosen) arrives as a nameless zero-byte file: that is no file. */
const ticketFileField = z.preprocess(
  (v) => (v === "" || v === null || (v instanceof Blob && v.size === 0 && !(v as File).name) ? undefined : v),
  z
    .custom<Blob>((v) => v instanceof Blob, { error: `Attach the ticket as a file (${acceptedTypesInWords("weighbridge_ticket")})` })
    .meta({ description: `The ticket as ${acceptedTypesInWords("weighbridge_ticket")} of at most 10 MiB (optional)`, override: { type: "string", format: "binary" } })
    .optional(),
);

export const ticketInputSchema = z.object({
  id: vehicleId,
  weighedAt: z
    .union([z.string(), z.date()], { error: "Give the date the vehicle was weighed" })
    .transform((v, ctx) => {
      const d = v instanceof Date ? v : new Date(/^\d{4}-\d{2}-\d{2}$/.test(v.trim()) ? `${v.trim()}T12:00:00` : v.trim());
      if (Number.isNaN(d.getTime())) {
        ctx.addIssue({ code: "custom", message: "Give the date the vehicle was weighed" });
        return z.NEVER;
      }
      if (d.getTime() > Date.now() + 36 * 3600_000) {
        ctx.addIssue({ code: "custom", message: "The weighing date cannot be in the future" });
        return z.NEVER;
      }
      return d;
    }),
  ticketNumber: z
    .string({ error: "Give the ticket number" })
    .trim()
    .min(1, { error: "Give the ticket number" })
    .max(40, { error: "The ticket number is too long (at most 40 characters)" }),
  frontKg: ticketKg("front axle"),
  rearKg: ticketKg("rear axle"),
  grossKg: ticketKg("gross"),
  jobId: z.string().trim().max(64).optional().transform((v) => (v ? v : null)),
  file: ticketFileField,
});

export type Reconciliation = (ReconcileResult & { computedFrom: string; toleranceKg: number }) | { unavailable: string };

/**
 * The computed masses of the vehicle as it stood on the ticket's date (maker's kerb figures plus
 * what was fitted by then, unladen) against what the weighbridge measured.
 */
export function reconcileTicket(
  context: MassContext,
  ticket: { frontKg: number; rearKg: number; grossKg: number; weighedAt: Date },
): Reconciliation {
  const fittedThen = context.fitted.filter((f) => Date.parse(f.fittedAt) <= ticket.weighedAt.getTime());
  const planOnly: MassContext = { ...context, measured: null, fitted: fittedThen };
  const figures = computeMass(planOnly, EMPTY_LOADING, { includePlanned: false });
  if (figures.frontKg === undefined || figures.rearKg === undefined || figures.grossKg === undefined) {
    return { unavailable: "The maker's front and rear kerb masses and the wheelbase are needed to compare the ticket with the plan." };
  }
  const toleranceKg = context.settings.weighbridgeToleranceKg;
  const result = reconcileWeighbridge(
    { frontKg: figures.frontKg, rearKg: figures.rearKg, grossKg: figures.grossKg },
    { frontKg: ticket.frontKg, rearKg: ticket.rearKg, grossKg: ticket.grossKg },
    { kg: toleranceKg },
  );
  return {
    ...result,
    toleranceKg,
    computedFrom: `The maker's kerb figures plus ${fittedThen.length} item${fittedThen.length === 1 ? "" : "s"} fitted by the weighing date, unladen.`,
  };
}

async function contractorMayWeigh(tx: DbOrTx, actor: Actor, vehicle: string, jobId: string | null) {
  if (actor.role !== "contractor") return;
  if (!jobId) {
    throw new AppError("validation_failed", "A workshop records a ticket against its job", [{ field: "jobId", message: "Choose the job the vehicle was weighed for" }]);
  }
  const firm = actor.firmId ?? "__none__";
  const [job] = await tx
    .select({ id: jobs.id })
    .from(jobs)
    .leftJoin(jobOffers, and(eq(jobOffers.jobId, jobs.id), eq(jobOffers.firmId, firm)))
    .where(and(eq(jobs.id, jobId), eq(jobs.orgId, actor.orgId), eq(jobs.vehicleId, vehicle), or(eq(jobs.awardedFirmId, firm), eq(jobOffers.firmId, firm))))
    .limit(1);
  if (!job) throw notFound("That job");
}

/** POST /api/vehicles/{id}/weighbridge: the ticket, the vehicle's measured masses, one transaction. */
export const recordWeighbridgeTicket = command({
  name: "weighbridge.record",
  input: ticketInputSchema,
  permission: ["create", "WeighbridgeTicket"],
  run: async ({ user, input, tx, audit }) => {
    const { context, vehicle } = await vehicleInScope(tx, user, input.id);
    await contractorMayWeigh(tx, user, vehicle.id, input.jobId);
    if (input.jobId && user.role !== "contractor") {
      const job = await tx.query.jobs.findFirst({ where: and(eq(jobs.id, input.jobId), eq(jobs.orgId, user.orgId), eq(jobs.vehicleId, vehicle.id)) });
      if (!job) throw notFound("That job");
    }
    const duplicate = await tx.query.weighbridgeTickets.findFirst({
      where: and(eq(weighbridgeTickets.vehicleId, vehicle.id), eq(weighbridgeTickets.ticketNumber, input.ticketNumber)),
    });
    if (duplicate) {
      throw new AppError("conflict", `Ticket ${input.ticketNumber} is already recorded for this vehicle`, [
        { field: "ticketNumber", message: "This ticket is already recorded" },
      ]);
    }
    // The file is kept like any evidence file: checked, cleaned, stored under our own key before
    // its row is written (a failed transaction leaves at worst an unreferenced file), SHA-256 kept.
    let file: { id: string; filename: string; contentType: AcceptedType; sizeBytes: number; sha256: string } | null = null;
    if (input.file) {
      // The evidence upload checks, as for any evidence: 413 too large, 415 naming `file` for
      // content of another type, photos re-encoded without EXIF (location included).
      const prepared = await prepareUpload(input.file, "weighbridge_ticket");
      const evidenceId = crypto.randomUUID();
      const extension = EXTENSIONS[prepared.type];
      const storageKey = evidenceStorageKey(user.orgId, evidenceId, extension);
      const sha256 = sha256OfBytes(prepared.bytes);
      await storage().put(storageKey, prepared.bytes, prepared.type);
      const filename = displayFileName((input.file as File).name, `ticket-${input.ticketNumber}.${extension}`).replace(/\.[A-Za-z0-9]{1,5}$/, "") + `.${extension}`;
      await tx.insert(evidence).values({
        id: evidenceId,
        orgId: user.orgId,
        jobId: null,
        kind: "weighbridge_ticket",
        // A manager's own ticket needs no review; a workshop's waits for one.
        status: user.role === "contractor" ? "lodged" : "accepted",
        filename,
        contentType: prepared.type,
        sizeBytes: prepared.bytes.length,
        sha256,
        storageKey,
        uploadedBy: user.userId,
      });
      file = { id: evidenceId, filename, contentType: prepared.type, sizeBytes: prepared.bytes.length, sha256 };
    }
    const [ticket] = await tx
      .insert(weighbridgeTickets)
      .values({
        orgId: user.orgId,
        vehicleId: vehicle.id,
        jobId: input.jobId,
        ticketNumber: input.ticketNumber,
        weighedAt: input.weighedAt,
        frontKg: input.frontKg,
        rearKg: input.rearKg,
        grossKg: input.grossKg,
        evidenceId: file?.id ?? null,
        recordedBy: user.userId,
      })
      .returning();
    if (!ticket) throw new Error("ticket insert returned nothing");
    await audit({
      action: "weighbridge.record",
      entityType: "weighbridge_ticket",
      entityId: ticket.id,
      after: { ...ticket, file: file ? { filename: file.filename, contentType: file.contentType, sizeBytes: file.sizeBytes, sha256: file.sha256 } : null },
    });

    // The newest weighing is the vehicle's measured mass; an older ticket recorded late is kept but does not replace it.
    const isLatest = !vehicle.measuredAt || input.weighedAt.getTime() >= vehicle.measuredAt.getTime();
    if (isLatest) {
      const before = {
        measuredFrontKg: vehicle.measuredFrontKg,
        measuredRearKg: vehicle.measuredRearKg,
        measuredGrossKg: vehicle.measuredGrossKg,
        measuredAt: vehicle.measuredAt,
      };
      const after = { measuredFrontKg: input.frontKg, measuredRearKg: input.rearKg, measuredGrossKg: input.grossKg, measuredAt: input.weighedAt };
      await tx
        .update(vehicles)
        .set({ ...after, version: sql`${vehicles.version} + 1` })
        .where(and(eq(vehicles.id, vehicle.id), eq(vehicles.orgId, user.orgId)));
      await audit({ action: "vehicle.measured_masses", entityType: "vehicle", entityId: vehicle.id, before, after, reason: `Weighbridge ticket ${input.ticketNumber}` });
    }
    const reconciliation = reconcileTicket(context, { ...input });
    return { ticket: { ...ticket, file: file ? { ...file, href: ticketFileHref(vehicle.id, ticket.id) } : null }, measuredUpdated: isLatest, reconciliation, caution: WEIGHBRIDGE_CAUTION };
  },
});

/** Where a ticket's file is downloaded: only through the app, which checks who asks. */
export function ticketFileHref(vehicle: string, ticketId: string): string {
  return `/api/vehicles/${encodeURIComponent(vehicle)}/weighbridge/${encodeURIComponent(ticketId)}/file`;
}

type TicketRow = Awaited<ReturnType<typeof listTickets>>[number];

/** A ticket as the API and the tab show it, with its file (if any) and the app address to fetch it. */
export function ticketView(vehicle: string, t: TicketRow) {
  return {
    id: t.id,
    ticketNumber: t.ticketNumber,
    weighedAt: t.weighedAt.toISOString(),
    frontKg: t.frontKg,
    rearKg: t.rearKg,
    grossKg: t.grossKg,
    jobId: t.jobId,
    file: t.file ? { ...t.file, href: ticketFileHref(vehicle, t.id) } : null,
  };
}

/** GET /api/vehicles/{id}/weighbridge/{ticketId}/file: the stored bytes, for a user who may read the vehicle's tickets. */
export const weighbridgeTicketFile = query({
  name: "weighbridge.file",
  input: z.object({ id: vehicleId, ticketId: z.string({ error: "ticketId is required" }).trim().min(1, { error: "ticketId is required" }).max(64) }),
  permission: ["read", "WeighbridgeTicket"],
  run: async ({ user, input }) => {
    const { context } = await contextOrNotFound(db(), user, input.id);
    const row = await ticketFileRow(db(), user.orgId, context.vehicle.id, input.ticketId);
    if (!row) throw notFound("That ticket's file");
    const stored = await storage().get(row.storageKey);
    if (!stored) throw notFound("That ticket's file");
    return { bytes: stored.bytes, contentType: row.contentType, filename: row.filename, sha256: row.sha256 };
  },
});

/** GET /api/vehicles/{id}/weighbridge: tickets, newest first, the newest reconciled against the plan. */
export const listWeighbridgeQuery = query({
  name: "weighbridge.list",
  input: z.object({ id: vehicleId }),
  permission: ["read", "WeighbridgeTicket"],
  run: async ({ user, input }) => {
    const { context } = await contextOrNotFound(db(), user, input.id);
    const tickets = await listTickets(db(), user.orgId, context.vehicle.id);
    const latest = tickets[0];
    return {
      items: tickets.map((t) => ticketView(context.vehicle.id, t)),
      reconciliation: latest ? reconcileTicket(context, latest) : null,
      toleranceKg: context.settings.weighbridgeToleranceKg,
      caution: WEIGHBRIDGE_CAUTION,
    };
  },
});

// ─── 12 V plan ───────────────────────────────────────────────────────────────

export type SavedElectricalPlan = {
  plan: ElectricalPlan;
  summary: ElectricalPlanSummary;
  version: number;
  updatedAt: string;
  updatedBy: string | null;
};

async function savedPlanOf(database: DbOrTx, orgId: string, vehicle: string): Promise<SavedElectricalPlan | null> {
  const saved = await loadElectricalPlan(database, orgId, vehicle);
  if (!saved) return null;
  return { plan: saved.plan, summary: summariseElectricalPlan(saved.plan), version: saved.version, updatedAt: saved.updatedAt.toISOString(), updatedBy: saved.updatedByName };
}

/** GET /api/vehicles/{id}/electrical-plan: the saved plan with its results, or `plan: null`. */
export const electricalPlanQuery = query({
  name: "electrical_plan.read",
  input: z.object({ id: vehicleId }),
  permission: ["read", "MassPlan"],
  run: async ({ user, input }) => {
    const { context } = await contextOrNotFound(db(), user, input.id);
    const saved = await savedPlanOf(db(), user.orgId, context.vehicle.id);
    return { vehicleId: context.vehicle.id, ...(saved ?? { plan: null, summary: null, version: 0, updatedAt: null, updatedBy: null }), caution: ELECTRICAL_CAUTION };
  },
});

/** The save's input: the plan itself (a JSON body, or a form's `plan` field holding JSON) and the vehicle id. */
export const saveElectricalPlanInput = z.preprocess(
  (raw) => {
    if (!raw || typeof raw !== "object") return raw;
    const source = raw as Record<string, unknown>;
    if (typeof source.plan !== "string") return raw;
    try {
      return { ...(JSON.parse(source.plan) as Record<string, unknown>), id: source.id };
    } catch {
      return { id: source.id, plan: Symbol("unreadable") };
    }
  },
  electricalPlanSchema.extend({ id: vehicleId }),
);

/** PUT /api/vehicles/{id}/electrical-plan: replaces the vehicle's current plan, audited. */
export const saveElectricalPlan = command({
  name: "electrical_plan.save",
  input: saveElectricalPlanInput,
  permission: ["manage", "MassPlan"],
  run: async ({ user, input, tx, audit, now }) => {
    const { context } = await vehicleInScope(tx, user, input.id);
    const { id: _vehicle, ...plan } = input;
    // The calculators refuse what the schema cannot see (a day of use no battery can hold): 422 naming the field.
    const summary = summariseElectricalPlan(plan);
    const before = await loadElectricalPlan(tx, user.orgId, context.vehicle.id);
    let rowId: string;
    let version: number;
    if (before) {
      version = before.version + 1;
      await tx
        .update(electricalPlans)
        .set({ plan, version, updatedBy: user.userId, updatedAt: now })
        .where(and(eq(electricalPlans.id, before.id), eq(electricalPlans.orgId, user.orgId)));
      rowId = before.id;
    } else {
      version = 1;
      const [row] = await tx.insert(electricalPlans).values({ orgId: user.orgId, vehicleId: context.vehicle.id, plan, version, updatedBy: user.userId }).returning({ id: electricalPlans.id });
      if (!row) throw new Error("electrical plan insert returned nothing");
      rowId = row.id;
    }
    await audit({
      action: "electrical_plan.save",
      entityType: "electrical_plan",
      entityId: rowId,
      before: before ? { vehicleId: context.vehicle.id, version: before.version, ...before.plan } : null,
      after: { vehicleId: context.vehicle.id, version, ...plan },
    });
    return {
      vehicleId: context.vehicle.id,
      plan,
      summary,
      version,
      updatedAt: now.toISOString(),
      updatedBy: user.name,
      caution: ELECTRICAL_CAUTION,
    };
  },
});

// ─── The tab and the statement ───────────────────────────────────────────────

/** Everything the Mass & fit-out tab shows, for the server-rendered page. */
export const massTabQuery = query({
  name: "mass.tab",
  input: z.object({ id: vehicleId }),
  permission: ["read", "MassPlan"],
  run: async ({ user, input }) => {
    const { context } = await contextOrNotFound(db(), user, input.id);
    const ruleSet = await ruleSetSummary(db(), user.orgId);
    const canPlan = user.ability.can("manage", "MassPlan");
    const canReadTickets = user.ability.can("read", "WeighbridgeTicket");
    const canRecordTicket = user.ability.can("manage", "WeighbridgeTicket");
    const tickets = canReadTickets ? await listTickets(db(), user.orgId, context.vehicle.id) : [];
    const latest = tickets[0];
    return {
      context,
      ruleSet,
      editions: canPlan ? await plannableEditions(db(), user.orgId) : [],
      tickets: tickets.map((t) => ticketView(context.vehicle.id, t)),
      reconciliation: latest ? reconcileTicket(context, latest) : null,
      electricalPlan: await savedPlanOf(db(), user.orgId, context.vehicle.id),
      can: { plan: canPlan, readTickets: canReadTickets, recordTicket: canRecordTicket, readRuleSets: user.ability.can("read", "OrgSettings") },
    };
  },
});

export type MassTabData = Awaited<ReturnType<(typeof massTabQuery)["run"]>>;

// ─── Printable statement ─────────────────────────────────────────────────────

const EVIDENCE_WORDS: Record<MassContext["fitted"][number]["evidenceStatus"], string> = {
  accepted: "Accepted",
  lodged: "Awaiting review",
  rejected: "Rejected",
  none: "None yet",
};

/** The evidence state of a fitted item in words; items whose line asks for none say so. */
export function evidenceWords(item: Pick<MassContext["fitted"][number], "evidenceStatus" | "evidenceNeeded">): string {
  if (item.evidenceStatus === "none" && item.evidenceNeeded.length === 0) return "Not needed";
  return EVIDENCE_WORDS[item.evidenceStatus];
}

export function positionText(item: { xMm: number | null; zone: string | null }): string {
  if (item.xMm !== null) return `${Math.round(item.xMm).toLocaleString("en-AU")} mm`;
  if (item.zone) return ZONE_LABELS[item.zone as keyof typeof ZONE_LABELS] ?? item.zone;
  return "not recorded";
}

export function loadingText(loading: Loading, personMassKg: number): string {
  const parts: string[] = [];
  parts.push(loading.occupants === 0 ? "no occupants" : `${loading.occupants} occupant${loading.occupants === 1 ? "" : "s"} at ${personMassKg} kg`);
  if (loading.fuelL > 0) parts.push(`${loading.fuelL} L extra fuel`);
  if (loading.waterL > 0) parts.push(`${loading.waterL} L water`);
  if (loading.cargoKg > 0) parts.push(`${loading.cargoKg} kg cargo allowance`);
  if (loading.trailerAtmKg > 0) parts.push(`trailer ATM ${loading.trailerAtmKg} kg with ${loading.towballKg} kg on the towball`);
  const text = parts.join(", ");
  return `${text.charAt(0).toUpperCase()}${text.slice(1)}.`;
}

const CHEMISTRY_WORDS: Record<ElectricalPlan["chemistry"], string> = {
  "lead-acid": "flooded lead-acid",
  agm: "AGM",
  "lithium-iron-phosphate": "lithium iron phosphate",
};

/** The saved 12 V plan as the statement prints it. */
export function electricalStatement(saved: SavedElectricalPlan | null, timeZone: string): StatementData["electrical"] {
  if (!saved) return null;
  const { summary, plan } = saved;
  const b = summary.battery;
  const r = summary.recharge;
  const suggested = `for example ${b.suggestedBattery.count > 1 ? `${b.suggestedBattery.count} x ` : ""}${b.suggestedBattery.capacityAhEach} Ah`;
  return {
    systemV: summary.systemV,
    chemistry: CHEMISTRY_WORDS[summary.chemistry],
    daysAutonomy: summary.daysAutonomy,
    consumers: plan.consumers.length,
    dailyAh: b.dailyAh,
    dailyWh: b.dailyWh,
    requiredCapacityAh: b.requiredCapacityAh,
    usableDepthPct: b.usableDepthOfDischargePct,
    suggestedBattery: suggested,
    rechargeText: r
      ? `Charging: ${plan.sources.length} source${plan.sources.length === 1 ? "" : "s"} put in ${r.chargeA.toFixed(1)} A together; the ${summary.daysAutonomy}-day use comes back in ${r.hoursToRecover.toFixed(1)} h of charging${
          r.daysToRecover !== null ? ` (${Math.round(r.dailyAhIn)} Ah a day in against ${Math.round(b.dailyAh)} Ah used: ${r.dailyAhIn >= b.dailyAh ? "keeps up" : "falls behind"})` : ""
        }.`
      : "No charging sources are planned.",
    runs: summary.runs.map((run) => ({
      label: run.label,
      circuit: `${run.circuit}, ${run.maxDropPct} % limit`,
      currentA: run.currentA,
      lengthOneWayM: run.lengthOneWayM,
      size: run.sizeLabel,
      dropV: run.dropV,
      dropPct: run.dropPct,
      withinLimit: run.withinLimit,
      fuseA: run.fuseA,
      fuseLocation: run.fuseLocation,
    })),
    savedText: `Saved plan, version ${saved.version}, ${formatDay(saved.updatedAt, timeZone)}${saved.updatedBy ? ` by ${saved.updatedBy}` : ""}.`,
  };
}

/** GET /api/vehicles/{id}/statement: the data of the printable statement (rendered by the route). */
export const statementQuery = query({
  name: "mass.statement",
  input: vehicleMassQuery.input,
  permission: ["read", "MassPlan"],
  run: async ({ user, input, now }) => {
    const response = await vehicleMassQuery.run({ user, input, now });
    const { context, org } = await contextOrNotFound(db(), user, input.id);
    const settings = context.settings;
    const suspension: StatementData["suspension"] = [];
    if (response.constantByAxle && response.variableByAxle) {
      for (const axle of ["front", "rear"] as const) {
        const constantKg = axle === "front" ? response.constantByAxle.frontKg : response.constantByAxle.rearKg;
        const variableKg = Math.max(0, axle === "front" ? response.variableByAxle.frontKg : response.variableByAxle.rearKg);
        const advice = springAdvice({
          axle,
          constantLoadKg: constantKg,
          variableLoadKg: variableKg,
          springRatedKg: Math.max(0, constantKg),
          margins: { softKg: settings.springSoftMarginKg, stiffKg: settings.springStiffMarginKg },
        });
        suspension.push({
          axle: axle === "front" ? "Front" : "Rear",
          constantKg,
          variableKg,
          suggestedMinKg: advice.suggestedRatingKg.minKg,
          suggestedMaxKg: advice.suggestedRatingKg.maxKg,
        });
      }
    }
    const tyreChecks = response.checks.filter((c) => c.limit === "frontTyres" || c.limit === "rearTyres");
    const data: StatementData = {
      orgName: org.name,
      generatedAt: now,
      timeZone: user.timeZone,
      generatedBy: user.name,
      vehicle: {
        fleetNumber: context.vehicle.fleetNumber,
        registration: context.vehicle.registration,
        vin: context.vehicle.vin,
        platform: response.vehicle.platform,
        depot: context.vehicle.depot,
      },
      loadingText: loadingText(response.loading, settings.personMassKg),
      includePlanned: response.includePlanned,
      baseText:
        response.base?.source === "measured"
          ? "Starting from the last weighbridge ticket (fitted items are in it)."
          : "Starting from the maker's kerb masses (full main tank), plus fitted items.",
      axles: {
        frontKg: response.frontKg ?? null,
        rearKg: response.rearKg ?? null,
        grossKg: response.grossKg ?? null,
        combinationKg: response.combinationKg ?? null,
      },
      checks: response.checks.map((c) => ({ label: LIMIT_LABELS[c.limit], loadKg: c.loadKg, capacityKg: c.capacityKg, headroomKg: c.headroomKg, ok: c.ok })),
      binding: response.binding && response.bindingLabel ? { label: response.bindingLabel, marginKg: response.binding.marginKg } : null,
      payload: response.payload ?? null,
      aboveStandardKg: response.aboveStandardKg ?? null,
      warnings: response.warnings.map((w) => w.message),
      missing: response.missing.map((m) => `Missing: ${m.message}.`),
      tyres: {
        size: context.tyres.size,
        source: context.tyres.source === "fitted" ? "as fitted" : context.tyres.source === "platform" ? "the maker's standard size" : "not recorded",
        loadIndex: context.tyres.loadIndex,
        capacityText: tyreChecks.map(
          (c) => `${LIMIT_LABELS[c.limit]}: carry ${Math.round(c.capacityKg)} kg for an axle load of ${Math.round(c.loadKg)} kg (${c.ok ? "within" : "over"}).`,
        ),
      },
      suspension,
      fitted: context.fitted.map((f) => ({
        code: f.lineCode ?? "Extra",
        label: f.lineCode && f.label.startsWith(f.lineCode) ? f.label.slice(f.lineCode.length).trim() : f.label,
        quantity: f.quantity,
        massKg: f.massKg,
        position: positionText(f),
        evidence: evidenceWords(f),
      })),
      planned: response.planned.map((p) => ({
        label: p.label,
        massKg: p.massKg,
        position: positionText(p),
        kind: p.massKind === "variable" ? "Variable" : "Constant",
      })),
      electrical: electricalStatement(await savedPlanOf(db(), user.orgId, context.vehicle.id), user.timeZone),
      measured: context.measured
        ? { ...context.measured, measuredAt: context.measured.measuredAt ? new Date(context.measured.measuredAt) : null }
        : null,
      ruleSet: { name: response.ruleSet.name, note: response.ruleSet.note, label: RULE_SET_LABEL },
      cautions: [MASS_CAUTION, BRAKE_CAUTION, ELECTRICAL_CAUTION],
    };
    return { data, filename: `mass-statement-${context.vehicle.fleetNumber.replace(/[^A-Za-z0-9-]+/g, "_")}.pdf` };
  },
});
