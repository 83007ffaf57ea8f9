import { and, asc, desc, eq, inArray, isNull, or } from "drizzle-orm";
import type { FittedItem, MassContext, PlannedItem, PlanZone } from "@/components/mass/model";
import type { Actor } from "@/lib/permissions";
import type { DbOrTx } from "./client";
import { electricalPlanSchema, type ElectricalPlan } from "@/lib/electrical/plan";
import { editionLines, editions, electricalPlans, evidence, fitments, jobs, organisations, plannedItems, standards, users, weighbridgeTickets } from "./schema";
import { findVehicle } from "./vehicles";

type EvidenceState = FittedItem["evidenceStatus"];
const EVIDENCE_RANK: Record<EvidenceState, number> = { none: 0, rejected: 1, lodged: 2, accepted: 3 };

/** A fitted brake upgrade, by its name ("brake upgrade", "upgraded brakes", "brake kit"); an assessment is not one. */
const BRAKE_UPGRADE = /\bbrakes?\s+(upgrade|kit|package)|\bupgraded\s+brakes?\b|\bbig[- ]brake/i;
const NOT_FITTED_WORK = /\bassess|\bquote|\binspection/i;

function numberAttr(attrs: Record<string, number | string>, key: string): number | null {
  const v = attrs[key];
  if (typeof v === "number" && Number.isFinite(v)) return v;
  if (typeof v === "string" && v.trim() !== "" && Number.isFinite(Number(v))) return Number(v);
  return null;
}

export function toPlannedItem(row: typeof plannedItems.$inferSelect): PlannedItem {
  return { id: row.id, label: row.label, massKg: row.massKg, xMm: row.xMm, zone: row.zone as PlanZone | null, massKind: row.massKind };
}

/** The vehicle's planned (what-if) items, oldest first. */
export async function listPlannedItems(db: DbOrTx, orgId: string, vehicleId: string): Promise<PlannedItem[]> {
  const rows = await db
    .select()
    .from(plannedItems)
    .where(and(eq(plannedItems.orgId, orgId), eq(plannedItems.vehicleId, vehicleId)))
    .orderBy(asc(plannedItems.createdAt), asc(plannedItems.id));
  return rows.map(toPlannedItem);
}

/**
 * Everything the mass computation needs about one vehicle the actor may see, or null (another
 * organisation's vehicle, or one not assigned to a driver or contractor, is simply not found).
 */
