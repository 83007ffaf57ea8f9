import "server-only";
import { and, eq, inArray } from "drizzle-orm";
import { z } from "zod";
import { db, type DbOrTx, type Tx } from "@/db/client";
import { listJobEvidence } from "@/db/evidence";
import { listJobRows, loadJobLines, loadJobOffers, loadJobRow, loadVehicleLines, nextJobNumber, type VehicleGapLine } from "@/db/jobs";
import { listQuoteRows, loadDecisions, loadQuoteLines } from "@/db/quotes";
import { contractorFirms, costs, defects, evidence, jobLines, jobOffers, jobs, quoteLines, quotes, vehicles, LINE_CATEGORIES } from "@/db/schema";
import { findVehicle } from "@/db/vehicles";
import { costCategoryFor, isJobOverdue, JOB_STATES, jobMachine, type JobState } from "@/lib/jobs";
import { buildOrder, canAward, type SequenceLine } from "@/lib/sequence";
import { AppError, conflict, forbidden, notFound } from "@/lib/server/errors";
import { command, query, type CommandContext } from "@/lib/server/operation";
import type { SignedIn } from "@/lib/server/session";
import { applyDefectMove } from "./defects";
import { noticeJobOffered, noticeJobSignedOff } from "./notices";

const id = z.string({ error: "id is required" }).trim().min(1, { error: "id is required" }).max(64);
const optionalDate = z.preprocess((v) => (v === "" || v === null ? undefined : v), z.coerce.date({ error: "Give a valid date" }).optional());
const list = <T extends z.ZodType>(item: T) =>
  z.preprocess((v) => (v === undefined || v === "" ? [] : Array.isArray(v) ? v : [v]), z.array(item));
const boolish = z.preprocess((v) => v === true || v === "true" || v === "1" || v === "on", z.boolean());

/** Lines of a vehicle's edition in the shape of the build-sequence module. */
export function sequenceLines(lines: readonly VehicleGapLine[]): SequenceLine[] {
  return lines.map((l) => ({
    id: l.lineId,
    label: `${l.code} ${l.title}`,
    category: l.category,
    dependsOn: l.dependsOn,
    // Met for sequencing: nothing left to do on it (meets, a current concession, or optional and absent).
    met: l.status === "meets" || l.status === "concession" || l.status === "optional_absent",
    kind: l.category === "engineering" ? "engineering" : "fitting",
  }));
}

export const GAP_STATUSES = ["short", "off_spec", "unproven", "prohibited_fitted"] as const;

/** The job's spec lines against the build order: stage, what blocks each, and whether they can be awarded together. */
export function jobPlan(vehicleLines: readonly VehicleGapLine[], jobLineKeys: readonly string[]) {
  const seq = sequenceLines(vehicleLines);
  const order = buildOrder(seq);
  const byKey = new Map(vehicleLines.map((l) => [l.key, l]));
  const ids = jobLineKeys.map((k) => byKey.get(k)?.lineId).filter((x): x is string => Boolean(x));
  const award = ids.length ? canAward(ids, seq) : { ok: true, refused: [], alreadyMet: [] };
  const planned = new Map(order.stages.flatMap((s) => s.lines).map((l) => [l.id, l]));
  return { order, award, planned };
}

export async function jobFacts(tx: DbOrTx, user: SignedIn, jobId: string) {
  const row = await loadJobRow(tx, user, jobId);
  if (!row) throw notFound("That job");
  return row;
}

/** Refuses an illegal move with 409 and the reason in words. */
export function assertMove(from: JobState, to: JobState) {
  const check = jobMachine.check(from, to);
  if (!check.allowed) throw conflict(check.reason);
}

