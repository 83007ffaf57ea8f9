import "server-only";
import { randomUUID } from "node:crypto";
import { and, eq, sql } from "drizzle-orm";
import { fileTypeFromBuffer } from "file-type";
import sharp from "sharp";
import { z } from "zod";
import { db } from "@/db/client";
import {
  countDefects,
  defectCountsByState,
  findDefect,
  findDefectByClientId,
  findPhoto,
  linkableJobs,
  listDefects,
  managerRecipients,
  mergeCandidates,
  vehicleForReport,
  type DefectRow,
} from "@/db/defects";
import { defects, evidence, jobs, vehicles } from "@/db/schema";
import {
  CATEGORY_LABELS,
  DEFECT_SEVERITIES,
  DEFECT_STATES,
  SEVERITY_LABELS,
  SEVERITY_RANK,
  allowedMoves,
  canReceiveMerge,
  categoryLabel,
  defectMove,
  defectMoveSchema,
  defectReportSchema,
  type DefectMove,
} from "@/lib/defects";
import { renderMail } from "@/lib/mail/render";
import { AppError, conflict, notFound } from "@/lib/server/errors";
import { command, execute, query, type CommandContext } from "@/lib/server/operation";
import type { SignedIn } from "@/lib/server/session";
import { sha256OfBytes, storage } from "@/lib/server/storage";
import { checkUploadSize, checkUploadType, displayFileName, evidenceStorageKey } from "@/lib/uploads";
import { appUrl } from "./links";
import { formatDayTime } from "@/lib/format/dates";

// ─── Photos ─────────────────────────────────────────────────────────────────────

/**
 * Photos from a driver's phone (defects and check items). The type is read from the bytes, the
 * picture is turned upright and re-encoded as JPEG, which drops every piece of metadata the
 * camera wrote (EXIF, GPS position, device): a report's location is kept only when the driver
 * chose to add it. Files are stored before their rows are written (a failed transaction leaves
 * at worst an unreferenced file, never a row without its file).
 */

/** The longest side a stored photo keeps: enough to read a tyre's sidewall, small to send. */
export const PHOTO_MAX_SIDE_PX = 2048;
export const MAX_DEFECT_PHOTOS = 6;

export const photoListSchema = (max: number) =>
  z
    .array(z.instanceof(Blob, { error: "A photo must be a file" }))
    .max(max, { error: `At most ${max} photos` })
    .optional()
    .default([]);

export type StoredPhoto = { id: string; filename: string; contentType: "image/jpeg"; sizeBytes: number; sha256: string; storageKey: string };

/** Checks, cleans and stores each photo; refuses the whole set if any one is not acceptable. */
export async function storePhotos(orgId: string, photos: readonly Blob[], field: string): Promise<StoredPhoto[]> {
  const prepared: { id: string; filename: string; bytes: Buffer }[] = [];
  for (const [i, blob] of photos.entries()) {
    const at = `${field}.${i}`;
    const refusedSize = checkUploadSize(blob.size);
    if (refusedSize) {
      throw new AppError(refusedSize.status === 413 ? "payload_too_large" : "validation_failed", `Photo ${i + 1}: ${refusedSize.message}`, [{ field: at, message: refusedSize.message }]);
    }
    const bytes = new Uint8Array(await blob.arrayBuffer());
    const detected = await fileTypeFromBuffer(bytes);
    const typeCheck = checkUploadType(detected?.mime, "photo");
    if (!typeCheck.ok) {
      throw new AppError("unsupported_media_type", `Photo ${i + 1}: ${typeCheck.message}`, [{ field: at, message: typeCheck.message }]);
    }
    let jpeg: Buffer;
    try {
      jpeg = await sharp(bytes, { failOn: "error" })
        .rotate()
        .resize({ width: PHOTO_MAX_SIDE_PX, height: PHOTO_MAX_SIDE_PX, fit: "inside", withoutEnlargement: true })
        .jpeg({ quality: 82 })
        .toBuffer();
    } catch {
      const message = "The picture could not be read; take it again";
      throw new AppError("unsupported_media_type", `Photo ${i + 1}: ${message}`, [{ field: at, message }]);
    }
    const name = blob instanceof File ? blob.name : "";
    const filename = `${displayFileName(name, `photo-${i + 1}`).replace(/\.[A-Za-z0-9]{1,5}$/, "")}.jpg`;
    prepared.push({ id: randomUUID(), filename, bytes: jpeg });
  }
  const stored: StoredPhoto[] = [];
  for (const p of prepared) {
    const storageKey = evidenceStorageKey(orgId, p.id, "jpg");
    await storage().put(storageKey, p.bytes, "image/jpeg");
    stored.push({ id: p.id, filename: p.filename, contentType: "image/jpeg", sizeBytes: p.bytes.byteLength, sha256: sha256OfBytes(p.bytes), storageKey });
  }
  return stored;
}