export async function loadMassContext(db: DbOrTx, actor: Actor, vehicleId: string) {
  const found = await findVehicle(db, actor, vehicleId);
  if (!found) return null;
  const { vehicle, platform, depotName } = found;
  const org = await db.query.organisations.findFirst({ where: eq(organisations.id, actor.orgId) });
  if (!org) return null;

  const fitmentRows = await db
    .select()
    .from(fitments)
    .where(and(eq(fitments.orgId, actor.orgId), eq(fitments.vehicleId, vehicle.id), isNull(fitments.removedAt)))
    .orderBy(asc(fitments.fittedAt), asc(fitments.id));

  // Lines of the vehicle's edition, by key: a linked fitment takes its line's figures.
  const lines = vehicle.editionId
    ? await db.select().from(editionLines).where(and(eq(editionLines.orgId, actor.orgId), eq(editionLines.editionId, vehicle.editionId)))
    : [];
  const lineByKey = new Map(lines.map((l) => [l.key, l]));

  // Evidence by fitment, or by line key on this vehicle's jobs.
  const fitmentIds = fitmentRows.map((f) => f.id);
  const evidenceRows =
    fitmentIds.length === 0
      ? []
      : await db
          .select({ fitmentId: evidence.fitmentId, lineKey: evidence.lineKey, status: evidence.status, jobVehicleId: jobs.vehicleId })
          .from(evidence)
          .leftJoin(jobs, eq(jobs.id, evidence.jobId))
          .where(
            and(
              eq(evidence.orgId, actor.orgId),
              or(inArray(evidence.fitmentId, fitmentIds), and(eq(jobs.vehicleId, vehicle.id), inArray(evidence.lineKey, fitmentRows.map((f) => f.lineKey ?? "__none__")))),
            ),
          );
  const best = (current: EvidenceState, next: EvidenceState) => (EVIDENCE_RANK[next] > EVIDENCE_RANK[current] ? next : current);

  let tyres: MassContext["tyres"] = { size: platform.standardTyreSize, source: platform.standardTyreSize ? "platform" : null, loadIndex: null };
  // The road tyres are the tyre fitment with the most tyres (a spare is one).
  let tyreQuantity = 0;
  let brakeUpgradeFitted = false;

  const fitted: FittedItem[] = fitmentRows.map((f) => {
    const line = f.lineKey ? lineByKey.get(f.lineKey) : undefined;
    let evidenceStatus: EvidenceState = "none";
    for (const e of evidenceRows) {
      if (e.fitmentId === f.id || (f.lineKey && e.lineKey === f.lineKey && e.jobVehicleId === vehicle.id)) {
        evidenceStatus = best(evidenceStatus, e.status);
      }
    }
    const attributes = f.attributes ?? {};
    const perUnitKg = line ? line.massKg : f.massKg;
    const massKg = perUnitKg === null || perUnitKg === undefined ? null : perUnitKg * f.quantity;
    const item: FittedItem = {
      id: f.id,
      label: line ? `${line.code} ${line.title}` : f.label,
      lineKey: f.lineKey,
      lineCode: line?.code ?? null,
      category: line?.category ?? null,
      quantity: f.quantity,
      massKg,
      xMm: line ? line.xMm : f.xMm,
      zone: (line ? line.zone : f.zone) as PlanZone | null,
      massKind: (line ? line.massKind : f.massKind) ?? "constant",
      fittedAt: f.fittedAt.toISOString(),
      attributes,
      evidenceNeeded: line ? [...line.evidenceNeeded] : [],
      evidenceStatus,
    };
    const tyreSize = typeof attributes.tyreSize === "string" && attributes.tyreSize.trim() !== "" ? attributes.tyreSize.trim() : null;
    if ((tyreSize || (line?.category === "tyres" && numberAttr(attributes, "loadIndex") !== null)) && f.quantity > tyreQuantity) {
      tyreQuantity = f.quantity;
      tyres = {
        size: tyreSize ?? tyres.size,
        source: tyreSize ? "fitted" : tyres.source,
        loadIndex: numberAttr(attributes, "loadIndex"),
      };
    }
    const words = `${f.label} ${line?.title ?? ""}`;
    if ((BRAKE_UPGRADE.test(words) && !NOT_FITTED_WORK.test(words)) || attributes.brakeUpgrade === "yes" || attributes.brakeUpgrade === 1) {
      brakeUpgradeFitted = true;
    }
    return item;
  });

  // Lines in code order, then extras by name: the order people read a fit-out in.
  fitted.sort((a, b) => (a.lineCode === null) !== (b.lineCode === null) ? (a.lineCode === null ? 1 : -1) : (a.lineCode ?? a.label).localeCompare(b.lineCode ?? b.label));
  const planned = await listPlannedItems(db, actor.orgId, vehicle.id);

  const context: MassContext = {
    vehicle: { id: vehicle.id, fleetNumber: vehicle.fleetNumber, registration: vehicle.registration, vin: vehicle.vin, depot: depotName ?? null },
    platform: {
      make: platform.make,
      model: platform.model,
      variant: platform.variant,
      kerbMassKg: platform.kerbMassKg,
      kerbFrontKg: platform.kerbFrontKg,
      gvmKg: platform.gvmKg,
      gcmKg: platform.gcmKg,
      frontAxleRatingKg: platform.frontAxleRatingKg,
      rearAxleRatingKg: platform.rearAxleRatingKg,
      wheelbaseMm: platform.wheelbaseMm,
      rearOverhangMm: platform.rearOverhangMm,
      towingCapacityKg: platform.towingCapacityKg,
      towballLimitKg: platform.towballLimitKg,
      roofStaticKg: platform.roofStaticKg,
      roofDynamicKg: platform.roofDynamicKg,
      standardTyreSize: platform.standardTyreSize,
      fuelCapacityL: platform.fuelCapacityL,
      topSpeedKmh: platform.topSpeedKmh,
    },
    measured:
      vehicle.measuredFrontKg !== null && vehicle.measuredRearKg !== null
        ? {
            frontKg: vehicle.measuredFrontKg,
            rearKg: vehicle.measuredRearKg,
            grossKg: vehicle.measuredGrossKg,
            measuredAt: vehicle.measuredAt ? vehicle.measuredAt.toISOString() : null,
          }
        : null,
    fitted,
    planned,
    settings: {
      personMassKg: org.personMassKg,
      brakeWarningMarginKg: org.brakeWarningMarginKg,
      springSoftMarginKg: org.springSoftMarginKg,
      springStiffMarginKg: org.springStiffMarginKg,
      weighbridgeToleranceKg: org.weighbridgeToleranceKg,
    },
    tyres,
    brakeUpgradeFitted,
  };
  return { context, vehicle, platform, org };
}

/** Editions of the organisation that can be planned onto a vehicle: drafts first, then published. */
export async function plannableEditions(db: DbOrTx, orgId: string) {
  const rows = await db
    .select({ id: editions.id, number: editions.number, status: editions.status, standardName: standards.name })
    .from(editions)
    .innerJoin(standards, eq(standards.id, editions.standardId))
    .where(and(eq(editions.orgId, orgId), inArray(editions.status, ["draft", "published"])))
    .orderBy(asc(standards.name), desc(editions.number));
  return rows
    .map((r) => ({ ...r, label: `${r.standardName} — edition ${r.number} (${r.status === "draft" ? "draft" : "published"})` }))
    .sort((a, b) => (a.status === b.status ? 0 : a.status === "draft" ? -1 : 1));
}