export async function moveJob(ctx: Pick<CommandContext<unknown>, "tx" | "audit">, job: { id: string; state: JobState; version: number }, to: JobState, extra: Partial<typeof jobs.$inferInsert> = {}, reason?: string) {
  assertMove(job.state, to);
  const updated = await ctx.tx
    .update(jobs)
    .set({ ...extra, state: to, version: job.version + 1 })
    .where(and(eq(jobs.id, job.id), eq(jobs.version, job.version)))
    .returning({ id: jobs.id });
  if (updated.length === 0) throw conflict("This job was changed by someone else just now; reload it and try again");
  await ctx.audit({ action: `job.${to}`, entityType: "job", entityId: job.id, before: { state: job.state }, after: { state: to, ...extra }, reason: reason ?? null });
}

// ─── Reads ─────────────────────────────────────────────────────────────────────

/** A contractor learns that a job went to another workshop, never which one. */
function hideOtherFirm<T extends { awardedFirmId: string | null; awardedFirmName: string | null }>(user: SignedIn, row: T): T {
  if (user.role !== "contractor" || row.awardedFirmId === null || row.awardedFirmId === user.firmId) return row;
  return { ...row, awardedFirmId: "another", awardedFirmName: "Another workshop" };
}

export const listJobs = query({
  name: "job.list",
  input: z.object({
    state: z.preprocess((v) => (v === "" ? undefined : v), z.enum(JOB_STATES, { error: "Choose a job state" }).optional()),
    firmId: z.string().trim().max(64).optional().transform((v) => v || undefined),
    depotId: z.string().trim().max(64).optional().transform((v) => v || undefined),
    vehicleId: z.string().trim().max(64).optional().transform((v) => v || undefined),
    overdue: boolish.optional(),
  }),
  permission: ["read", "Job"],
  run: async ({ user, input, now }) => {
    const rows = await listJobRows(db(), user, input, now);
    return rows.map((r) => ({ ...hideOtherFirm(user, r), overdue: isJobOverdue(r.state, r.dueAt, now) }));
  },
});

/** Everything a job page shows, cut to what the user may see. */
export const getJob = query({
  name: "job.read",
  input: z.object({ id }),
  permission: ["read", "Job"],
  run: async ({ user, input, now }) => {
    const database = db();
    const row = await jobFacts(database, user, input.id);
    const { job, vehicle, platform } = row;
    const [lines, offers, vehicleLines] = await Promise.all([
      loadJobLines(database, job.id),
      loadJobOffers(database, user, job.id),
      user.role === "driver" ? Promise.resolve(null) : loadVehicleLines(database, user, vehicle.id, now),
    ]);
    const gapLines = vehicleLines?.lines ?? [];
    const byKey = new Map(gapLines.map((l) => [l.key, l]));
    const plan = jobPlan(gapLines, lines.map((l) => l.lineKey).filter((k): k is string => Boolean(k)));
    const canSeeQuotes = user.ability.can("read", "Quote") || user.ability.can("manage", "Quote");
    const quoteRows = canSeeQuotes ? await listQuoteRows(database, user, { jobId: job.id }) : [];
    const [qLines, qDecisions, evidenceRows] = await Promise.all([
      loadQuoteLines(database, quoteRows.map((q) => q.id)),
      loadDecisions(database, quoteRows.map((q) => q.id)),
      user.ability.can("read", "Evidence") || user.role === "contractor" ? listJobEvidence(database, user, job.id) : Promise.resolve([]),
    ]);
    const quotesOut = quoteRows.map((q) => ({
      ...q,
      lines: qLines.filter((l) => l.quoteId === q.id),
      decisions: qDecisions.filter((d) => d.quoteId === q.id),
      expired: q.validUntil !== null && q.validUntil.getTime() < now.getTime(),
    }));
    return {
      job: { ...hideOtherFirm(user, { ...job, awardedFirmName: row.awardedFirmName }), overdue: isJobOverdue(job.state, job.dueAt, now), next: jobMachine.next(job.state) },
      vehicle: {
        id: vehicle.id,
        fleetNumber: vehicle.fleetNumber,
        registration: vehicle.registration,
        vin: vehicle.vin,
        make: platform.make,
        model: platform.model,
        variant: platform.variant,
        depotName: row.depotName,
        costCentre: user.role === "contractor" ? null : vehicle.costCentre,
        odometerKm: vehicle.odometerKm,
        standardTyreSize: platform.standardTyreSize,
        gvmKg: platform.gvmKg,
        measuredFrontKg: vehicle.measuredFrontKg,
        measuredRearKg: vehicle.measuredRearKg,
        measuredGrossKg: vehicle.measuredGrossKg,
        measuredAt: vehicle.measuredAt,
      },
      lines: lines.map((l) => {
        const spec = l.lineKey ? byKey.get(l.lineKey) : undefined;
        const planned = spec ? plan.planned.get(spec.lineId) : undefined;
        const refused = spec ? plan.award.refused.find((r) => r.id === spec.lineId) : undefined;
        return {
          id: l.id,
          lineKey: l.lineKey,
          description: l.description,
          spec: spec
            ? {
                code: spec.code,
                title: spec.title,
                category: spec.category,
                status: spec.status,
                standardCostCents: spec.standardCostCents,
                missingQuantity: spec.missingQuantity,
                evidenceMissing: spec.evidenceMissing ?? [],
                criteria: vehicleLines?.editionLines.find((e) => e.id === spec.lineId)?.criteria ?? [],
                evidenceNeeded: vehicleLines?.editionLines.find((e) => e.id === spec.lineId)?.evidenceNeeded ?? [],
              }
            : null,
          stage: planned?.stage ?? null,
          blockedBy: planned?.blockedBy.map((b) => b.label) ?? [],
          awardBlockedBy: refused?.missing.map((m) => ({ label: m.label, reason: m.reason })) ?? [],
        };
      }),
      canAwardLines: plan.award.ok,
      offers,
      quotes: quotesOut,
      evidence: evidenceRows,
    };
  },
});

