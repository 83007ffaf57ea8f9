import "server-only";
import { and, asc, eq, inArray, sql } from "drizzle-orm";
import { z } from "zod";
import { platformName } from "@/components/platforms/figures";
import { db, type DbOrTx, type Tx } from "@/db/client";
import { platformOptions } from "@/db/platforms";
import { registerPage } from "@/db/register-cache";
import { depots, editions, memberships, platforms, standards, users, vehicleDrivers, vehicles, VEHICLE_STATES, type VehicleState } from "@/db/schema";
import {
  findVehicle,
  registerFilterOptions,
  READINESS_FILTERS,
  VARIANCE_FILTERS,
  VEHICLE_SORTS,
  type VehicleListParams,
} from "@/db/vehicles";
import { AppError, conflict, notFound, type ErrorDetail } from "@/lib/server/errors";
import { command, query } from "@/lib/server/operation";
import { checkVin } from "@/lib/vin";

// ─── Input pieces ──────────────────────────────────────────────────────────────

const id = z.string({ error: "id is required" }).trim().min(1, { error: "id is required" }).max(64);
/** "" and null mean "none"; absent means "leave as it is". */
const blankToNull = (v: unknown) => (v === "" || (typeof v === "string" && v.trim() === "") ? null : v);
const optionalId = z.preprocess(blankToNull, id.nullable()).optional();
const optionalText = (label: string, max: number) =>
  z.preprocess(blankToNull, z.string().trim().max(max, { error: `${label} is too long (at most ${max} characters)` }).nullable()).optional();
const wholeNumber = (label: string, min: number, max: number, unit = "") =>
  z
    .preprocess(
      (v) => {
        const b = blankToNull(v);
        return typeof b === "string" ? Number(b.replace(/[,\s]/g, "")) : b;
      },
      z
        .number({ error: `${label} must be a number` })
        .int({ error: `${label} must be a whole number` })
        .min(min, { error: `${label} cannot be below ${min.toLocaleString("en-AU")}${unit}` })
        .max(max, { error: `${label} cannot be above ${max.toLocaleString("en-AU")}${unit}` })
        .nullable(),
    )
    .optional();

const dateOnly = z
  .preprocess(
    blankToNull,
    z
      .union([z.string(), z.date()])
      .transform((v, ctx) => {
        const d = v instanceof Date ? v : /^\d{4}-\d{2}-\d{2}$/.test(v.trim()) ? new Date(`${v.trim()}T00:00:00Z`) : new Date(v);
        if (!Number.isFinite(d.getTime())) {
          ctx.addIssue({ code: "custom", message: "Enter a date such as 2027-03-31" });
          return z.NEVER;
        }
        return d;
      })
      .nullable(),
  )
  .optional();

const CHECK_DIGIT_INFO = "The position-9 check digit is not required outside North America, so a mismatch is not an error.";

/** A VIN as typed: structure checked (ISO 3779), problems named by position; "" means none. */
const vinField = z
  .preprocess(
    blankToNull,
    z
      .string({ error: "VIN must be text" })
      .transform((text, ctx) => {
        const result = checkVin(text);
        for (const problem of result.problems) ctx.addIssue({ code: "custom", message: problem.message });
        return result.normalised;
      })
      .nullable(),
  )
  .optional();

const fleetNumberField = z
  .string({ error: "Fleet number is required" })
  .trim()
  .min(1, { error: "Fleet number is required" })
  .max(30, { error: "Fleet number is too long (at most 30 characters)" });

const registrationField = z
  .preprocess(
    blankToNull,
    z
      .string()
      .trim()
      .max(12, { error: "Registration is too long (at most 12 characters)" })
      .transform((v) => v.toUpperCase().replace(/\s+/g, " "))
      .nullable(),
  )
  .optional();

/** States a form may set; grounding and returning to service are their own actions. */
export const EDITABLE_STATES = ["in_service", "in_fitout", "retired"] as const;