// ─── Idempotent reports ─────────────────────────────────────────────────────────

/**
 * Thrown inside a report command when the device id is already known: the transaction rolls
 * back (nothing is written twice) and the caller answers with the record already held.
 */
export class AlreadyRecorded<T> extends Error {
  readonly record: T;
  constructor(record: T) {
    super("already recorded");
    this.name = "AlreadyRecorded";
    this.record = record;
  }
}

/** The same device id sent for a different report is a conflict, not a repeat. */
export function sameReportOrConflict(existing: { reportedBy?: string | null; driverId?: string; vehicleId: string }, user: SignedIn, vehicleId: string) {
  const by = existing.reportedBy ?? existing.driverId;
  if (by !== user.userId || existing.vehicleId !== vehicleId) {
    throw conflict("This report's device id was already used for a different report; send it again as a new report");
  }
}

/** Device time, trusted only up to now (a phone's clock can be ahead) and 60 days back. */
export function reportedTime(deviceTime: Date | undefined, now: Date): Date {
  if (!deviceTime) return now;
  const t = deviceTime.getTime();
  if (t > now.getTime() || t < now.getTime() - 60 * 86_400_000) return now;
  return deviceTime;
}

// ─── Reporting ──────────────────────────────────────────────────────────────────

export type DefectSummary = {
  id: string;
  clientId: string;
  vehicleId: string;
  severity: DefectRow["severity"];
  category: string;
  description: string;
  state: DefectRow["state"];
  odometerKm: number | null;
  latitude: number | null;
  longitude: number | null;
  photoIds: string[];
  createdAt: Date;
  version: number;
};

function summary(row: DefectRow, photoIds: string[]): DefectSummary {
  return {
    id: row.id,
    clientId: row.clientId,
    vehicleId: row.vehicleId,
    severity: row.severity,
    category: row.category,
    description: row.description,
    state: row.state,
    odometerKm: row.odometerKm,
    latitude: row.latitude,
    longitude: row.longitude,
    photoIds,
    createdAt: row.createdAt,
    version: row.version,
  };
}

async function photoIdsOf(defectId: string, orgId: string): Promise<string[]> {
  const rows = await db()
    .select({ id: evidence.id })
    .from(evidence)
    .where(and(eq(evidence.orgId, orgId), eq(evidence.defectId, defectId)))
    .orderBy(evidence.createdAt);
  return rows.map((r) => r.id);
}

export const reportDefectInput = defectReportSchema.and(z.object({ photos: photoListSchema(MAX_DEFECT_PHOTOS) }));

const storedPhotoSchema = z.object({
  id: z.uuid(),
  filename: z.string().min(1).max(200),
  contentType: z.literal("image/jpeg"),
  sizeBytes: z.number().int().positive(),
  sha256: z.string().regex(/^[0-9a-f]{64}$/),
  storageKey: z.string().min(1).max(512),
});

