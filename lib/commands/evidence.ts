import "server-only";
import { and, eq, inArray, isNull, ne } from "drizzle-orm";
import { fileTypeFromBuffer } from "file-type";
import sharp from "sharp";
import { z } from "zod";
import { db, type Tx } from "@/db/client";
import { loadEvidenceRow } from "@/db/evidence";
import { loadVehicleLines } from "@/db/jobs";
import { EVIDENCE_KINDS, evidence, fitments, vehicles, weighbridgeTickets } from "@/db/schema";
import { evidenceMachine } from "@/lib/jobs";
import {
  checkUploadSize,
  checkUploadType,
  displayFileName,
  EVIDENCE_MAX_BYTES,
  evidenceStorageKey,
  EXTENSIONS,
  type AcceptedType,
} from "@/lib/uploads";
import { AppError, conflict, forbidden, notFound } from "@/lib/server/errors";
import { command, query } from "@/lib/server/operation";
import type { SignedIn } from "@/lib/server/session";
import { sha256OfBytes, storage } from "@/lib/server/storage";
import { jobFacts, moveJob } from "./jobs";
import { noticeEvidenceLodged, noticeEvidenceRejected } from "./notices";
import { addMonths } from "@/lib/readiness";

const id = z.string({ error: "id is required" }).trim().min(1, { error: "id is required" }).max(64);
const KIND_WORDS: Record<(typeof EVIDENCE_KINDS)[number], string> = {
  photo: "photo",
  certificate: "certificate",
  weighbridge_ticket: "weighbridge ticket",
  engineering_signoff: "engineering sign-off",
};

const massKg = (label: string) =>
  z.preprocess((v) => (v === "" || v === null ? undefined : v), z.coerce.number({ error: `${label} must be a number of kilograms` }).positive({ error: `${label} must be more than 0 kg` }).max(60_000, { error: `${label} is not a plausible mass` }).optional());

/** `attr.<name>` form fields (the line's criteria) become the fitment's measured attributes. */
function collectAttributes(raw: unknown): unknown {
  if (!raw || typeof raw !== "object" || raw instanceof Blob) return raw;
  const source = raw as Record<string, unknown>;
  const attributes: Record<string, number | string> = {};
  for (const [key, value] of Object.entries(source)) {
    if (!key.startsWith("attr.") || typeof value !== "string" || value.trim() === "") continue;
    const name = key.slice(5);
    if (!/^[A-Za-z][A-Za-z0-9_]{0,40}$/.test(name)) continue;
    const text = value.trim();
    attributes[name] = /^-?\d+(\.\d+)?$/.test(text) ? Number(text) : text.slice(0, 120);
  }
  const given = typeof source.attributes === "object" && source.attributes !== null ? (source.attributes as Record<string, number | string>) : {};
  return { ...source, attributes: { ...given, ...attributes } };
}

export const lodgeEvidenceInput = z.preprocess(
  collectAttributes,
  z
    .object({
      jobId: id,
      lineKey: z.string().trim().max(120).optional().transform((v) => v || null),
      kind: z.enum(EVIDENCE_KINDS, { error: "Choose what kind of evidence this is" }),
      file: z.custom<Blob>((v) => v instanceof Blob, { error: "Choose a file to upload" }),
      attributes: z.record(z.string(), z.union([z.number(), z.string()])).default({}),
      ticketNumber: z.string().trim().max(60).optional().transform((v) => v || null),
      weighedAt: z.preprocess((v) => (v === "" || v === null ? undefined : v), z.coerce.date({ error: "Give the date of weighing" }).optional()),
      frontKg: massKg("Front axle mass"),
      rearKg: massKg("Rear axle mass"),
      grossKg: massKg("Gross mass"),
    })
    .superRefine((v, ctx) => {
      if (v.kind !== "weighbridge_ticket") return;
      if (!v.ticketNumber) ctx.addIssue({ code: "custom", path: ["ticketNumber"], message: "Give the ticket number" });
      for (const field of ["frontKg", "rearKg", "grossKg"] as const) {
        if (v[field] === undefined) ctx.addIssue({ code: "custom", path: [field], message: "Type the mass from the ticket" });
      }
      if (v.frontKg !== undefined && v.rearKg !== undefined && v.grossKg !== undefined) {
        // A ticket's axle masses add up to its gross mass; a gap larger than the weighbridge's
        // 10 kg reading steps (common practice) means a figure was typed wrongly.
        if (Math.abs(v.frontKg + v.rearKg - v.grossKg) > 20) {
          ctx.addIssue({ code: "custom", path: ["grossKg"], message: `Front and rear add up to ${v.frontKg + v.rearKg} kg, not ${v.grossKg} kg` });
        }
      }
    }),
);

