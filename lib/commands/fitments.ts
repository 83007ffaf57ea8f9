import "server-only";
import { and, eq } from "drizzle-orm";
import { z } from "zod";
import { db, type DbOrTx } from "@/db/client";
import { findFitment, listVehicleConcessions, listVehicleFitments } from "@/db/fitments";
import { concessions, editionLines, fitments, vehicles, ZONES } from "@/db/schema";
import { vehicleScope } from "@/db/scope";
import { addMonths } from "@/lib/readiness";
import { AppError, conflict, notFound } from "@/lib/server/errors";
import { command, query } from "@/lib/server/operation";
import type { SignedIn } from "@/lib/server/session";
import { formatDay } from "@/lib/format/dates";

/**
 * What is fitted to a vehicle (linked to a line of its edition by key, or an extra with its own
 * label, mass and position), removals (the record stays, with its removal date), and
 * concessions: a manager's reasoned, expiring exception to one line.
 */

const DAY_MS = 86_400_000;
const id = (what: string) => z.string({ error: `${what} is required` }).trim().min(1, { error: `${what} is required` }).max(64);
const NUMERIC = /^[+-]?(?:\d+(?:\.\d*)?|\.\d+)$/;

function toDate(v: unknown): unknown {
  if (v instanceof Date || typeof v === "number") return new Date(v);
  if (typeof v !== "string") return v;
  const t = v.trim();
  if (t === "") return undefined;
  return new Date(/^\d{4}-\d{2}-\d{2}$/.test(t) ? `${t}T00:00:00Z` : t);
}

const validDate = (what: string) =>
  z.date({ error: `${what} must be a date` }).refine((d) => Number.isFinite(d.getTime()), { error: `${what} must be a date` });

/** A date from a form ("2026-03-01"), an ISO time, epoch milliseconds or a Date. */
const dateInput = (what: string) => z.preprocess(toDate, validDate(what));
/** The same, where a blank field means "none". */
const optionalDate = (what: string) => z.preprocess(toDate, validDate(what).optional());

const optionalNumber = (what: string, min: number, max: number) =>
  z.preprocess(
    (v) => (typeof v === "string" ? (v.trim() === "" ? null : NUMERIC.test(v.trim().replaceAll(",", "")) ? Number(v.trim().replaceAll(",", "")) : v) : v),
    z
      .number({ error: `${what} must be a number` })
      .min(min, { error: `${what} must be at least ${min}` })
      .max(max, { error: `${what} must be at most ${max}` })
      .nullable()
      .default(null),
  );

/** Measured values: a JSON object, or `attributes.<name>` form fields; numbers kept as numbers. */
function collectAttributes(raw: Record<string, unknown>): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  const given = raw.attributes;
  if (given && typeof given === "object" && !Array.isArray(given)) Object.assign(out, given);
  for (const [name, value] of Object.entries(raw)) {
    const m = /^attributes\.(.+)$/.exec(name);
    if (m && typeof value === "string") out[m[1]!] = value;
  }
  for (const [name, value] of Object.entries(out)) {
    if (typeof value === "string") {
      const t = value.trim();
      if (t === "") delete out[name];
      else out[name] = NUMERIC.test(t) ? Number(t) : t;
    }
  }
  return out;
}

export const recordFitmentInputSchema = z.preprocess(
  (raw) => {
    if (raw === null || typeof raw !== "object" || Array.isArray(raw)) return raw;
    const r = raw as Record<string, unknown>;
    const out: Record<string, unknown> = { ...r, attributes: collectAttributes(r) };
    for (const name of Object.keys(out)) if (name.startsWith("attributes.")) delete out[name];
    if (out.lineKey === "" || out.lineKey === "__extra__") out.lineKey = null;
    if (out.zone === "") out.zone = null;
    if (out.massKind === "") out.massKind = null;
    if (out.label === "") delete out.label;
    if (typeof out.quantity === "string") out.quantity = out.quantity.trim() === "" ? undefined : Number(out.quantity);
    return out;
  },
  z.object({
    vehicleId: id("The vehicle"),
    lineKey: z.string().trim().min(1).max(100).nullable().default(null),
    label: z.string().trim().min(1, { error: "Say what was fitted" }).max(160, { error: "at most 160 characters" }).optional(),
    quantity: z.number({ error: "Quantity must be a number" }).int({ error: "Quantity must be a whole number" }).min(1, { error: "Quantity must be at least 1" }).max(1000).default(1),
    attributes: z
      .record(z.string().min(1).max(60), z.union([z.number().refine(Number.isFinite), z.string().max(120)]), { error: "Measured values must be numbers or text" })
      .default({}),
    massKg: optionalNumber("Mass", 0, 5000),
    xMm: optionalNumber("Position", -3000, 15000),
    zone: z.enum(ZONES, { error: `Zone must be one of ${ZONES.join(", ")}` }).nullable().default(null),
    massKind: z.enum(["constant", "variable"], { error: "Mass kind must be constant or variable" }).nullable().default(null),
    fittedAt: optionalDate("Fitted date"),
    expiresAt: optionalDate("Expiry"),
  }),
);