/** What the recording command takes: the report, with its photos already checked and stored. */
const recordDefectInput = defectReportSchema.and(z.object({ storedPhotos: z.array(storedPhotoSchema).max(MAX_DEFECT_PHOTOS).default([]) }));

export type ReportResult = { defect: DefectSummary; grounded: boolean; managersNotified: number };

/**
 * Records a driver's defect on an assigned vehicle. A "stop" defect grounds the vehicle in the
 * same transaction and puts an e-mail to every manager of the organisation in the outbox (a
 * safety notice: sent whatever their notice settings). Called by `submitDefect`, which checks
 * and stores the photos first so no picture is processed while the database is held.
 */
export const recordDefect = command({
  name: "defect.report",
  input: recordDefectInput,
  permission: ["create", "Defect"],
  run: async ({ user, input, tx, now, audit, mail }): Promise<ReportResult> => {
    const vehicle = await vehicleForReport(tx, user, input.vehicleId);
    if (!vehicle) throw notFound("That vehicle");
    const existing = await findDefectByClientId(tx, user.orgId, input.clientId);
    if (existing) {
      sameReportOrConflict(existing, user, input.vehicleId);
      throw new AlreadyRecorded(existing);
    }
    const photos = input.storedPhotos;
    const createdAt = reportedTime(input.reportedAt, now);
    const [row] = await tx
      .insert(defects)
      .values({
        orgId: user.orgId,
        vehicleId: vehicle.id,
        clientId: input.clientId,
        reportedBy: user.userId,
        severity: input.severity,
        category: input.category,
        description: input.description,
        odometerKm: input.odometerKm ?? null,
        latitude: input.latitude ?? null,
        longitude: input.longitude ?? null,
        createdAt,
        updatedAt: now,
      })
      .onConflictDoNothing()
      .returning();
    if (!row) {
      // Another copy of the same report won the race a moment ago.
      const winner = await findDefectByClientId(tx, user.orgId, input.clientId);
      if (!winner) throw conflict("The report could not be saved; send it again");
      sameReportOrConflict(winner, user, input.vehicleId);
      throw new AlreadyRecorded(winner);
    }
    if (photos.length > 0) {
      await tx.insert(evidence).values(
        photos.map((p) => ({
          id: p.id,
          orgId: user.orgId,
          defectId: row.id,
          kind: "photo" as const,
          filename: p.filename,
          contentType: p.contentType,
          sizeBytes: p.sizeBytes,
          sha256: p.sha256,
          storageKey: p.storageKey,
          uploadedBy: user.userId,
          createdAt: now,
        })),
      );
    }
    await audit({
      action: "defect.report",
      entityType: "defect",
      entityId: row.id,
      after: { vehicleId: vehicle.id, severity: row.severity, category: row.category, state: row.state, photos: photos.length },
    });

    let grounded = false;
    let managersNotified = 0;
    if (row.severity === "stop") {
      const reason = `Stop defect reported by ${user.name}: ${categoryLabel(row.category)} — ${row.description}`.slice(0, 300);
      if (vehicle.state !== "grounded") {
        await tx
          .update(vehicles)
          .set({ state: "grounded", groundedReason: reason, version: sql`${vehicles.version} + 1` })
          .where(and(eq(vehicles.id, vehicle.id), eq(vehicles.orgId, user.orgId)));
        await audit({
          action: "vehicle.ground",
          entityType: "vehicle",
          entityId: vehicle.id,
          before: { state: vehicle.state, groundedReason: vehicle.groundedReason },
          after: { state: "grounded", groundedReason: reason },
          reason: `Stop defect ${row.id}`,
        });
        grounded = true;
      }
      const managers = await managerRecipients(tx, user.orgId);
      const when = formatDayTime(createdAt, user.timeZone);
      const where =
        row.latitude !== null && row.longitude !== null ? `Reported at ${row.latitude.toFixed(5)}, ${row.longitude.toFixed(5)} (the driver's phone position).` : null;
      for (const manager of managers) {
        await mail({
          to: manager.email,
          kind: "defect_stop",
          ...renderMail({
            subject: `Stop defect: ${vehicle.fleetNumber} is grounded`,
            heading: `${vehicle.fleetNumber} must not be driven`,
            paragraphs: [
              `${user.name} reported a stop defect on ${vehicle.fleetNumber}${vehicle.registration ? ` (${vehicle.registration})` : ""} on ${when}.`,
              `${CATEGORY_LABELS[input.category]}: ${row.description}`,
              ...(row.odometerKm !== null ? [`Odometer: ${row.odometerKm.toLocaleString("en-AU")} km.`] : []),
              ...(where ? [where] : []),
              grounded
                ? "Rigline has grounded the vehicle. It stays grounded until a manager returns it to service with a reason."
                : "The vehicle was already grounded and stays grounded.",
            ],
            action: { label: "Open the defect", url: appUrl(`/defects/${row.id}`) },
            footnote: `You receive this because you are a fleet manager of ${user.orgName}. Safety notices are always sent.`,
          }),
        });
        managersNotified++;
      }
    }
    return { defect: summary(row, photos.map((p) => p.id)), grounded, managersNotified };
  },
});