/** A vehicle's lines with their variance and build order, for raising a job from its gaps. */
export const vehiclePlan = query({
  name: "job.vehicle_plan",
  input: z.object({ vehicleId: id }),
  permission: ["read", "Job"],
  run: async ({ user, input, now }) => {
    const found = await findVehicle(db(), user, input.vehicleId);
    if (!found) throw notFound("That vehicle");
    const { lines, editionId } = await loadVehicleLines(db(), user, input.vehicleId, now);
    const { order } = jobPlan(lines, []);
    const planned = new Map(order.stages.flatMap((s) => s.lines).map((l) => [l.id, l]));
    return {
      vehicle: { id: found.vehicle.id, fleetNumber: found.vehicle.fleetNumber, make: found.platform.make, model: found.platform.model },
      editionId,
      lines: lines.map((l) => ({
        key: l.key,
        code: l.code,
        title: l.title,
        category: l.category,
        status: l.status,
        standardCostCents: l.standardCostCents,
        isGap: (GAP_STATUSES as readonly string[]).includes(l.status),
        stage: planned.get(l.lineId)?.stage ?? null,
        blockedBy: planned.get(l.lineId)?.blockedBy.map((b) => b.label) ?? [],
      })),
    };
  },
});

// ─── Raise, offer, cancel ──────────────────────────────────────────────────────