const driverIdsField = z
  .preprocess((v) => (v === undefined ? undefined : v === null || v === "" ? [] : Array.isArray(v) ? v.filter((x) => x !== "") : [v]), z.array(id).max(20).optional());

const vehicleFields = {
  vin: vinField,
  registration: registrationField,
  registrationExpiry: dateOnly,
  depotId: optionalId,
  costCentre: optionalText("Cost centre", 40),
  odometerKm: wholeNumber("Odometer", 0, 2_000_000, " km"),
  buildYear: wholeNumber("Build year", 1950, new Date().getUTCFullYear() + 1),
  driverIds: driverIdsField,
  notes: optionalText("Notes", 1000),
};

export const vehicleCreateSchema = z.object({
  fleetNumber: fleetNumberField,
  platformId: z.string({ error: "Choose the platform" }).trim().min(1, { error: "Choose the platform" }).max(64),
  state: z.preprocess(blankToNull, z.enum(EDITABLE_STATES, { error: "Choose in service, in fit-out or retired" }).nullable()).optional(),
  ...vehicleFields,
});

export const vehiclePatchSchema = z.object({
  id,
  version: z.coerce.number({ error: "version is required" }).int().min(1, { error: "version is required" }),
  fleetNumber: fleetNumberField.optional(),
  platformId: z.string().trim().min(1, { error: "Choose the platform" }).max(64).optional(),
  state: z.preprocess(blankToNull, z.enum(EDITABLE_STATES, { error: "Choose in service, in fit-out or retired" }).nullable()).optional(),
  ...vehicleFields,
});

export const vehicleListSchema = z.object({
  page: z.preprocess(blankToNull, z.coerce.number({ error: "page must be a whole number" }).int({ error: "page must be a whole number" }).min(1, { error: "page starts at 1" }).nullable())
    .transform((v) => v ?? 1)
    .optional()
    .default(1),
  pageSize: z
    .preprocess(blankToNull, z.coerce.number({ error: "pageSize must be a whole number" }).int({ error: "pageSize must be a whole number" }).min(1, { error: "pageSize is at least 1" }).max(100, { error: "pageSize is at most 100" }).nullable())
    .transform((v) => v ?? 25)
    .optional()
    .default(25),
  sort: z.preprocess(blankToNull, z.enum(VEHICLE_SORTS, { error: `sort is one of ${VEHICLE_SORTS.join(", ")}` }).nullable()).transform((v) => v ?? "fleetNumber").optional().default("fleetNumber"),
  dir: z.preprocess(blankToNull, z.enum(["asc", "desc"], { error: "dir is asc or desc" }).nullable()).transform((v) => v ?? "asc").optional().default("asc"),
  depotId: z.preprocess(blankToNull, id.nullable()).transform((v) => v ?? undefined).optional(),
  platformId: z.preprocess(blankToNull, id.nullable()).transform((v) => v ?? undefined).optional(),
  editionId: z.preprocess(blankToNull, id.nullable()).transform((v) => v ?? undefined).optional(),
  standardId: z.preprocess(blankToNull, id.nullable()).transform((v) => v ?? undefined).optional(),
  state: z.preprocess(blankToNull, z.enum(VEHICLE_STATES, { error: `state is one of ${VEHICLE_STATES.join(", ")}` }).nullable()).transform((v) => v ?? undefined).optional(),
  variance: z.preprocess(blankToNull, z.enum(VARIANCE_FILTERS, { error: `variance is one of ${VARIANCE_FILTERS.join(", ")}` }).nullable()).transform((v) => v ?? undefined).optional(),
  readiness: z.preprocess(blankToNull, z.enum(READINESS_FILTERS, { error: `readiness is one of ${READINESS_FILTERS.join(", ")}` }).nullable()).transform((v) => v ?? undefined).optional(),
  q: z.preprocess(blankToNull, z.string().trim().max(100, { error: "search is at most 100 characters" }).nullable()).transform((v) => v ?? undefined).optional(),
});

// ─── Reads ─────────────────────────────────────────────────────────────────────