/** Reads, checks and cleans an upload: size (413), type by its bytes (415), images re-encoded without metadata. */
export async function prepareUpload(file: Blob, kind: (typeof EVIDENCE_KINDS)[number]) {
  const tooBig = checkUploadSize(file.size, EVIDENCE_MAX_BYTES);
  if (tooBig) throw new AppError(tooBig.status === 413 ? "payload_too_large" : "validation_failed", tooBig.message, [{ field: "file", message: tooBig.message }]);
  const raw = Buffer.from(await file.arrayBuffer());
  const detected = await fileTypeFromBuffer(raw);
  const verdict = checkUploadType(detected?.mime, kind);
  if (!verdict.ok) throw new AppError("unsupported_media_type", verdict.message, [{ field: "file", message: verdict.message }]);
  if (!verdict.isImage) return { bytes: raw, type: verdict.type };
  // Re-encoding applies the orientation and drops EXIF (location included), ICC and XMP.
  try {
    const bytes = await sharp(raw, { failOn: "error" }).rotate().jpeg({ quality: 85 }).toBuffer();
    return { bytes, type: "image/jpeg" as AcceptedType };
  } catch {
    throw new AppError("unsupported_media_type", "This image could not be read; send it again or as a PDF", [{ field: "file", message: "The image could not be read" }]);
  }
}

async function currentFitmentFor(tx: Tx, jobId: string, lineKey: string) {
  const [earlier] = await tx
    .select({ fitmentId: evidence.fitmentId })
    .from(evidence)
    .innerJoin(fitments, eq(fitments.id, evidence.fitmentId))
    .where(and(eq(evidence.jobId, jobId), eq(evidence.lineKey, lineKey), isNull(fitments.removedAt)))
    .limit(1);
  return earlier?.fitmentId ?? null;
}

/**
 * The fitment a job's evidence for a spec line proves. Evidence on an "unproven" line proves
 * what is already fitted; on a short or off-spec line the job fitted something new, recorded
 * here (with the measured values typed in) and replacing an off-spec item.
 */
async function fitmentForLine(tx: Tx, user: SignedIn, job: { id: string; vehicleId: string }, lineKey: string, attributes: Record<string, number | string>, now: Date) {
  const existing = await currentFitmentFor(tx, job.id, lineKey);
  if (existing) {
    if (Object.keys(attributes).length) {
      const [row] = await tx.select({ attributes: fitments.attributes }).from(fitments).where(eq(fitments.id, existing));
      await tx.update(fitments).set({ attributes: { ...(row?.attributes ?? {}), ...attributes } }).where(eq(fitments.id, existing));
    }
    return { fitmentId: existing, created: false };
  }
  const { lines, editionLines } = await loadVehicleLines(tx, user, job.vehicleId, now);
  const line = lines.find((l) => l.key === lineKey);
  const spec = editionLines.find((l) => l.key === lineKey);
  if (!line || !spec) return { fitmentId: null, created: false };
  const current = await tx
    .select()
    .from(fitments)
    .where(and(eq(fitments.vehicleId, job.vehicleId), eq(fitments.lineKey, lineKey), isNull(fitments.removedAt)));
  if (line.status === "unproven" && current[0]) return { fitmentId: current[0].id, created: false };
  let quantity = Math.max(1, line.missingQuantity);
  if (line.status === "off_spec") {
    // The item that failed its criteria is replaced by the one fitted on this job.
    const failing = new Set((line.failing ?? []).map((f) => f.fitmentId));
    const replaced = current.filter((f) => failing.has(f.id));
    if (replaced.length) {
      await tx.update(fitments).set({ removedAt: now }).where(inArray(fitments.id, replaced.map((f) => f.id)));
      quantity = Math.max(quantity, replaced.reduce((n, f) => n + f.quantity, 0));
    }
  }
  // The same calendar-month rule as a fitment recorded by hand and as readiness reads it.
  const expiresAt = spec.expiryMonths ? addMonths(now, spec.expiryMonths) : null;
  const [created] = await tx
    .insert(fitments)
    .values({
      orgId: user.orgId,
      vehicleId: job.vehicleId,
      lineKey,
      label: spec.title,
      quantity,
      attributes,
      massKg: spec.massKg,
      xMm: spec.xMm,
      zone: spec.zone,
      massKind: spec.massKind,
      fittedAt: now,
      expiresAt,
      recordedBy: user.userId,
    })
    .returning({ id: fitments.id });
  return { fitmentId: created!.id, created: true };
}