export const raiseJob = command({
  name: "job.raise",
  input: z
    .object({
      vehicleId: id,
      title: z.string({ error: "Give the job a title" }).trim().min(1, { error: "Give the job a title" }).max(200, { error: "The title is too long (at most 200 characters)" }),
      lineKeys: list(z.string().trim().min(1).max(120)),
      freeText: list(z.string().trim().max(500)).transform((items) => items.filter((t) => t.length > 0)),
      costKind: z.enum(["capital", "operating"], { error: "Choose capital or operating" }).default("capital"),
      dueAt: optionalDate,
      /** A triaged defect this job repairs: it is linked and moves to "in repair" with the job. */
      defectId: z.preprocess((v) => (v === "" ? undefined : v), id.optional()),
    })
    .superRefine((v, ctx) => {
      if (v.lineKeys.length + v.freeText.length === 0) ctx.addIssue({ code: "custom", path: ["lineKeys"], message: "Pick at least one line or describe the work" });
    }),
  permission: ["manage", "Job"],
  run: async ({ user, input, tx, audit, now }) => {
    const found = await findVehicle(tx, user, input.vehicleId);
    if (!found) throw notFound("That vehicle");
    if (found.vehicle.state === "retired") throw conflict("A retired vehicle cannot get new work");
    const { lines } = await loadVehicleLines(tx, user, input.vehicleId, now);
    const byKey = new Map(lines.map((l) => [l.key, l]));
    const keys = [...new Set(input.lineKeys)];
    keys.forEach((key, i) => {
      const line = byKey.get(key);
      if (!line) throw new AppError("validation_failed", "A chosen line is not in this vehicle's standard", [{ field: `lineKeys.${i}`, message: `"${key}" is not a line of this vehicle's edition` }]);
      if (!(GAP_STATUSES as readonly string[]).includes(line.status)) {
        throw new AppError("validation_failed", `${line.code} ${line.title} has no gap to close`, [{ field: `lineKeys.${i}`, message: `${line.code} is ${line.status.replace("_", " ")}` }]);
      }
    });
    const number = await nextJobNumber(tx, user.orgId);
    const [job] = await tx
      .insert(jobs)
      .values({ orgId: user.orgId, number, vehicleId: input.vehicleId, title: input.title, costKind: input.costKind, dueAt: input.dueAt ?? null, createdBy: user.userId })
      .returning();
    if (!job) throw new Error("job insert returned nothing");
    const rows = [
      ...keys.map((key) => {
        const l = byKey.get(key)!;
        return { jobId: job.id, lineKey: key, description: `${l.code} ${l.title}` };
      }),
      ...input.freeText.map((description) => ({ jobId: job.id, lineKey: null, description })),
    ].map((r, i) => ({ ...r, sortOrder: i }));
    await tx.insert(jobLines).values(rows);
    await audit({ action: "job.raise", entityType: "job", entityId: job.id, after: { number, vehicleId: input.vehicleId, title: input.title, lines: rows.map((r) => r.description), defectId: input.defectId ?? null } });
    if (input.defectId) {
      // Same transaction: the job exists only if the defect could be linked to it, and the other way round.
      if (!user.ability.can("triage", "Defect")) throw forbidden("You may raise jobs but not move defects along");
      const defect = await tx.query.defects.findFirst({ where: and(eq(defects.id, input.defectId), eq(defects.orgId, user.orgId)) });
      if (!defect) throw new AppError("validation_failed", "That defect was not found", [{ field: "defectId", message: "That defect was not found" }]);
      if (defect.vehicleId !== input.vehicleId) {
        throw new AppError("validation_failed", "That defect is on another vehicle", [{ field: "defectId", message: "That defect is on another vehicle" }]);
      }
      await applyDefectMove({ user, tx, now, audit, input: { id: defect.id, version: undefined, move: "start_repair", jobId: job.id } });
    }
    return { id: job.id, number };
  },
});