/**
 * POST /api/defects: a report, sent once or many times (retries from a phone that lost signal).
 * The first arrival is written; a repeat of the same device id answers the record already held
 * and writes nothing.
 */
export const submitDefect = query({
  name: "defect.submit",
  input: reportDefectInput,
  permission: ["create", "Defect"],
  run: async ({ user, input }): Promise<ReportResult & { created: boolean }> => {
    const repeat = async (held: DefectRow) => ({
      defect: summary(held, await photoIdsOf(held.id, user.orgId)),
      grounded: false,
      managersNotified: 0,
      created: false,
    });
    if (!(await vehicleForReport(db(), user, input.vehicleId))) throw notFound("That vehicle");
    const known = await findDefectByClientId(db(), user.orgId, input.clientId);
    if (known) {
      sameReportOrConflict(known, user, input.vehicleId);
      return repeat(known);
    }
    const { photos, ...report } = input;
    const storedPhotos = await storePhotos(user.orgId, photos, "photos");
    try {
      return { ...(await execute(recordDefect, user, { ...report, storedPhotos })), created: true };
    } catch (error) {
      if (!(error instanceof AlreadyRecorded)) throw error;
      return repeat(error.record as DefectRow);
    }
  },
});

// Writes need no queue of their own here: db/write-queue.ts runs one write transaction at a time
// in this process, and recordDefect / recordCheck / moveDefect re-read the device id and the
// version inside their transaction, so a repeat answers 200 and a stale move 409.

// ─── Reading ────────────────────────────────────────────────────────────────────

const idField = z.string({ error: "id is required" }).trim().min(1, { error: "id is required" }).max(64);
const blank = (v: unknown) => (typeof v === "string" && v.trim() === "" ? undefined : v);

export const defectListInput = z.object({
  state: z.preprocess(blank, z.union([z.enum(DEFECT_STATES), z.literal("open")], { error: `state is one of open, ${DEFECT_STATES.join(", ")}` }).optional()),
  severity: z.preprocess(blank, z.enum(DEFECT_SEVERITIES, { error: `severity is one of ${DEFECT_SEVERITIES.join(", ")}` }).optional()),
  vehicleId: z.preprocess(blank, idField.optional()),
  page: z.preprocess(blank, z.coerce.number().int().min(1, { error: "page starts at 1" }).optional()).transform((v) => v ?? 1),
  pageSize: z.preprocess(blank, z.coerce.number().int().min(1).max(100, { error: "pageSize is at most 100" }).optional()).transform((v) => v ?? 25),
});