export const lodgeEvidence = command({
  name: "evidence.lodge",
  input: lodgeEvidenceInput,
  permission: ["create", "Evidence"],
  run: async ({ user, input, tx, audit, mail, now }) => {
    if (user.role !== "contractor") throw forbidden("Evidence on a job is lodged by the workshop the job is awarded to");
    const row = await jobFacts(tx, user, input.jobId);
    const { job, vehicle } = row;
    if (job.awardedFirmId !== user.firmId) throw forbidden("Only the workshop the job is awarded to can lodge evidence on it");
    if (!["awarded", "in_workshop", "evidence_lodged"].includes(job.state)) {
      throw conflict(`This job is ${job.state.replace("_", " ")}: evidence is lodged only while the work is awarded or in the workshop`);
    }
    const jobLineKeys = (await tx.query.jobLines.findMany({ where: (l, { eq: is }) => is(l.jobId, job.id) })).map((l) => l.lineKey);
    if (input.lineKey && !jobLineKeys.includes(input.lineKey)) {
      throw new AppError("validation_failed", "That spec line is not part of this job", [{ field: "lineKey", message: "Choose a line of this job" }]);
    }
    const prepared = await prepareUpload(input.file, input.kind);
    const evidenceId = crypto.randomUUID();
    const extension = EXTENSIONS[prepared.type];
    const key = evidenceStorageKey(user.orgId, evidenceId, extension);
    const sha256 = sha256OfBytes(prepared.bytes);
    // The file is stored before the row: a failed transaction leaves at worst an unreferenced file.
    await storage().put(key, prepared.bytes, prepared.type);

    if (job.state === "awarded") await moveJob({ tx, audit }, job, "in_workshop", {}, "Evidence lodged: the work is under way");
    const fitment = input.lineKey ? await fitmentForLine(tx, user, job, input.lineKey, input.attributes, now) : { fitmentId: null, created: false };
    const filename = displayFileName((input.file as File).name, `${input.kind}.${extension}`);
    await tx.insert(evidence).values({
      id: evidenceId,
      orgId: user.orgId,
      jobId: job.id,
      fitmentId: fitment.fitmentId,
      lineKey: input.lineKey,
      kind: input.kind,
      filename,
      contentType: prepared.type,
      sizeBytes: prepared.bytes.length,
      sha256,
      storageKey: key,
      uploadedBy: user.userId,
    });
    if (input.kind === "weighbridge_ticket") {
      await tx.insert(weighbridgeTickets).values({
        orgId: user.orgId,
        vehicleId: vehicle.id,
        jobId: job.id,
        ticketNumber: input.ticketNumber!,
        weighedAt: input.weighedAt ?? now,
        frontKg: input.frontKg!,
        rearKg: input.rearKg!,
        grossKg: input.grossKg!,
        evidenceId,
        recordedBy: user.userId,
      });
    }
    await audit({
      action: "evidence.lodge",
      entityType: "evidence",
      entityId: evidenceId,
      after: { jobId: job.id, lineKey: input.lineKey, kind: input.kind, sha256, sizeBytes: prepared.bytes.length, fitmentId: fitment.fitmentId, fitmentCreated: fitment.created },
    });
    const lineWords = input.lineKey ? (await tx.query.jobLines.findFirst({ where: (l, { and: both, eq: is }) => both(is(l.jobId, job.id), is(l.lineKey, input.lineKey!)) }))?.description : null;
    await noticeEvidenceLodged(tx, mail, user.orgId, { id: job.id, number: job.number, title: job.title, fleetNumber: vehicle.fleetNumber }, `${KIND_WORDS[input.kind]}${lineWords ? ` for ${lineWords}` : ""} (${filename})`);
    return { id: evidenceId, sha256, contentType: prepared.type, sizeBytes: prepared.bytes.length, fitmentId: fitment.fitmentId };
  },
});