function vinReport(vin: string | null) {
  if (!vin) return null;
  const result = checkVin(vin);
  return {
    structureOk: result.structureOk,
    problems: result.problems,
    checkDigit: result.checkDigit
      ? { expected: result.checkDigit.expected, actual: result.checkDigit.actual, matches: result.checkDigit.matches, note: CHECK_DIGIT_INFO }
      : null,
  };
}

export const getVehicle = query({
  name: "vehicle.read",
  input: z.object({ id: z.string().min(1).max(64) }),
  permission: ["read", "Vehicle"],
  run: async ({ user, input }) => {
    const found = await findVehicle(db(), user, input.id);
    if (!found) throw notFound("That vehicle");
    const { vehicle, platform, depotName, drivers } = found;
    const edition = vehicle.editionId
      ? ((await db()
          .select({ id: editions.id, number: editions.number, status: editions.status, standardId: standards.id, standardName: standards.name })
          .from(editions)
          .innerJoin(standards, eq(standards.id, editions.standardId))
          .where(and(eq(editions.id, vehicle.editionId), eq(editions.orgId, user.orgId)))
          .limit(1))[0] ?? null)
      : null;
    return {
      id: vehicle.id,
      fleetNumber: vehicle.fleetNumber,
      vin: vehicle.vin,
      vinCheck: vinReport(vehicle.vin),
      registration: vehicle.registration,
      registrationExpiry: vehicle.registrationExpiry,
      state: vehicle.state,
      groundedReason: vehicle.groundedReason,
      odometerKm: vehicle.odometerKm,
      buildYear: vehicle.buildYear,
      costCentre: vehicle.costCentre,
      notes: vehicle.notes,
      depot: depotName,
      depotId: vehicle.depotId,
      platform: {
        ...platform,
        name: platformName(platform),
      },
      edition,
      measured:
        vehicle.measuredGrossKg !== null || vehicle.measuredFrontKg !== null || vehicle.measuredRearKg !== null
          ? { frontKg: vehicle.measuredFrontKg, rearKg: vehicle.measuredRearKg, grossKg: vehicle.measuredGrossKg, measuredAt: vehicle.measuredAt }
          : null,
      drivers,
      version: vehicle.version,
      updatedAt: vehicle.updatedAt,
    };
  },
});

export type VehicleDetails = Awaited<ReturnType<typeof getVehicle.run>>;

export const listVehicles = query({
  name: "vehicle.list",
  input: vehicleListSchema,
  permission: ["read", "Vehicle"],
  run: async ({ user, input, now }) => registerPage(db(), user, input as VehicleListParams, now),
});

/** What the register's filters and bulk actions offer to this user. */
export const registerOptions = query({
  name: "vehicle.register_options",
  input: z.object({}).passthrough(),
  permission: ["read", "Vehicle"],
  run: async ({ user }) => {
    const [filters, platformList] = await Promise.all([registerFilterOptions(db(), user), platformOptions(db(), user)]);
    return { ...filters, platforms: platformList.map((p) => ({ id: p.id, name: platformName(p) })) };
  },
});

async function activeDrivers(tx: DbOrTx, orgId: string) {
  return tx
    .select({ id: users.id, name: users.name, email: users.email })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(and(eq(memberships.orgId, orgId), eq(memberships.role, "driver"), eq(memberships.active, true)))
    .orderBy(asc(users.name));
}

/** The choices of the vehicle form: platforms, depots and the organisation's drivers. */
export const vehicleFormOptions = query({
  name: "vehicle.form_options",
  input: z.object({}).passthrough(),
  permission: ["manage", "Vehicle"],
  run: async ({ user }) => {
    const [platformList, depotList, drivers] = await Promise.all([
      platformOptions(db(), user),
      db().select({ id: depots.id, name: depots.name, code: depots.code }).from(depots).where(eq(depots.orgId, user.orgId)).orderBy(asc(depots.name)),
      activeDrivers(db(), user.orgId),
    ]);
    return {
      platforms: platformList.map((p) => ({ id: p.id, name: platformName(p), ratingsMissing: p.ratingsMissing })),
      depots: depotList,
      drivers,
    };
  },
});

