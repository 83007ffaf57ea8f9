import "server-only";
import { z } from "zod";
import { db } from "@/db/client";
import { checkableLines, findCheck, findCheckByClientId, listChecks, vehicleForReport } from "@/db/defects";
import { evidence, preTripChecks } from "@/db/schema";
import { buildChecklist, checkAnswers, checkSummary, preTripCheckSchema } from "@/lib/defects";
import { InputError } from "@/lib/errors";
import { notFound } from "@/lib/server/errors";
import { command, execute, query } from "@/lib/server/operation";
import { AlreadyRecorded, readPhoto, reportedTime, sameReportOrConflict, storePhotos, type StoredPhoto } from "./defects";

/** At most this many photos on one item, and on one check. */
export const MAX_PHOTOS_PER_ITEM = 3;
export const MAX_PHOTOS_PER_CHECK = 20;

const idField = z.string({ error: "id is required" }).trim().min(1, { error: "id is required" }).max(64);

/** The checklist of a vehicle: the general walk-round and its edition's checkable lines. */
export const getChecklist = query({
  name: "check.checklist",
  input: z.object({ vehicleId: idField }),
  permission: ["read", "Vehicle"],
  run: async ({ user, input }) => {
    const vehicle = await vehicleForReport(db(), user, input.vehicleId);
    if (!vehicle) throw notFound("That vehicle");
    const items = buildChecklist(await checkableLines(db(), user.orgId, vehicle.editionId));
    return { vehicleId: vehicle.id, fleetNumber: vehicle.fleetNumber, items };
  },
});

export const submitCheckInput = preTripCheckSchema.and(
  z.object({
    /** Photos by checklist item key. */
    photos: z.record(z.string(), z.array(z.instanceof(Blob, { error: "A photo must be a file" })).max(MAX_PHOTOS_PER_ITEM, { error: `At most ${MAX_PHOTOS_PER_ITEM} photos on one item` })).optional().default({}),
  }),
);

const storedPhotoSchema = z.object({
  id: z.uuid(),
  itemKey: z.string().min(1).max(200),
  filename: z.string().min(1).max(200),
  contentType: z.literal("image/jpeg"),
  sizeBytes: z.number().int().positive(),
  sha256: z.string().regex(/^[0-9a-f]{64}$/),
  storageKey: z.string().min(1).max(512),
});

const recordCheckInput = preTripCheckSchema.and(z.object({ storedPhotos: z.array(storedPhotoSchema).max(MAX_PHOTOS_PER_CHECK).default([]) }));

export type CheckResultSummary = {
  id: string;
  clientId: string;
  vehicleId: string;
  completedAt: Date;
  counts: { pass: number; fail: number; na: number };
  photoIds: string[];
};

function toSummary(row: typeof preTripChecks.$inferSelect): CheckResultSummary {
  return {
    id: row.id,
    clientId: row.clientId,
    vehicleId: row.vehicleId,
    completedAt: row.completedAt,
    counts: checkSummary(row.items),
    photoIds: row.items.flatMap((i) => i.photoIds ?? []),
  };
}