export const reviewEvidence = command({
  name: "evidence.review",
  input: z
    .object({
      id,
      decision: z.enum(["accept", "reject"], { error: 'decision must be "accept" or "reject"' }),
      reason: z.string().trim().max(2000).optional().default(""),
    })
    .superRefine((v, ctx) => {
      if (v.decision === "reject" && !v.reason) ctx.addIssue({ code: "custom", path: ["reason"], message: "Say why the evidence is rejected" });
    }),
  permission: ["review", "Evidence"],
  run: async ({ user, input, tx, audit, mail, now }) => {
    const row = await loadEvidenceRow(tx, user, input.id);
    if (!row) throw notFound("That evidence");
    const to = input.decision === "accept" ? "accepted" : "rejected";
    const check = evidenceMachine.check(row.status, to);
    if (!check.allowed) throw conflict(check.reason);
    const moved = await tx
      .update(evidence)
      .set({ status: to, reviewedBy: user.userId, reviewedAt: now, reviewReason: input.reason || null })
      .where(and(eq(evidence.id, row.id), eq(evidence.status, "lodged")))
      .returning({ id: evidence.id });
    if (moved.length === 0) throw conflict("This evidence was reviewed by someone else just now");
    const [ticket] = await tx.select().from(weighbridgeTickets).where(and(eq(weighbridgeTickets.evidenceId, row.id), eq(weighbridgeTickets.orgId, user.orgId)));
    const [vehicle] = await tx.select().from(vehicles).where(eq(vehicles.id, row.job.vehicleId));
    let measured: { frontKg: number; rearKg: number; grossKg: number } | null = null;
    if (ticket && vehicle) {
      if (to === "accepted") {
        // The newest accepted ticket gives the vehicle's measured masses.
        if (!vehicle.measuredAt || vehicle.measuredAt.getTime() <= ticket.weighedAt.getTime()) {
          await tx
            .update(vehicles)
            .set({ measuredFrontKg: ticket.frontKg, measuredRearKg: ticket.rearKg, measuredGrossKg: ticket.grossKg, measuredAt: ticket.weighedAt, version: vehicle.version + 1 })
            .where(eq(vehicles.id, vehicle.id));
          measured = { frontKg: ticket.frontKg, rearKg: ticket.rearKg, grossKg: ticket.grossKg };
          await audit({
            action: "vehicle.measured",
            entityType: "vehicle",
            entityId: vehicle.id,
            before: { frontKg: vehicle.measuredFrontKg, rearKg: vehicle.measuredRearKg, grossKg: vehicle.measuredGrossKg },
            after: measured,
            reason: `Weighbridge ticket ${ticket.ticketNumber} accepted`,
          });
        }
      } else {
        // A rejected ticket does not count as a weighing.
        await tx.delete(weighbridgeTickets).where(eq(weighbridgeTickets.id, ticket.id));
      }
    }
    await audit({ action: `evidence.${to}`, entityType: "evidence", entityId: row.id, before: { status: row.status }, after: { status: to }, reason: input.reason || null });
    if (to === "rejected" && row.job.awardedFirmId) {
      await noticeEvidenceRejected(
        tx,
        mail,
        user.orgId,
        { id: row.job.id, number: row.job.number, title: row.job.title, fleetNumber: vehicle?.fleetNumber ?? "" },
        row.job.awardedFirmId,
        `${KIND_WORDS[row.kind]} ${row.filename}`,
        input.reason,
      );
    }
    const stillLodged = await tx.select({ id: evidence.id }).from(evidence).where(and(eq(evidence.jobId, row.job.id), eq(evidence.status, "lodged"), ne(evidence.id, row.id))).limit(1);
    return { id: row.id, status: to, measured, pendingOnJob: stillLodged.length };
  },
});

/** The stored bytes of a piece of evidence, for a user allowed to see its job. */
export const evidenceFile = query({
  name: "evidence.file",
  input: z.object({ id }),
  permission: ["read", "Evidence"],
  run: async ({ user, input }) => {
    const row = await loadEvidenceRow(db(), user, input.id);
    if (!row) throw notFound("That evidence");
    const file = await storage().get(row.storageKey);
    if (!file) throw notFound("The file of that evidence");
    return { bytes: file.bytes, contentType: row.contentType, filename: row.filename, sha256: row.sha256 };
  },
});