// ─── Checks shared by create and edit ──────────────────────────────────────────

async function checkReferences(
  tx: Tx,
  orgId: string,
  refs: { platformId?: string | null; depotId?: string | null; driverIds?: string[] | undefined },
): Promise<void> {
  const problems: ErrorDetail[] = [];
  if (refs.platformId) {
    const p = await tx.query.platforms.findFirst({ where: and(eq(platforms.id, refs.platformId), eq(platforms.orgId, orgId)) });
    if (!p) problems.push({ field: "platformId", message: "Choose a platform from the list" });
  }
  if (refs.depotId) {
    const d = await tx.query.depots.findFirst({ where: and(eq(depots.id, refs.depotId), eq(depots.orgId, orgId)) });
    if (!d) problems.push({ field: "depotId", message: "Choose a depot of this organisation" });
  }
  if (refs.driverIds && refs.driverIds.length > 0) {
    const known = new Set((await activeDrivers(tx, orgId)).map((d) => d.id));
    const unknown = refs.driverIds.filter((d) => !known.has(d));
    if (unknown.length > 0) problems.push({ field: "driverIds", message: "Only active drivers of this organisation can be assigned" });
  }
  if (problems.length > 0) throw new AppError("validation_failed", problems[0]!.message, problems);
}

async function refuseDuplicates(tx: Tx, orgId: string, values: { fleetNumber?: string; vin?: string | null }, exceptId?: string) {
  const problems: ErrorDetail[] = [];
  if (values.fleetNumber) {
    const [clash] = await tx
      .select({ id: vehicles.id, fleetNumber: vehicles.fleetNumber })
      .from(vehicles)
      .where(and(eq(vehicles.orgId, orgId), sql`lower(${vehicles.fleetNumber}) = lower(${values.fleetNumber})`))
      .limit(1);
    if (clash && clash.id !== exceptId) {
      problems.push({ field: "fleetNumber", message: `Fleet number ${clash.fleetNumber} is already used by another vehicle in this organisation` });
    }
  }
  if (values.vin) {
    const [clash] = await tx
      .select({ id: vehicles.id, fleetNumber: vehicles.fleetNumber })
      .from(vehicles)
      .where(and(eq(vehicles.orgId, orgId), eq(vehicles.vin, values.vin)))
      .limit(1);
    if (clash && clash.id !== exceptId) problems.push({ field: "vin", message: `This VIN is already recorded on ${clash.fleetNumber}` });
  }
  if (problems.length > 0) throw new AppError("conflict", problems[0]!.message, problems);
}

/** in service ⇄ in fit-out; any → retired; grounded leaves only by "return to service". */
function refuseStateMove(from: VehicleState, to: VehicleState): void {
  if (from === to) return;
  if (from === "retired") throw new AppError("conflict", "A retired vehicle stays retired", [{ field: "state", message: "A retired vehicle stays retired" }]);
  if (from === "grounded" && to !== "retired") {
    throw new AppError("conflict", "A grounded vehicle goes back into service with “Return to service”, which needs a reason", [
      { field: "state", message: "Use “Return to service” on the vehicle's page; it needs a reason" },
    ]);
  }
}

async function replaceDrivers(tx: Tx, vehicleId: string, driverIds: string[]) {
  await tx.delete(vehicleDrivers).where(eq(vehicleDrivers.vehicleId, vehicleId));
  const unique = [...new Set(driverIds)];
  if (unique.length > 0) await tx.insert(vehicleDrivers).values(unique.map((userId) => ({ vehicleId, userId })));
}

async function driverIdsOf(tx: Tx, vehicleId: string): Promise<string[]> {
  const rows = await tx.select({ userId: vehicleDrivers.userId }).from(vehicleDrivers).where(eq(vehicleDrivers.vehicleId, vehicleId));
  return rows.map((r) => r.userId).sort();
}