async function visibleVehicle(tx: DbOrTx, user: SignedIn, vehicleId: string) {
  const [vehicle] = await tx
    .select({ id: vehicles.id, editionId: vehicles.editionId, fleetNumber: vehicles.fleetNumber })
    .from(vehicles)
    .where(and(vehicleScope(user), eq(vehicles.id, vehicleId)))
    .limit(1);
  if (!vehicle) throw notFound("That vehicle");
  return vehicle;
}

async function editionLineByKey(tx: DbOrTx, editionId: string | null, key: string) {
  if (!editionId) return null;
  const [line] = await tx
    .select()
    .from(editionLines)
    .where(and(eq(editionLines.editionId, editionId), eq(editionLines.key, key)))
    .limit(1);
  return line ?? null;
}

export const listFitments = query({
  name: "fitment.list",
  input: z.object({
    vehicleId: id("The vehicle"),
    includeRemoved: z.union([z.boolean(), z.enum(["true", "false", "1", "0"]).transform((v) => v === "true" || v === "1")]).default(false),
  }),
  permission: ["read", "Fitment"],
  run: async ({ user, input }) => {
    const vehicle = await visibleVehicle(db(), user, input.vehicleId);
    const [items, vehicleConcessions] = await Promise.all([
      listVehicleFitments(db(), user.orgId, vehicle.id, { includeRemoved: input.includeRemoved }),
      listVehicleConcessions(db(), user.orgId, vehicle.id),
    ]);
    return { vehicleId: vehicle.id, editionId: vehicle.editionId, items, concessions: vehicleConcessions };
  },
});

export const recordFitment = command({
  name: "fitment.record",
  input: recordFitmentInputSchema,
  permission: ["manage", "Fitment"],
  run: async ({ user, input, tx, audit, now }) => {
    const vehicle = await visibleVehicle(tx, user, input.vehicleId);
    const fittedAt = input.fittedAt ?? now;
    if (fittedAt.getTime() > now.getTime() + DAY_MS) {
      throw new AppError("validation_failed", "The fitted date is in the future", [{ field: "fittedAt", message: "Record a fitment once it is fitted" }]);
    }
    let label = input.label;
    let expiresAt = input.expiresAt ?? null;
    if (input.lineKey) {
      const line = await editionLineByKey(tx, vehicle.editionId, input.lineKey);
      if (!line) {
        throw new AppError("validation_failed", "That line is not in this vehicle's edition", [
          { field: "lineKey", message: vehicle.editionId ? "Choose a line of the vehicle's edition, or record an extra" : "The vehicle has no standard; record an extra" },
        ]);
      }
      if (line.requirement === "must_not_fit" && !label) label = `${line.title} (found fitted)`;
      label ??= line.title;
      if (!expiresAt && line.expiryMonths) expiresAt = addMonths(fittedAt, line.expiryMonths);
    } else if (!label) {
      throw new AppError("validation_failed", "Say what the extra is", [{ field: "label", message: "Name the item fitted" }]);
    }
    if (expiresAt && expiresAt.getTime() <= fittedAt.getTime()) {
      throw new AppError("validation_failed", "The expiry must be after the fitted date", [{ field: "expiresAt", message: "Choose a later expiry" }]);
    }
    const extra = input.lineKey === null;
    const [row] = await tx
      .insert(fitments)
      .values({
        orgId: user.orgId,
        vehicleId: vehicle.id,
        lineKey: input.lineKey,
        label: label!,
        quantity: input.quantity,
        attributes: input.attributes,
        // A line's mass and position come from the line; an extra carries its own.
        massKg: extra ? input.massKg : null,
        xMm: extra ? input.xMm : null,
        zone: extra ? input.zone : null,
        massKind: extra ? (input.massKind ?? "constant") : null,
        fittedAt,
        expiresAt,
        recordedBy: user.userId,
      })
      .returning();
    await audit({ action: "fitment.record", entityType: "fitment", entityId: row!.id, after: { vehicleId: vehicle.id, lineKey: row!.lineKey, label: row!.label, quantity: row!.quantity, attributes: row!.attributes, fittedAt, expiresAt } });
    return { id: row!.id, vehicleId: vehicle.id, lineKey: row!.lineKey, label: row!.label, expiresAt: row!.expiresAt };
  },
});