export const offerJob = command({
  name: "job.offer",
  input: z.object({
    id,
    firmIds: list(z.string().trim().min(1).max(64)).refine((v) => v.length > 0, { error: "Choose at least one workshop" }),
    dueAt: optionalDate,
  }),
  permission: ["manage", "Job"],
  run: async ({ user, input, tx, audit, mail }) => {
    const row = await jobFacts(tx, user, input.id);
    const job = row.job;
    if (job.state !== "open" && job.state !== "quoting") {
      throw conflict(`A job that is ${jobMachine.labels[job.state].toLowerCase()} cannot be offered to more workshops: only open jobs and jobs out for quotes can`);
    }
    const firms = await tx
      .select()
      .from(contractorFirms)
      .where(and(eq(contractorFirms.orgId, user.orgId), inArray(contractorFirms.id, input.firmIds)));
    input.firmIds.forEach((firmId, i) => {
      const firm = firms.find((f) => f.id === firmId);
      if (!firm) throw new AppError("validation_failed", "Choose workshops of this organisation", [{ field: `firmIds.${i}`, message: "That workshop does not exist" }]);
      if (!firm.active) throw new AppError("validation_failed", `${firm.name} is not taking work`, [{ field: `firmIds.${i}`, message: `${firm.name} is not taking work` }]);
    });
    const existing = await tx.select({ firmId: jobOffers.firmId }).from(jobOffers).where(eq(jobOffers.jobId, job.id));
    const fresh = [...new Set(input.firmIds)].filter((f) => !existing.some((e) => e.firmId === f));
    if (fresh.length === 0) throw conflict("This job is already offered to every workshop chosen");
    await tx.insert(jobOffers).values(fresh.map((firmId) => ({ jobId: job.id, firmId, dueAt: input.dueAt ?? job.dueAt })));
    if (job.state === "open") {
      await moveJob({ tx, audit }, job, "quoting", input.dueAt ? { dueAt: input.dueAt } : {});
    }
    await audit({ action: "job.offer", entityType: "job", entityId: job.id, after: { firms: fresh.map((f) => firms.find((x) => x.id === f)?.name), dueAt: input.dueAt ?? null } });
    for (const firmId of fresh) {
      await noticeJobOffered(tx, mail, user.orgId, user.orgName, { id: job.id, number: job.number, title: job.title, fleetNumber: row.vehicle.fleetNumber }, firmId, input.dueAt ?? job.dueAt);
    }
    return { id: job.id, offeredTo: fresh.length };
  },
});

export const cancelJob = command({
  name: "job.cancel",
  input: z.object({ id, reason: z.string({ error: "Give the reason for cancelling" }).trim().min(1, { error: "Give the reason for cancelling" }).max(2000) }),
  permission: ["manage", "Job"],
  run: async ({ user, input, tx, audit, now }) => {
    const { job } = await jobFacts(tx, user, input.id);
    await moveJob({ tx, audit }, job, "cancelled", { cancelReason: input.reason }, input.reason);
    // Quotes still in the running end with the job.
    const live = await tx.select().from(quotes).where(and(eq(quotes.jobId, job.id), inArray(quotes.status, ["draft", "submitted", "returned", "awaiting_finance"])));
    for (const q of live) {
      await tx.update(quotes).set({ status: "withdrawn", version: q.version + 1, updatedAt: now }).where(eq(quotes.id, q.id));
      await audit({ action: "quote.withdrawn", entityType: "quote", entityId: q.id, before: { status: q.status }, after: { status: "withdrawn" }, reason: `Job cancelled: ${input.reason}` });
    }
    return { id: job.id, state: "cancelled" as const };
  },
});

/** The awarded contractor (or a manager) moves the work on: into the workshop, then evidence lodged. */
export const progressJob = command({
  name: "job.progress",
  input: z.object({ id, to: z.enum(["in_workshop", "evidence_lodged"], { error: "Choose the next step" }) }),
  permission: ["progress", "Job"],
  run: async ({ user, input, tx, audit }) => {
    const { job } = await jobFacts(tx, user, input.id);
    if (user.role === "contractor" && job.awardedFirmId !== user.firmId) throw forbidden("Only the workshop the job is awarded to can move it on");
    if (input.to === "evidence_lodged") {
      const lodged = await tx.select({ id: evidence.id }).from(evidence).where(and(eq(evidence.jobId, job.id), inArray(evidence.status, ["lodged", "accepted"]))).limit(1);
      if (lodged.length === 0) throw conflict("Lodge at least one piece of evidence before marking the evidence as lodged");
    }
    await moveJob({ tx, audit }, job, input.to);
    return { id: job.id, state: input.to };
  },
});