export const listDefectsQuery = query({
  name: "defect.list",
  input: defectListInput,
  permission: ["read", "Defect"],
  run: async ({ user, input }) => {
    const filter = {
      states: input.state === "open" ? (["reported", "triaged", "in_repair"] as const) : input.state ? [input.state] : undefined,
      severity: input.severity,
      vehicleId: input.vehicleId,
    };
    const [items, total, counts] = await Promise.all([
      listDefects(db(), user, { ...filter, limit: input.pageSize, offset: (input.page - 1) * input.pageSize }),
      countDefects(db(), user, filter),
      defectCountsByState(db(), user),
    ]);
    return { items, total, page: input.page, pageSize: input.pageSize, pageCount: Math.max(1, Math.ceil(total / input.pageSize)), counts };
  },
});

export const getDefect = query({
  name: "defect.read",
  input: z.object({ id: idField }),
  permission: ["read", "Defect"],
  run: async ({ user, input }) => {
    const found = await findDefect(db(), user, input.id);
    if (!found) throw notFound("That defect");
    const canTriage = user.ability.can("triage", "Defect");
    const [candidates, jobsForLink] = canTriage
      ? await Promise.all([mergeCandidates(db(), user, found.defect), linkableJobs(db(), user.orgId, found.defect.vehicleId)])
      : [[], []];
    return { ...found, moves: canTriage ? allowedMoves(found.defect.state) : [], mergeCandidates: candidates, linkableJobs: jobsForLink };
  },
});

export const readDefectPhoto = query({
  name: "defect.photo",
  input: z.object({ id: idField, photoId: idField }),
  permission: ["read", "Defect"],
  run: async ({ user, input }) => {
    return readPhoto(user, { defectId: input.id }, input.photoId);
  },
});

/**
 * One photo of a defect or of a pre-trip check with its bytes, found through the owner's scope
 * (`findPhoto`): a photo the actor may not see, or whose file is gone, is "not found".
 */
export async function readPhoto(user: SignedIn, owner: Parameters<typeof findPhoto>[2], photoId: string) {
  const photo = await findPhoto(db(), user, owner, photoId);
  if (!photo) throw notFound("That photo");
  const file = await storage().get(photo.storageKey);
  if (!file) throw notFound("That photo's file");
  return { bytes: file.bytes, contentType: photo.contentType, filename: photo.filename };
}

// ─── Triage ─────────────────────────────────────────────────────────────────────

export const moveDefectInput = z.intersection(
  z.object({
    id: idField,
    /** The version the manager saw; a newer one means someone else moved it first. */
    version: z.preprocess(blank, z.coerce.number().int().min(1).optional()),
  }),
  defectMoveSchema,
);

function toMachineMove(input: z.output<typeof defectMoveSchema>): DefectMove {
  switch (input.move) {
    case "triage":
      return { kind: "triage" };
    case "start_repair":
      return { kind: "start_repair", jobId: input.jobId };
    case "resolve":
      return { kind: "resolve" };
    case "close":
      return { kind: "close", reason: input.reason ?? null };
    case "merge":
      return { kind: "merge", intoId: input.intoId };
  }
}

const STALE = "This defect was changed by someone else since you opened it; reload to see where it stands";

/** A manager moves a defect along: triage, link a repair job, resolve, close, or merge. */
export const moveDefect = command({
  name: "defect.move",
  input: moveDefectInput,
  permission: ["triage", "Defect"],
  run: (ctx) => applyDefectMove(ctx),
});

/**
 * The move itself, inside the caller's transaction: moveDefect runs it alone, and raising a
 * job from a defect runs it in the same transaction as the new job (both or neither).
 */
