import "server-only";
import { and, eq, inArray, ne } from "drizzle-orm";
import { z } from "zod";
import { db, type Tx } from "@/db/client";
import { loadVehicleLines } from "@/db/jobs";
import { listQuoteRows, loadDecisions, loadQuoteLines, loadQuoteRevisions, loadQuoteRow } from "@/db/quotes";
import { decisions, jobLines, jobOffers, jobs, organisations, quoteLines, quoteRevisions, quotes, vehicles } from "@/db/schema";
import {
  decisionInputSchema,
  decisionOutcome,
  EDITABLE_QUOTE_STATES,
  financeApprovalInputSchema,
  financeOutcome,
  mayDecide,
  QUOTE_STATE_LABELS,
  QUOTE_STATES,
  quoteContentSchema,
  quoteMachine,
  toTotalsLine,
  type QuoteContent,
  type QuoteState,
} from "@/lib/jobs";
import { GST_METHOD_DESCRIPTIONS, quoteTotals, type GstMethod } from "@/lib/money";
import { AppError, conflict, forbidden, notFound } from "@/lib/server/errors";
import { command, query, type CommandContext } from "@/lib/server/operation";
import type { SignedIn } from "@/lib/server/session";
import { jobPlan, moveJob } from "./jobs";
import { noticeFinanceNeeded, noticeQuoteDecided, noticeQuoteSubmitted } from "./notices";

const id = z.string({ error: "id is required" }).trim().min(1, { error: "id is required" }).max(64);
const version = z.coerce.number({ error: "version is required" }).int().min(1, { error: "version is required" });

function assertQuoteMove(from: QuoteState, to: QuoteState) {
  const check = quoteMachine.check(from, to);
  if (!check.allowed) throw conflict(check.reason);
}

/** The quote as the items of `GET /api/quotes` carry it. */
export type QuoteItem = Awaited<ReturnType<typeof listQuoteRows>>[number];

export const listQuotes = query({
  name: "quote.list",
  input: z.object({
    jobId: z.string().trim().max(64).optional().transform((v) => v || undefined),
    status: z.preprocess((v) => (v === "" ? undefined : v), z.enum(QUOTE_STATES, { error: "Choose a quote status" }).optional()),
  }),
  permission: ["read", "Quote"],
  run: async ({ user, input }) => listQuoteRows(db(), user, input),
});

export const getQuote = query({
  name: "quote.read",
  input: z.object({ id }),
  permission: ["read", "Quote"],
  run: async ({ user, input, now }) => {
    const row = await loadQuoteRow(db(), user, input.id);
    if (!row) throw notFound("That quote");
    const [lines, revisions, decided, jobLineRows, vehicleRows] = await Promise.all([
      loadQuoteLines(db(), [row.quote.id]),
      loadQuoteRevisions(db(), row.quote.id),
      loadDecisions(db(), [row.quote.id]),
      db().select().from(jobLines).where(eq(jobLines.jobId, row.job.id)),
      db().select({ fleetNumber: vehicles.fleetNumber }).from(vehicles).where(eq(vehicles.id, row.job.vehicleId)).limit(1),
    ]);
    const spec = await loadVehicleLines(db(), user, row.job.vehicleId, now);
    return {
      quote: row.quote,
      firmName: row.firmName,
      job: { id: row.job.id, number: row.job.number, title: row.job.title, state: row.job.state, fleetNumber: vehicleRows[0]?.fleetNumber ?? "" },
      jobLines: jobLineRows.map((l) => ({ lineKey: l.lineKey, description: l.description, standardCostCents: spec.lines.find((s) => s.key === l.lineKey)?.standardCostCents ?? null })),
      lines,
      revisions,
      decisions: decided,
      methodDescription: GST_METHOD_DESCRIPTIONS[row.quote.gstMethod],
      editable: user.role === "contractor" && user.firmId === row.quote.firmId && EDITABLE_QUOTE_STATES.includes(row.quote.status),
    };
  },
});