const STALE = "This vehicle was changed by someone else since you opened it. Reload the page to see their changes, then make yours again.";

// ─── Writes ────────────────────────────────────────────────────────────────────

export const createVehicle = command({
  name: "vehicle.create",
  input: vehicleCreateSchema,
  permission: ["manage", "Vehicle"],
  run: async ({ user, input, tx, audit }) => {
    await checkReferences(tx, user.orgId, input);
    await refuseDuplicates(tx, user.orgId, input);
    const values = {
      orgId: user.orgId,
      fleetNumber: input.fleetNumber,
      vin: input.vin ?? null,
      registration: input.registration ?? null,
      registrationExpiry: input.registrationExpiry ?? null,
      platformId: input.platformId,
      depotId: input.depotId ?? null,
      costCentre: input.costCentre ?? null,
      state: input.state ?? "in_service",
      odometerKm: input.odometerKm ?? null,
      buildYear: input.buildYear ?? null,
      notes: input.notes ?? null,
    } satisfies typeof vehicles.$inferInsert;
    const [created] = await tx.insert(vehicles).values(values).returning();
    if (!created) throw new Error("vehicle insert returned nothing");
    const driverIds = input.driverIds ?? [];
    await replaceDrivers(tx, created.id, driverIds);
    await audit({ action: "vehicle.create", entityType: "vehicle", entityId: created.id, after: { ...values, driverIds } });
    return { id: created.id, fleetNumber: created.fleetNumber, version: created.version, vinCheck: vinReport(created.vin) };
  },
});

export const updateVehicle = command({
  name: "vehicle.update",
  input: vehiclePatchSchema,
  permission: ["manage", "Vehicle"],
  run: async ({ user, input, tx, audit }) => {
    const before = await tx.query.vehicles.findFirst({ where: and(eq(vehicles.id, input.id), eq(vehicles.orgId, user.orgId)) });
    if (!before) throw notFound("That vehicle");
    if (before.version !== input.version) throw conflict(STALE);
    if (input.state) refuseStateMove(before.state, input.state);
    await checkReferences(tx, user.orgId, input);
    await refuseDuplicates(tx, user.orgId, { fleetNumber: input.fleetNumber, vin: input.vin }, before.id);

    const pick = <K extends keyof typeof before>(key: K, value: (typeof before)[K] | undefined) => (value === undefined ? before[key] : value);
    const next = {
      fleetNumber: pick("fleetNumber", input.fleetNumber),
      vin: pick("vin", input.vin),
      registration: pick("registration", input.registration),
      registrationExpiry: pick("registrationExpiry", input.registrationExpiry),
      platformId: pick("platformId", input.platformId),
      depotId: pick("depotId", input.depotId),
      costCentre: pick("costCentre", input.costCentre),
      state: input.state ?? before.state,
      odometerKm: pick("odometerKm", input.odometerKm),
      buildYear: pick("buildYear", input.buildYear),
      notes: pick("notes", input.notes),
    };
    // Retiring a grounded vehicle ends its grounding.
    const groundedReason = next.state === "grounded" ? before.groundedReason : null;
    const updated = await tx
      .update(vehicles)
      .set({ ...next, groundedReason, version: sql`${vehicles.version} + 1` })
      .where(and(eq(vehicles.id, before.id), eq(vehicles.version, input.version)))
      .returning({ version: vehicles.version });
    if (updated.length === 0) throw conflict(STALE);

    const driversBefore = await driverIdsOf(tx, before.id);
    if (input.driverIds !== undefined) await replaceDrivers(tx, before.id, input.driverIds);
    const driversAfter = input.driverIds === undefined ? driversBefore : [...new Set(input.driverIds)].sort();

    const changedBefore: Record<string, unknown> = {};
    const changedAfter: Record<string, unknown> = {};
    for (const [key, value] of Object.entries(next)) {
      const old = before[key as keyof typeof before];
      const same = old instanceof Date && value instanceof Date ? old.getTime() === value.getTime() : old === value;
      if (!same) {
        changedBefore[key] = old;
        changedAfter[key] = value;
      }
    }
    if (driversBefore.join() !== driversAfter.join()) {
      changedBefore.driverIds = driversBefore;
      changedAfter.driverIds = driversAfter;
    }
    await audit({ action: "vehicle.update", entityType: "vehicle", entityId: before.id, before: changedBefore, after: changedAfter });
    return { id: before.id, version: updated[0]!.version, changed: Object.keys(changedAfter), vinCheck: vinReport(next.vin) };
  },
});