export async function applyDefectMove({ user, input, tx, now, audit }: Pick<CommandContext<z.output<typeof moveDefectInput>>, "user" | "input" | "tx" | "now" | "audit">) {
  const before = await tx.query.defects.findFirst({ where: and(eq(defects.id, input.id), eq(defects.orgId, user.orgId)) });
  if (!before) throw notFound("That defect");
  if (input.version !== undefined && input.version !== before.version) throw conflict(STALE);
  const move = toMachineMove(input);
  const outcome = defectMove(before.state, move);
  if (!outcome.ok) throw conflict(outcome.reason);

  const changes: Partial<typeof defects.$inferInsert> = { state: outcome.to, updatedAt: now };
  let extra: Record<string, unknown> = {};
  if (move.kind === "start_repair") {
    const job = await tx.query.jobs.findFirst({ where: and(eq(jobs.id, move.jobId), eq(jobs.orgId, user.orgId)) });
    if (!job) throw new AppError("not_found", "That job was not found", [{ field: "jobId", message: "That job was not found" }]);
    if (job.vehicleId !== before.vehicleId) {
      throw new AppError("validation_failed", "That job is for another vehicle", [{ field: "jobId", message: "That job is for another vehicle" }]);
    }
    if (job.state === "cancelled" || job.state === "closed") throw conflict(`Job ${job.number} is ${job.state}; link an open job`);
    changes.jobId = job.id;
    extra = { jobId: job.id, jobNumber: job.number };
  }
  if (move.kind === "close") {
    changes.closeReason = move.reason?.trim() || null;
  }
  if (move.kind === "merge") {
    if (move.intoId === before.id) {
      throw new AppError("validation_failed", "A report cannot be merged into itself", [{ field: "intoId", message: "Pick another report" }]);
    }
    const target = await tx.query.defects.findFirst({ where: and(eq(defects.id, move.intoId), eq(defects.orgId, user.orgId)) });
    if (!target) throw new AppError("not_found", "The report to keep was not found", [{ field: "intoId", message: "That report was not found" }]);
    if (target.vehicleId !== before.vehicleId) {
      throw new AppError("validation_failed", "Only reports on the same vehicle can be merged", [{ field: "intoId", message: "That report is on another vehicle" }]);
    }
    if (!canReceiveMerge(target.state)) throw conflict(`The report to keep is ${target.state.replace("_", " ")}; merge into an open report`);
    changes.mergedIntoId = target.id;
    extra = { mergedIntoId: target.id };
    // The kept report takes the more urgent severity of the two.
    if (SEVERITY_RANK[before.severity] > SEVERITY_RANK[target.severity]) {
      const raised = await tx
        .update(defects)
        .set({ severity: before.severity, updatedAt: now, version: sql`${defects.version} + 1` })
        .where(and(eq(defects.id, target.id), eq(defects.version, target.version)))
        .returning({ id: defects.id });
      if (raised.length === 0) throw conflict("The report to keep was changed by someone else a moment ago; try again");
      await audit({
        action: "defect.severity_raised",
        entityType: "defect",
        entityId: target.id,
        before: { severity: target.severity },
        after: { severity: before.severity },
        reason: `Merged with ${before.id} (${SEVERITY_LABELS[before.severity]})`,
      });
    }
  }

  const [after] = await tx
    .update(defects)
    .set({ ...changes, version: sql`${defects.version} + 1` })
    .where(and(eq(defects.id, before.id), eq(defects.version, before.version), eq(defects.state, before.state)))
    .returning();
  if (!after) throw conflict(STALE);
  await audit({
    action: `defect.${move.kind}`,
    entityType: "defect",
    entityId: before.id,
    before: { state: before.state },
    after: { state: after.state, ...extra },
    reason: move.kind === "close" ? (after.closeReason ?? null) : null,
  });
  return { id: after.id, state: after.state, version: after.version, jobId: after.jobId, mergedIntoId: after.mergedIntoId, closeReason: after.closeReason };
}

/**
 * POST /api/defects/{id}/moves and the triage forms: moveDefect. Two managers at once give one
 * result and one clear 409 (the second transaction waits for the first and sees its version).
 */
export const triageDefect = query({
  name: "defect.triage",
  input: moveDefectInput,
  permission: ["triage", "Defect"],
  run: async ({ user, input }) => execute(moveDefect, user, input),
});