/** Lines and totals of a quote's content, worked out by the quote's GST method. */
export function priceQuote(content: QuoteContent, method: GstMethod) {
  const result = quoteTotals(content.lines.map(toTotalsLine), method);
  const rows = content.lines.map((line, i) => {
    const priced = result.lines[i]!;
    return {
      kind: line.kind,
      description: line.description,
      quantity: line.kind === "labour" ? line.hours : line.quantity,
      unitPriceCents: line.kind === "labour" ? line.rateCents : line.unitPriceCents,
      hours: line.kind === "labour" ? line.hours : null,
      rateCents: line.kind === "labour" ? line.rateCents : null,
      taxable: line.taxable,
      lineKey: line.lineKey,
      amountCents: priced.exGstCents,
      gstCents: priced.gstCents,
      sortOrder: i,
    };
  });
  return { rows, totals: result.totals, methodDescription: result.methodDescription };
}

async function checkLineKeys(tx: Tx, jobId: string, content: QuoteContent) {
  const keys = new Set((await tx.select({ lineKey: jobLines.lineKey }).from(jobLines).where(eq(jobLines.jobId, jobId))).map((l) => l.lineKey).filter(Boolean));
  content.lines.forEach((line, i) => {
    if (line.lineKey && !keys.has(line.lineKey)) {
      throw new AppError("validation_failed", "A quote line points at a spec line that is not in this job", [{ field: `lines.${i}.lineKey`, message: "Choose a spec line of this job, or none" }]);
    }
  });
}

async function writeLines(tx: Tx, quoteId: string, rows: ReturnType<typeof priceQuote>["rows"]) {
  await tx.delete(quoteLines).where(eq(quoteLines.quoteId, quoteId));
  if (rows.length) await tx.insert(quoteLines).values(rows.map((r) => ({ ...r, quoteId })));
}

/** A contractor's own firm's quote, loaded for a change. Another firm's quote is simply not found. */
async function ownQuote(tx: Tx, user: SignedIn, quoteId: string) {
  const row = await loadQuoteRow(tx, user, quoteId);
  if (!row) throw notFound("That quote");
  if (user.role !== "contractor" || row.quote.firmId !== user.firmId) throw forbidden("Only the workshop that wrote a quote can change it");
  return row;
}

export const createQuote = command({
  name: "quote.create",
  input: z.object({ jobId: id }).extend(quoteContentSchema.partial({ lines: true }).shape),
  permission: ["manage", "Quote"],
  run: async ({ user, input, tx, audit }) => {
    if (user.role !== "contractor" || !user.firmId) throw forbidden("Only a contractor of a workshop can write a quote");
    const [offer] = await tx
      .select({ job: jobs })
      .from(jobOffers)
      .innerJoin(jobs, eq(jobs.id, jobOffers.jobId))
      .where(and(eq(jobOffers.jobId, input.jobId), eq(jobOffers.firmId, user.firmId), eq(jobs.orgId, user.orgId)))
      .limit(1);
    if (!offer) throw notFound("That job");
    if (offer.job.state !== "quoting") throw conflict(`This job is ${offer.job.state.replace("_", " ")}: quotes are taken only while it is out for quotes`);
    const live = await tx
      .select({ id: quotes.id })
      .from(quotes)
      .where(and(eq(quotes.jobId, input.jobId), eq(quotes.firmId, user.firmId), inArray(quotes.status, ["draft", "submitted", "returned", "awaiting_finance"])))
      .limit(1);
    if (live.length) throw conflict("Your workshop already has a quote for this job; open it to change it");
    const [org] = await tx.select({ gstMethod: organisations.gstMethod }).from(organisations).where(eq(organisations.id, user.orgId));
    const content: QuoteContent = { lines: input.lines ?? [], validUntil: input.validUntil, notes: input.notes ?? null };
    await checkLineKeys(tx, input.jobId, content);
    const method = org?.gstMethod ?? "per-line";
    const priced = priceQuote(content, method);
    const [quote] = await tx
      .insert(quotes)
      .values({
        orgId: user.orgId,
        jobId: input.jobId,
        firmId: user.firmId,
        gstMethod: method,
        validUntil: content.validUntil ?? null,
        notes: content.notes,
        subtotalCents: priced.totals.exGstCents,
        gstCents: priced.totals.gstCents,
        totalCents: priced.totals.inclGstCents,
        createdBy: user.userId,
      })
      .returning();
    await writeLines(tx, quote!.id, priced.rows);
    await audit({ action: "quote.create", entityType: "quote", entityId: quote!.id, after: { jobId: input.jobId, totalCents: quote!.totalCents } });
    return { id: quote!.id, status: quote!.status, version: quote!.version, totalCents: quote!.totalCents, gstCents: quote!.gstCents };
  },
});