export const bulkVehicleSchema = z
  .object({
    action: z.enum(["assign_edition", "move_depot"], { error: "action is assign_edition or move_depot" }),
    vehicleIds: z.array(id, { error: "vehicleIds is a list of vehicle ids" }).min(1, { error: "Choose at least one vehicle" }).max(1000, { error: "At most 1,000 vehicles at once" }),
    editionId: id.optional(),
    depotId: id.optional(),
  })
  .superRefine((v, ctx) => {
    if (v.action === "assign_edition" && !v.editionId) ctx.addIssue({ code: "custom", path: ["editionId"], message: "Choose the edition to assign" });
    if (v.action === "move_depot" && !v.depotId) ctx.addIssue({ code: "custom", path: ["depotId"], message: "Choose the depot to move to" });
  });

/** Assign an edition to, or move to a depot, many vehicles at once: all or nothing, one audit entry per vehicle changed. */
export const bulkUpdateVehicles = command({
  name: "vehicle.bulk",
  input: bulkVehicleSchema,
  permission: ["manage", "Vehicle"],
  run: async ({ user, input, tx, audit }) => {
    const ids = [...new Set(input.vehicleIds)];
    const found = await tx
      .select({ id: vehicles.id, fleetNumber: vehicles.fleetNumber, editionId: vehicles.editionId, depotId: vehicles.depotId })
      .from(vehicles)
      .where(and(eq(vehicles.orgId, user.orgId), inArray(vehicles.id, ids)));
    if (found.length !== ids.length) {
      const known = new Set(found.map((f) => f.id));
      const details = input.vehicleIds
        .map((v, i) => ({ v, i }))
        .filter(({ v }) => !known.has(v))
        .map(({ i }) => ({ field: `vehicleIds.${i}`, message: "No such vehicle in this organisation" }));
      const missing = ids.length - found.length;
      throw new AppError("not_found", `${missing} of the ${ids.length} chosen vehicles ${missing === 1 ? "was" : "were"} not found; nothing was changed`, details);
    }
    let target: { editionId: string } | { depotId: string };
    let label: string;
    if (input.action === "assign_edition") {
      const [edition] = await tx
        .select({ id: editions.id, number: editions.number, status: editions.status, standardName: standards.name })
        .from(editions)
        .innerJoin(standards, eq(standards.id, editions.standardId))
        .where(and(eq(editions.id, input.editionId!), eq(editions.orgId, user.orgId)))
        .limit(1);
      if (!edition) throw new AppError("not_found", "That edition was not found", [{ field: "editionId", message: "Choose an edition of this organisation" }]);
      if (edition.status !== "published") {
        throw new AppError("conflict", `Edition ${edition.number} of ${edition.standardName} is ${edition.status === "draft" ? "a draft" : "retired"}; only a published edition can be assigned`, [
          { field: "editionId", message: "Choose a published edition" },
        ]);
      }
      target = { editionId: edition.id };
      label = `${edition.standardName} edition ${edition.number}`;
    } else {
      const depot = await tx.query.depots.findFirst({ where: and(eq(depots.id, input.depotId!), eq(depots.orgId, user.orgId)) });
      if (!depot) throw new AppError("not_found", "That depot was not found", [{ field: "depotId", message: "Choose a depot of this organisation" }]);
      target = { depotId: depot.id };
      label = depot.name;
    }
    const key = input.action === "assign_edition" ? "editionId" : "depotId";
    const value = "editionId" in target ? target.editionId : target.depotId;
    const changing = found.filter((v) => v[key] !== value);
    if (changing.length > 0) {
      await tx
        .update(vehicles)
        .set({ [key]: value, version: sql`${vehicles.version} + 1`, updatedAt: new Date() })
        .where(and(eq(vehicles.orgId, user.orgId), inArray(vehicles.id, changing.map((v) => v.id))));
      for (const v of changing) {
        await audit({
          action: input.action === "assign_edition" ? "vehicle.assign_edition" : "vehicle.move_depot",
          entityType: "vehicle",
          entityId: v.id,
          before: { [key]: v[key] },
          after: { [key]: value },
        });
      }
    } else {
      // Nothing to change is still a request someone made: record it once.
      await audit({ action: `vehicle.bulk_${input.action}`, entityType: "vehicle", entityId: null, after: { [key]: value, unchanged: found.length } });
    }
    return { action: input.action, target: label, requested: ids.length, updated: changing.length, unchanged: found.length - changing.length };
  },
});