/**
 * The must-fit lines of an edition this vehicle is short of (fitted quantity below the line's),
 * as planned items with the missing quantity's mass. Null when the edition is not the
 * organisation's. Lines without mass add nothing and are left out.
 */
export async function editionShortLines(db: DbOrTx, orgId: string, editionId: string, fitted: FittedItem[]) {
  const edition = await db
    .select({ id: editions.id, number: editions.number, status: editions.status, standardName: standards.name })
    .from(editions)
    .innerJoin(standards, eq(standards.id, editions.standardId))
    .where(and(eq(editions.id, editionId), eq(editions.orgId, orgId)))
    .limit(1);
  const head = edition[0];
  if (!head) return null;
  const lines = await db
    .select()
    .from(editionLines)
    .where(and(eq(editionLines.editionId, head.id), eq(editionLines.orgId, orgId), eq(editionLines.requirement, "must_fit")))
    .orderBy(asc(editionLines.sortOrder), asc(editionLines.code));
  const fittedByKey = new Map<string, number>();
  for (const f of fitted) if (f.lineKey) fittedByKey.set(f.lineKey, (fittedByKey.get(f.lineKey) ?? 0) + f.quantity);
  const items: PlannedItem[] = [];
  for (const line of lines) {
    const missing = line.quantity - (fittedByKey.get(line.key) ?? 0);
    if (missing <= 0 || line.massKg <= 0) continue;
    items.push({
      id: `line:${line.id}`,
      label: `${line.code} ${line.title}${missing > 1 ? ` × ${missing}` : ""}`,
      massKg: line.massKg * missing,
      xMm: line.xMm,
      zone: line.zone as PlanZone | null,
      massKind: line.massKind,
    });
  }
  return { edition: { ...head, label: `${head.standardName} — edition ${head.number}` }, items };
}

/** The vehicle's weighbridge tickets, newest first, each with its attached file's facts (or null). */
export async function listTickets(db: DbOrTx, orgId: string, vehicleId: string) {
  const rows = await db
    .select({
      ticket: weighbridgeTickets,
      fileId: evidence.id,
      filename: evidence.filename,
      contentType: evidence.contentType,
      sizeBytes: evidence.sizeBytes,
      sha256: evidence.sha256,
    })
    .from(weighbridgeTickets)
    .leftJoin(evidence, and(eq(evidence.id, weighbridgeTickets.evidenceId), eq(evidence.orgId, orgId)))
    .where(and(eq(weighbridgeTickets.orgId, orgId), eq(weighbridgeTickets.vehicleId, vehicleId)))
    .orderBy(desc(weighbridgeTickets.weighedAt), desc(weighbridgeTickets.createdAt))
    .limit(50);
  return rows.map((r) => ({
    ...r.ticket,
    file:
      r.fileId && r.filename && r.contentType && r.sizeBytes !== null && r.sha256
        ? { id: r.fileId, filename: r.filename, contentType: r.contentType, sizeBytes: r.sizeBytes, sha256: r.sha256 }
        : null,
  }));
}

/** The stored file of one ticket of one vehicle in the organisation, or null. */
export async function ticketFileRow(db: DbOrTx, orgId: string, vehicleId: string, ticketId: string) {
  const [row] = await db
    .select({ storageKey: evidence.storageKey, filename: evidence.filename, contentType: evidence.contentType, sha256: evidence.sha256 })
    .from(weighbridgeTickets)
    .innerJoin(evidence, and(eq(evidence.id, weighbridgeTickets.evidenceId), eq(evidence.orgId, orgId)))
    .where(and(eq(weighbridgeTickets.id, ticketId), eq(weighbridgeTickets.orgId, orgId), eq(weighbridgeTickets.vehicleId, vehicleId)))
    .limit(1);
  return row ?? null;
}

/**
 * The vehicle's saved 12 V plan, or null. The stored document is checked again on the way out: a
 * row that no longer passes the schema is treated as no plan rather than shown half-read.
 */
export async function loadElectricalPlan(db: DbOrTx, orgId: string, vehicleId: string) {
  const [row] = await db
    .select({ row: electricalPlans, updatedByName: users.name })
    .from(electricalPlans)
    .leftJoin(users, eq(users.id, electricalPlans.updatedBy))
    .where(and(eq(electricalPlans.orgId, orgId), eq(electricalPlans.vehicleId, vehicleId)))
    .limit(1);
  if (!row) return null;
  const parsed = electricalPlanSchema.safeParse(row.row.plan);
  if (!parsed.success) return null;
  return { id: row.row.id, plan: parsed.data as ElectricalPlan, version: row.row.version, updatedAt: row.row.updatedAt, updatedByName: row.updatedByName ?? null };
}