export const updateQuote = command({
  name: "quote.update",
  input: z.object({ id, version: version.optional() }).extend(quoteContentSchema.shape),
  permission: ["manage", "Quote"],
  run: async ({ user, input, tx, audit, now }) => {
    const { quote } = await ownQuote(tx, user, input.id);
    if (!EDITABLE_QUOTE_STATES.includes(quote.status)) {
      throw conflict(`A quote that is ${QUOTE_STATE_LABELS[quote.status].toLowerCase()} cannot be changed: only drafts and quotes returned for changes can`);
    }
    if (input.version !== undefined && input.version !== quote.version) throw conflict("This quote changed since you opened it; reload it and try again");
    await checkLineKeys(tx, quote.jobId, input);
    const priced = priceQuote(input, quote.gstMethod);
    const updated = await tx
      .update(quotes)
      .set({
        validUntil: input.validUntil ?? null,
        notes: input.notes,
        subtotalCents: priced.totals.exGstCents,
        gstCents: priced.totals.gstCents,
        totalCents: priced.totals.inclGstCents,
        version: quote.version + 1,
        updatedAt: now,
      })
      .where(and(eq(quotes.id, quote.id), eq(quotes.version, quote.version)))
      .returning();
    if (updated.length === 0) throw conflict("This quote changed since you opened it; reload it and try again");
    await writeLines(tx, quote.id, priced.rows);
    await audit({ action: "quote.update", entityType: "quote", entityId: quote.id, before: { totalCents: quote.totalCents }, after: { totalCents: priced.totals.inclGstCents, lines: priced.rows.length } });
    const q = updated[0]!;
    return { id: q.id, status: q.status, version: q.version, totalCents: q.totalCents, gstCents: q.gstCents, subtotalCents: q.subtotalCents };
  },
});