const reasonField = (what: string) =>
  z
    .string({ error: `Give the reason for ${what}` })
    .trim()
    .min(3, { error: `Give the reason for ${what}` })
    .max(300, { error: "Keep the reason under 300 characters" });

export const groundVehicle = command({
  name: "vehicle.ground",
  input: z.object({ id, reason: reasonField("grounding the vehicle") }),
  permission: ["manage", "Grounding"],
  run: async ({ user, input, tx, audit }) => {
    const before = await tx.query.vehicles.findFirst({ where: and(eq(vehicles.id, input.id), eq(vehicles.orgId, user.orgId)) });
    if (!before) throw notFound("That vehicle");
    if (before.state === "grounded") throw conflict(`${before.fleetNumber} is already grounded: ${before.groundedReason ?? "no reason recorded"}`);
    if (before.state === "retired") throw conflict(`${before.fleetNumber} is retired; a retired vehicle cannot be grounded`);
    const updated = await tx
      .update(vehicles)
      .set({ state: "grounded", groundedReason: input.reason, version: sql`${vehicles.version} + 1` })
      .where(and(eq(vehicles.id, before.id), eq(vehicles.state, before.state)))
      .returning({ version: vehicles.version });
    if (updated.length === 0) throw conflict(`${before.fleetNumber} was changed by someone else a moment ago; reload to see its state`);
    await audit({
      action: "vehicle.ground",
      entityType: "vehicle",
      entityId: before.id,
      before: { state: before.state },
      after: { state: "grounded", groundedReason: input.reason },
      reason: input.reason,
    });
    return { id: before.id, state: "grounded" as const, version: updated[0]!.version };
  },
});

export const returnVehicleToService = command({
  name: "vehicle.return_to_service",
  input: z.object({ id, reason: reasonField("returning the vehicle to service") }),
  permission: ["manage", "Grounding"],
  run: async ({ user, input, tx, audit }) => {
    const before = await tx.query.vehicles.findFirst({ where: and(eq(vehicles.id, input.id), eq(vehicles.orgId, user.orgId)) });
    if (!before) throw notFound("That vehicle");
    if (before.state !== "grounded") throw conflict(`${before.fleetNumber} is not grounded, so it cannot be returned to service`);
    const updated = await tx
      .update(vehicles)
      .set({ state: "in_service", groundedReason: null, version: sql`${vehicles.version} + 1` })
      .where(and(eq(vehicles.id, before.id), eq(vehicles.state, "grounded")))
      .returning({ version: vehicles.version });
    if (updated.length === 0) throw conflict(`${before.fleetNumber} was changed by someone else a moment ago; reload to see its state`);
    await audit({
      action: "vehicle.return_to_service",
      entityType: "vehicle",
      entityId: before.id,
      before: { state: "grounded", groundedReason: before.groundedReason },
      after: { state: "in_service" },
      reason: input.reason,
    });
    return { id: before.id, state: "in_service" as const, version: updated[0]!.version };
  },
});