async function bookJobCost(tx: Tx, user: SignedIn, job: typeof jobs.$inferSelect, vehicle: typeof vehicles.$inferSelect, now: Date) {
  const [quote] = await tx.select().from(quotes).where(and(eq(quotes.jobId, job.id), eq(quotes.status, "accepted"))).limit(1);
  if (!quote) throw conflict("This job has no accepted quote, so there is no cost to book");
  const qLines = await tx.select().from(quoteLines).where(eq(quoteLines.quoteId, quote.id));
  const { lines } = await loadVehicleLines(tx, user, vehicle.id, now);
  const categoryByKey = new Map(lines.map((l) => [l.key, l.category]));
  const jl = await tx.select().from(jobLines).where(eq(jobLines.jobId, job.id));
  const firstJobCategory = jl.map((l) => (l.lineKey ? categoryByKey.get(l.lineKey) : undefined)).find(Boolean);
  const category = costCategoryFor(
    qLines.map((l) => ({ category: l.lineKey ? (categoryByKey.get(l.lineKey) ?? null) : null, exGstCents: l.amountCents })),
    firstJobCategory ?? "engineering",
  );
  if (!(LINE_CATEGORIES as readonly string[]).includes(category)) throw new Error(`unknown cost category ${category}`);
  const [cost] = await tx
    .insert(costs)
    .values({
      orgId: user.orgId,
      vehicleId: vehicle.id,
      costCentre: vehicle.costCentre ?? "UNASSIGNED",
      depotId: vehicle.depotId,
      category,
      kind: job.costKind,
      amountExGstCents: quote.subtotalCents,
      gstCents: quote.gstCents,
      incurredOn: now,
      source: "job",
      jobId: job.id,
      quoteId: quote.id,
      reference: `Job ${job.number}`,
      description: job.title,
      createdBy: user.userId,
    })
    .returning();
  return { cost: cost!, quote };
}

export const signOffJob = command({
  name: "job.sign_off",
  input: z.object({ id, version: z.coerce.number().int().min(1).optional() }),
  permission: ["manage", "Job"],
  run: async ({ user, input, tx, audit, mail, now }) => {
    const row = await jobFacts(tx, user, input.id);
    const { job, vehicle } = row;
    if (input.version !== undefined && input.version !== job.version) throw conflict("This job was changed by someone else just now; reload it and try again");
    assertMove(job.state, "signed_off");
    const pending = await tx.select({ id: evidence.id }).from(evidence).where(and(eq(evidence.jobId, job.id), eq(evidence.status, "lodged"))).limit(1);
    if (pending.length > 0) throw conflict("Review every piece of evidence before signing the job off");
    const accepted = await tx.select({ id: evidence.id }).from(evidence).where(and(eq(evidence.jobId, job.id), eq(evidence.status, "accepted"))).limit(1);
    if (accepted.length === 0) throw conflict("At least one piece of evidence must be accepted before the job is signed off");
    const specLines = (await tx.select().from(jobLines).where(eq(jobLines.jobId, job.id))).filter((l) => l.lineKey);
    const proven = new Set(
      (await tx.select({ lineKey: evidence.lineKey }).from(evidence).where(and(eq(evidence.jobId, job.id), eq(evidence.status, "accepted")))).map((e) => e.lineKey),
    );
    const unproven = specLines.filter((l) => !proven.has(l.lineKey));
    if (unproven.length) throw conflict(`These lines have no accepted evidence yet: ${unproven.map((l) => l.description).join(", ")}`);
    await moveJob({ tx, audit }, job, "signed_off", { signedOffAt: now });
    const { cost, quote } = await bookJobCost(tx, user, job, vehicle, now);
    await audit({ action: "cost.book", entityType: "cost", entityId: cost.id, after: { jobId: job.id, quoteId: quote.id, category: cost.category, kind: cost.kind, amountExGstCents: cost.amountExGstCents, gstCents: cost.gstCents, costCentre: cost.costCentre } });
    await noticeJobSignedOff(tx, mail, user.orgId, { id: job.id, number: job.number, title: job.title, fleetNumber: vehicle.fleetNumber }, job.awardedFirmId, quote.totalCents);
    return { id: job.id, state: "signed_off" as const, costId: cost.id };
  },
});

export const closeJob = command({
  name: "job.close",
  input: z.object({ id }),
  permission: ["manage", "Job"],
  run: async ({ user, input, tx, audit }) => {
    const { job } = await jobFacts(tx, user, input.id);
    await moveJob({ tx, audit }, job, "closed");
    return { id: job.id, state: "closed" as const };
  },
});