export const submitQuote = command({
  name: "quote.submit",
  input: z.object({ id, version: version.optional() }),
  permission: ["manage", "Quote"],
  run: async ({ user, input, tx, audit, mail, now }) => {
    const { quote, job, firmName } = await ownQuote(tx, user, input.id);
    assertQuoteMove(quote.status, "submitted");
    if (input.version !== undefined && input.version !== quote.version) throw conflict("This quote changed since you opened it; reload it and try again");
    if (job.state !== "quoting") throw conflict("This job is no longer out for quotes");
    const lines = await loadQuoteLines(tx, [quote.id]);
    if (lines.length === 0) throw new AppError("validation_failed", "Add at least one line before submitting", [{ field: "lines", message: "Add at least one line" }]);
    if (!quote.validUntil) throw new AppError("validation_failed", "Say how long the quote is valid before submitting", [{ field: "validUntil", message: "Give the date the quote is valid until" }]);
    if (quote.validUntil.getTime() < now.getTime()) throw new AppError("validation_failed", "The quote's validity date has passed", [{ field: "validUntil", message: "Give a date in the future" }]);
    // A resubmission after "returned" is a new revision; every submitted revision is kept.
    const revision = quote.status === "returned" ? quote.revision + 1 : quote.revision;
    const updated = await tx
      .update(quotes)
      .set({ status: "submitted", revision, submittedBy: user.userId, submittedAt: now, version: quote.version + 1, updatedAt: now })
      .where(and(eq(quotes.id, quote.id), eq(quotes.version, quote.version)))
      .returning();
    if (updated.length === 0) throw conflict("This quote changed since you opened it; reload it and try again");
    await tx.insert(quoteRevisions).values({
      quoteId: quote.id,
      revision,
      snapshot: {
        submittedBy: user.userId,
        submittedAt: now.toISOString(),
        validUntil: quote.validUntil.toISOString(),
        notes: quote.notes,
        subtotalCents: quote.subtotalCents,
        gstCents: quote.gstCents,
        totalCents: quote.totalCents,
        gstMethod: quote.gstMethod,
        lines: lines.map(({ id: _id, quoteId: _q, ...l }) => l),
      },
    });
    await audit({ action: "quote.submit", entityType: "quote", entityId: quote.id, before: { status: quote.status }, after: { status: "submitted", revision, totalCents: quote.totalCents } });
    const [vehicle] = await tx.select({ fleetNumber: vehicles.fleetNumber }).from(vehicles).where(eq(vehicles.id, job.vehicleId));
    await noticeQuoteSubmitted(tx, mail, user.orgId, { id: job.id, number: job.number, title: job.title, fleetNumber: vehicle?.fleetNumber ?? "" }, { id: quote.id, firmName, totalCents: quote.totalCents, revision });
    return { id: quote.id, status: "submitted" as const, revision, version: updated[0]!.version };
  },
});

export const withdrawQuote = command({
  name: "quote.withdraw",
  input: z.object({ id, reason: z.string().trim().max(2000).optional().transform((v) => v || null) }),
  permission: ["manage", "Quote"],
  run: async ({ user, input, tx, audit, now }) => {
    const { quote } = await ownQuote(tx, user, input.id);
    assertQuoteMove(quote.status, "withdrawn");
    await tx.update(quotes).set({ status: "withdrawn", version: quote.version + 1, updatedAt: now }).where(and(eq(quotes.id, quote.id), eq(quotes.version, quote.version)));
    await audit({ action: "quote.withdraw", entityType: "quote", entityId: quote.id, before: { status: quote.status }, after: { status: "withdrawn" }, reason: input.reason });
    return { id: quote.id, status: "withdrawn" as const };
  },
});

// ─── Decisions ─────────────────────────────────────────────────────────────────

type DecisionKind = (typeof decisions.$inferInsert)["decision"];

/**
 * Records one decision on the version of the quote the decider saw: the quote row moves only if
 * it still has that version, and the unique (quote, version) index refuses a second decision
 * even if two ever raced past the check. Exactly one wins; the other answers 409.
 */
async function recordDecision(
  ctx: Pick<CommandContext<unknown>, "tx" | "audit" | "user" | "now">,
  quote: typeof quotes.$inferSelect,
  seenVersion: number,
  kind: DecisionKind,
  to: QuoteState,
  reason: string | null,
) {
  const { tx, audit, user, now } = ctx;
  if (seenVersion !== quote.version) throw conflict("This quote was decided or changed by someone else just now; reload it to see what happened");
  assertQuoteMove(quote.status, to);
  const moved = await tx
    .update(quotes)
    .set({ status: to, version: quote.version + 1, updatedAt: now })
    .where(and(eq(quotes.id, quote.id), eq(quotes.version, seenVersion)))
    .returning({ id: quotes.id });
  if (moved.length === 0) throw conflict("This quote was decided or changed by someone else just now; reload it to see what happened");
  await tx.insert(decisions).values({ orgId: user.orgId, quoteId: quote.id, decision: kind, reason, quoteVersion: seenVersion, decidedBy: user.userId });
  await audit({ action: `quote.${kind}`, entityType: "quote", entityId: quote.id, before: { status: quote.status, version: quote.version }, after: { status: to, version: quote.version + 1 }, reason });
}