/** Records a driver's finished pre-trip check (photos already checked and stored). */
export const recordCheck = command({
  name: "check.submit",
  input: recordCheckInput,
  permission: ["create", "PreTripCheck"],
  run: async ({ user, input, tx, now, audit }) => {
    const vehicle = await vehicleForReport(tx, user, input.vehicleId);
    if (!vehicle) throw notFound("That vehicle");
    const existing = await findCheckByClientId(tx, user.orgId, input.clientId);
    if (existing) {
      sameReportOrConflict(existing, user, input.vehicleId);
      throw new AlreadyRecorded(existing);
    }
    const checklist = buildChecklist(await checkableLines(tx, user.orgId, vehicle.editionId));
    const answers = checkAnswers(checklist, input.items, { tolerateLineDrift: true });
    const photosByItem = new Map<string, string[]>();
    for (const p of input.storedPhotos) photosByItem.set(p.itemKey, [...(photosByItem.get(p.itemKey) ?? []), p.id]);
    for (const key of photosByItem.keys()) {
      if (!answers.some((a) => a.key === key)) throw new InputError(`photos.${key}`, "A photo belongs to an item that is not on the check");
    }
    const items = answers.map((a) => ({
      key: a.key,
      label: a.label,
      ...(a.lineKey !== undefined ? { lineKey: a.lineKey } : {}),
      result: a.result,
      ...(a.note ? { note: a.note } : {}),
      ...(photosByItem.has(a.key) ? { photoIds: photosByItem.get(a.key) } : {}),
      ...("defectClientId" in a && typeof a.defectClientId === "string" ? { defectClientId: a.defectClientId } : {}),
    }));
    const [row] = await tx
      .insert(preTripChecks)
      .values({ orgId: user.orgId, vehicleId: vehicle.id, driverId: user.userId, clientId: input.clientId, items, completedAt: reportedTime(input.completedAt, now) })
      .onConflictDoNothing()
      .returning();
    if (!row) {
      const winner = await findCheckByClientId(tx, user.orgId, input.clientId);
      if (!winner) throw new Error("check insert returned nothing");
      sameReportOrConflict(winner, user, input.vehicleId);
      throw new AlreadyRecorded(winner);
    }
    if (input.storedPhotos.length > 0) {
      await tx.insert(evidence).values(
        input.storedPhotos.map((p) => ({
          id: p.id,
          orgId: user.orgId,
          checkId: row.id,
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
    const counts = checkSummary(items);
    await audit({ action: "check.submit", entityType: "pre_trip_check", entityId: row.id, after: { vehicleId: vehicle.id, ...counts, photos: input.storedPhotos.length } });
    return toSummary(row);
  },
});

/** POST /api/checks: a finished check, sent once or many times; a repeat answers the one held. */
export const submitCheck = query({
  name: "check.send",
  input: submitCheckInput,
  permission: ["create", "PreTripCheck"],
  run: async ({ user, input }): Promise<{ check: CheckResultSummary; created: boolean }> => {
    if (!(await vehicleForReport(db(), user, input.vehicleId))) throw notFound("That vehicle");
    const known = await findCheckByClientId(db(), user.orgId, input.clientId);
    if (known) {
      sameReportOrConflict(known, user, input.vehicleId);
      return { check: toSummary(known), created: false };
    }
    const { photos, ...check } = input;
    const entries = Object.entries(photos);
    if (entries.reduce((n, [, list]) => n + list.length, 0) > MAX_PHOTOS_PER_CHECK) {
      throw new InputError("photos", `At most ${MAX_PHOTOS_PER_CHECK} photos on one check`);
    }
    const storedPhotos: (StoredPhoto & { itemKey: string })[] = [];
    for (const [itemKey, list] of entries) {
      if (!check.items.some((i) => i.key === itemKey)) throw new InputError(`photos.${itemKey}`, "A photo belongs to an item that is not on the check");
      for (const p of await storePhotos(user.orgId, list, `photos.${itemKey}`)) storedPhotos.push({ ...p, itemKey });
    }
    try {
      return { check: await execute(recordCheck, user, { ...check, storedPhotos }), created: true };
    } catch (error) {
      if (!(error instanceof AlreadyRecorded)) throw error;
      return { check: toSummary(error.record as typeof preTripChecks.$inferSelect), created: false };
    }
  },
});

export const listChecksQuery = query({
  name: "check.list",
  input: z.object({ vehicleId: z.preprocess((v) => (v === "" ? undefined : v), idField.optional()), limit: z.coerce.number().int().min(1).max(100).optional() }),
  permission: ["read", "PreTripCheck"],
  run: async ({ user, input }) => ({ items: await listChecks(db(), user, input) }),
});

export const getCheck = query({
  name: "check.read",
  input: z.object({ id: idField }),
  permission: ["read", "PreTripCheck"],
  run: async ({ user, input }) => {
    const found = await findCheck(db(), user, input.id);
    if (!found) throw notFound("That check");
    return { ...found, counts: checkSummary(found.check.items) };
  },
});

export const readCheckPhoto = query({
  name: "check.photo",
  input: z.object({ id: idField, photoId: idField }),
  permission: ["read", "PreTripCheck"],
  run: async ({ user, input }) => {
    return readPhoto(user, { checkId: input.id }, input.photoId);
  },
});