export const removeFitment = command({
  name: "fitment.remove",
  input: z.object({ id: id("The fitment"), reason: z.string().trim().max(300).optional() }),
  permission: ["manage", "Fitment"],
  run: async ({ user, input, tx, audit, now }) => {
    const fitment = await findFitment(tx, user.orgId, input.id);
    if (!fitment) throw notFound("That fitment");
    if (fitment.removedAt) throw conflict(`"${fitment.label}" was already removed on ${formatDay(fitment.removedAt, user.timeZone)}.`);
    const updated = await tx
      .update(fitments)
      .set({ removedAt: now })
      .where(and(eq(fitments.id, fitment.id), eq(fitments.orgId, user.orgId)))
      .returning({ id: fitments.id });
    if (updated.length === 0) throw notFound("That fitment");
    await audit({ action: "fitment.remove", entityType: "fitment", entityId: fitment.id, before: { removedAt: null }, after: { removedAt: now }, reason: input.reason || null });
    return { id: fitment.id, vehicleId: fitment.vehicleId, removedAt: now };
  },
});

// ─── Concessions ───────────────────────────────────────────────────────────────

export const grantConcession = command({
  name: "concession.grant",
  input: z.object({
    vehicleId: id("The vehicle"),
    lineKey: z.string({ error: "Choose the line" }).trim().min(1, { error: "Choose the line" }).max(100),
    reason: z.string({ error: "Give the reason" }).trim().min(10, { error: "Give the reason in a sentence (at least 10 characters)" }).max(500),
    expiresAt: dateInput("Expiry"),
  }),
  permission: ["manage", "Fitment"],
  run: async ({ user, input, tx, audit, now }) => {
    const vehicle = await visibleVehicle(tx, user, input.vehicleId);
    const line = await editionLineByKey(tx, vehicle.editionId, input.lineKey);
    if (!line) throw new AppError("validation_failed", "That line is not in this vehicle's edition", [{ field: "lineKey", message: "Choose a line of the vehicle's edition" }]);
    if (input.expiresAt.getTime() <= now.getTime()) {
      throw new AppError("validation_failed", "A concession must end in the future", [{ field: "expiresAt", message: "Choose a date after today" }]);
    }
    if (input.expiresAt.getTime() > now.getTime() + 366 * DAY_MS) {
      throw new AppError("validation_failed", "A concession lasts at most a year", [{ field: "expiresAt", message: "Choose a date within twelve months; renew it then if still needed" }]);
    }
    const [row] = await tx
      .insert(concessions)
      .values({ orgId: user.orgId, vehicleId: vehicle.id, lineKey: line.key, reason: input.reason, expiresAt: input.expiresAt, approvedBy: user.userId })
      .returning();
    await audit({ action: "concession.grant", entityType: "concession", entityId: row!.id, after: { vehicleId: vehicle.id, lineKey: line.key, code: line.code, expiresAt: input.expiresAt }, reason: input.reason });
    return { id: row!.id, vehicleId: vehicle.id, lineKey: line.key, expiresAt: row!.expiresAt };
  },
});

export const endConcession = command({
  name: "concession.end",
  input: z.object({ id: id("The concession") }),
  permission: ["manage", "Fitment"],
  run: async ({ user, input, tx, audit, now }) => {
    const row = await tx.query.concessions.findFirst({ where: and(eq(concessions.id, input.id), eq(concessions.orgId, user.orgId)) });
    if (!row) throw notFound("That concession");
    if (row.expiresAt.getTime() <= now.getTime()) throw conflict("That concession has already ended.");
    await tx.update(concessions).set({ expiresAt: now }).where(eq(concessions.id, row.id));
    await audit({ action: "concession.end", entityType: "concession", entityId: row.id, before: { expiresAt: row.expiresAt }, after: { expiresAt: now } });
    return { id: row.id, vehicleId: row.vehicleId };
  },
});