async function assertNotOwnWork(tx: Tx, user: SignedIn, quote: typeof quotes.$inferSelect) {
  const revisions = await tx.select({ snapshot: quoteRevisions.snapshot }).from(quoteRevisions).where(eq(quoteRevisions.quoteId, quote.id));
  const revisedBy = revisions.map((r) => String((r.snapshot as { submittedBy?: string }).submittedBy ?? ""));
  if (!mayDecide(user.userId, { submittedBy: quote.submittedBy, createdBy: quote.createdBy, revisedBy })) {
    throw forbidden("Nobody decides their own work: you submitted or revised this quote");
  }
}

/** Awards the job to the accepted quote's firm, after checking the build order allows its lines. */
async function awardJob(ctx: Pick<CommandContext<unknown>, "tx" | "audit" | "user" | "now" | "mail">, quote: typeof quotes.$inferSelect) {
  const { tx, user, now } = ctx;
  const [job] = await tx.select().from(jobs).where(eq(jobs.id, quote.jobId));
  if (!job) throw notFound("That job");
  const { lines } = await loadVehicleLines(tx, user, job.vehicleId, now);
  const keys = (await tx.select({ lineKey: jobLines.lineKey }).from(jobLines).where(eq(jobLines.jobId, job.id))).map((l) => l.lineKey).filter((k): k is string => Boolean(k));
  const plan = jobPlan(lines, keys);
  if (!plan.award.ok) {
    const words = plan.award.refused
      .map((r) => `${r.label} waits for ${r.missing.map((m) => `${m.label}${m.reason === "awaiting-sign-off" ? " (engineering sign-off first)" : ""}`).join(", ")}`)
      .join("; ");
    throw conflict(`This job cannot be awarded yet: ${words}`);
  }
  await moveJob(ctx, job, "awarded", { awardedFirmId: quote.firmId });
  // The other quotes still in the running are declined with the reason, once each.
  const others = await tx.select().from(quotes).where(and(eq(quotes.jobId, job.id), ne(quotes.id, quote.id), inArray(quotes.status, ["draft", "submitted", "returned"])));
  const [vehicle] = await tx.select({ fleetNumber: vehicles.fleetNumber }).from(vehicles).where(eq(vehicles.id, job.vehicleId));
  const ref = { id: job.id, number: job.number, title: job.title, fleetNumber: vehicle?.fleetNumber ?? "" };
  for (const other of others) {
    const reason = "The work was awarded to another workshop";
    if (other.status === "draft" || other.status === "returned") {
      await tx.update(quotes).set({ status: "withdrawn", version: other.version + 1, updatedAt: now }).where(eq(quotes.id, other.id));
      await ctx.audit({ action: "quote.withdrawn", entityType: "quote", entityId: other.id, before: { status: other.status }, after: { status: "withdrawn" }, reason });
    } else {
      await recordDecision(ctx, other, other.version, "decline", "declined", reason);
    }
    await noticeQuoteDecided(tx, ctx.mail, user.orgId, ref, other, { word: "Declined", reason });
  }
  return ref;
}

async function decidable(tx: Tx, user: SignedIn, quoteId: string) {
  const row = await loadQuoteRow(tx, user, quoteId);
  if (!row) throw notFound("That quote");
  return row;
}

export const decideQuote = command({
  name: "quote.decide",
  input: decisionInputSchema.and(z.object({ id })),
  permission: ["decide", "QuoteDecision"],
  run: async (ctx) => {
    const { user, input, tx, mail } = ctx;
    const { quote, job, firmName } = await decidable(tx, user, input.id);
    await assertNotOwnWork(tx, user, quote);
    if (input.version !== quote.version) throw conflict("This quote was decided or changed by someone else just now; reload it to see what happened");
    if (job.state !== "quoting") throw conflict(`This job is ${job.state.replace("_", " ")}: quotes are decided only while it is out for quotes`);
    const [org] = await tx.select({ thresholdCents: organisations.approvalThresholdCents }).from(organisations).where(eq(organisations.id, user.orgId));
    const threshold = org?.thresholdCents ?? 0;
    const outcome = decisionOutcome(input.decision, quote.totalCents, threshold);
    if (input.decision === "accept") {
      const rival = await tx.select({ id: quotes.id }).from(quotes).where(and(eq(quotes.jobId, job.id), ne(quotes.id, quote.id), inArray(quotes.status, ["awaiting_finance", "accepted"]))).limit(1);
      if (rival.length) throw conflict("Another quote for this job is already accepted or waiting for finance");
    }
    await recordDecision(ctx, quote, input.version, input.decision, outcome.status, input.reason || null);
    const [vehicle] = await tx.select({ fleetNumber: vehicles.fleetNumber }).from(vehicles).where(eq(vehicles.id, job.vehicleId));
    const ref = { id: job.id, number: job.number, title: job.title, fleetNumber: vehicle?.fleetNumber ?? "" };
    if (outcome.awards) await awardJob(ctx, { ...quote, status: "accepted", version: quote.version + 1 });
    if (outcome.needsFinance) {
      await noticeFinanceNeeded(tx, mail, user.orgId, ref, { id: quote.id, firmName, totalCents: quote.totalCents }, threshold);
    } else {
      const word = outcome.status === "accepted" ? "Accepted" : outcome.status === "declined" ? "Declined" : "Returned for changes";
      await noticeQuoteDecided(tx, mail, user.orgId, ref, quote, { word, reason: input.reason || null });
    }
    return { id: quote.id, status: outcome.status, needsFinance: outcome.needsFinance, version: quote.version + 1 };
  },
});

export const financeApproval = command({
  name: "quote.finance_approval",
  input: financeApprovalInputSchema.and(z.object({ id })),
  permission: ["approve", "FinanceApproval"],
  run: async (ctx) => {
    const { user, input, tx, mail } = ctx;
    const { quote, job } = await decidable(tx, user, input.id);
    await assertNotOwnWork(tx, user, quote);
    if (quote.status !== "awaiting_finance") assertQuoteMove(quote.status, input.approve ? "accepted" : "declined");
    if (quote.status !== "awaiting_finance") throw conflict("This quote is not waiting for a finance approval");
    const outcome = financeOutcome(input.approve);
    await recordDecision(ctx, quote, input.version, input.approve ? "finance_approve" : "finance_decline", outcome.status, input.reason || null);
    const [vehicle] = await tx.select({ fleetNumber: vehicles.fleetNumber }).from(vehicles).where(eq(vehicles.id, job.vehicleId));
    const ref = { id: job.id, number: job.number, title: job.title, fleetNumber: vehicle?.fleetNumber ?? "" };
    if (outcome.awards) await awardJob(ctx, { ...quote, status: "accepted", version: quote.version + 1 });
    await noticeQuoteDecided(tx, mail, user.orgId, ref, quote, { word: input.approve ? "Accepted" : "Declined", reason: input.reason || null });
    return { id: quote.id, status: outcome.status, version: quote.version + 1 };
  },
});

/** The finance queue: quotes waiting for a finance approval, oldest first. */
export const approvalsQueue = query({
  name: "quote.approvals",
  input: z.object({}).passthrough(),
  permission: ["approve", "FinanceApproval"],
  run: async ({ user }) => {
    const rows = await listQuoteRows(db(), user, { status: "awaiting_finance" });
    const [org] = await db().select({ thresholdCents: organisations.approvalThresholdCents }).from(organisations).where(eq(organisations.id, user.orgId));
    const decided = await loadDecisions(db(), rows.map((r) => r.id));
    return {
      thresholdCents: org?.thresholdCents ?? 0,
      items: rows
        .map((r) => ({ ...r, acceptedBy: decided.filter((d) => d.quoteId === r.id && d.decision === "accept").at(-1) ?? null }))
        .sort((a, b) => a.updatedAt.getTime() - b.updatedAt.getTime()),
    };
  },
});
