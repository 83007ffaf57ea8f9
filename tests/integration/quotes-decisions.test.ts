import { and, eq } from "drizzle-orm";
import { describe, expect, it, vi } from "vitest";
import { POST as raiseJobRoute } from "@/app/api/jobs/route";
import { POST as offerRoute } from "@/app/api/jobs/[id]/offers/route";
import { POST as progressRoute } from "@/app/api/jobs/[id]/progress/route";
import { GET as listQuotesRoute, POST as createQuoteRoute } from "@/app/api/quotes/route";
import { GET as getQuoteRoute, PATCH as patchQuoteRoute } from "@/app/api/quotes/[id]/route";
import { POST as submitRoute } from "@/app/api/quotes/[id]/submit/route";
import { POST as decisionRoute } from "@/app/api/quotes/[id]/decision/route";
import { POST as financeRoute } from "@/app/api/quotes/[id]/finance-approval/route";
import { POST as withdrawRoute } from "@/app/api/quotes/[id]/withdraw/route";
import { auditEntries, contractorFirms, decisions, jobs, organisations, outboxMessages, quoteLines, quoteRevisions, quotes, users, vehicles } from "@/db/schema";
import { useTestDatabase } from "../helpers/db";
import { callRoute, requestUser } from "../helpers/route";
import { signedInAs } from "../helpers/users";

vi.mock("@/lib/server/session", async (original) => ({
  ...(await original<typeof import("@/lib/server/session")>()),
  currentUser: async () => requestUser.current,
}));

const database = await useTestDatabase();
const manager = await signedInAs(database, "manager@mirrabel-health.example");
const manager2 = await signedInAs(database, "manager2@mirrabel-health.example");
const finance = await signedInAs(database, "finance@mirrabel-health.example");
const admin = await signedInAs(database, "admin@mirrabel-health.example");
const driver = await signedInAs(database, "driver@mirrabel-health.example");
const contractorA = await signedInAs(database, "contractor@tallowbark-fitout.example");
const contractorB = await signedInAs(database, "contractor@spindleflat-4x4.example");
const otherOrgContractor = await signedInAs(database, "contractor@quandong-road.example");
const firmA = (await database.query.contractorFirms.findFirst({ where: eq(contractorFirms.name, "Tallowbark Fit-Out Workshop") }))!;
const firmB = (await database.query.contractorFirms.findFirst({ where: eq(contractorFirms.name, "Spindle Flat 4x4 Works") }))!;
const vehicle = (await database.query.vehicles.findFirst({ where: eq(vehicles.fleetNumber, "MH-012") }))!;
const validUntil = new Date(Date.now() + 30 * 86_400_000).toISOString().slice(0, 10);

/** A job of free-text work, offered to both demo firms, out for quotes. */
async function jobOutForQuotes(title = "Fit a cargo barrier") {
  const raised = await callRoute(raiseJobRoute, { user: manager, body: { vehicleId: vehicle.id, title, freeText: [title] } });
  const id = (raised.json as { id: string }).id;
  await callRoute(offerRoute, { user: manager, params: { id }, body: { firmIds: [firmA.id, firmB.id] } });
  return id;
}

const part = (unitPriceCents: number, description = "Cargo barrier") => ({ kind: "part", description, quantity: 1, unitPriceCents, taxable: true });

async function submittedQuote(jobId: string, contractor = contractorA, lines: unknown[] = [part(100_000)]) {
  const created = await callRoute(createQuoteRoute, { user: contractor, body: { jobId, lines, validUntil } });
  expect(created.status).toBe(201);
  const id = (created.json as { id: string }).id;
  const submitted = await callRoute(submitRoute, { user: contractor, params: { id }, body: {} });
  expect(submitted.status).toBe(200);
  return { id, version: (submitted.json as { version: number }).version };
}

describe("GST on quotes", () => {
  it("works out GST per line with half a cent up, as the organisation's method says", async () => {
    const jobId = await jobOutForQuotes();
    const { status, json } = await callRoute(createQuoteRoute, {
      user: contractorA,
      body: { jobId, validUntil, lines: [part(10_000, "Barrier"), part(1_235, "Bolt kit"), { kind: "labour", description: "Fit", hours: 1.5, rateCents: 12_000, taxable: true }, { kind: "other", description: "Disposal (GST-free)", quantity: 1, unitPriceCents: 2_000, taxable: false }] },
    });
    expect(status).toBe(201);
    const quote = await database.query.quotes.findFirst({ where: eq(quotes.id, (json as { id: string }).id) });
    const lines = await database.select().from(quoteLines).where(eq(quoteLines.quoteId, quote!.id));
    // A New Tax System (GST Imposition—General) Act 1999 s 4 (P): $100.00 excl. → $10.00 GST
    expect(lines[0]).toMatchObject({ amountCents: 10_000, gstCents: 1_000 });
    // GST Act s 9-90 (P): one supply of $12.35 → 1.235 → $1.24 (nearest cent, 0.5 c up)
    expect(lines[1]).toMatchObject({ amountCents: 1_235, gstCents: 124 });
    // labour 1.5 h × $120.00 = $180.00, GST $18.00 (hand-worked at the 10 % rate, s 4)
    expect(lines[2]).toMatchObject({ kind: "labour", hours: 1.5, rateCents: 12_000, amountCents: 18_000, gstCents: 1_800 });
    expect(lines[3]).toMatchObject({ taxable: false, gstCents: 0 });
    expect(quote).toMatchObject({ gstMethod: "per-line", subtotalCents: 31_235, gstCents: 2_924, totalCents: 34_159 });
  });

  it("rounds once on the total when the organisation chose the invoice-total method", async () => {
    const org = (await database.query.organisations.findFirst({ where: eq(organisations.id, manager.orgId) }))!;
    await database.update(organisations).set({ gstMethod: "invoice-total" }).where(eq(organisations.id, org.id));
    try {
      const jobId = await jobOutForQuotes();
      const { json } = await callRoute(createQuoteRoute, { user: contractorA, body: { jobId, lines: [part(1_235), part(1_235)] } });
      const item = json as { totalCents: number; gstCents: number };
      // GST Act s 9-90 (P): two lines of $12.35 summed then rounded: 2.470 → $2.47
      expect(item.gstCents).toBe(247);
      expect(item.totalCents).toBe(2_717);
      const detail = await callRoute(getQuoteRoute, { user: contractorA, params: { id: (json as { id: string }).id } });
      expect((detail.json as { methodDescription: string }).methodDescription).toMatch(/once on the total/);
    } finally {
      await database.update(organisations).set({ gstMethod: org.gstMethod }).where(eq(organisations.id, org.id));
    }
  });
});

describe("drafting, submitting, revising, withdrawing", () => {
  it("submits, is returned with comments, revises, resubmits: every submitted revision is kept, the latest is live", async () => {
    const jobId = await jobOutForQuotes();
    const { id, version } = await submittedQuote(jobId);
    const returned = await callRoute(decisionRoute, { user: manager, params: { id }, body: { decision: "return", reason: "Quote the barrier fitted, not loose", version } });
    expect(returned.status).toBe(200);
    expect((returned.json as { status: string }).status).toBe("returned");
    const current = (await database.query.quotes.findFirst({ where: eq(quotes.id, id) }))!;
    const patched = await callRoute(patchQuoteRoute, { user: contractorA, method: "PATCH", params: { id }, body: { lines: [part(100_000), { kind: "labour", description: "Fit barrier", hours: 2, rateCents: 13_000, taxable: true }], validUntil, version: current.version } });
    expect(patched.status).toBe(200);
    const resubmitted = await callRoute(submitRoute, { user: contractorA, params: { id }, body: {} });
    expect(resubmitted.json).toMatchObject({ status: "submitted", revision: 2 });
    const revisions = await database.select().from(quoteRevisions).where(eq(quoteRevisions.quoteId, id));
    expect(revisions.map((r) => r.revision).sort()).toEqual([1, 2]);
    const first = revisions.find((r) => r.revision === 1)!.snapshot as { totalCents: number; lines: unknown[] };
    expect(first.totalCents).toBe(110_000);
    expect(first.lines).toHaveLength(1);
    const live = (await database.query.quotes.findFirst({ where: eq(quotes.id, id) }))!;
    // $1,000 + 2 h × $130 = $1,260 excl., GST $126 (10 %, hand-worked)
    expect(live).toMatchObject({ revision: 2, subtotalCents: 126_000, gstCents: 12_600, totalCents: 138_600 });
  });

  it("refuses edits of a submitted quote (409) and a second live quote from the same firm", async () => {
    const jobId = await jobOutForQuotes();
    const { id } = await submittedQuote(jobId);
    const edit = await callRoute(patchQuoteRoute, { user: contractorA, method: "PATCH", params: { id }, body: { lines: [part(1)] } });
    expect(edit.status).toBe(409);
    expect(edit.json).toMatchObject({ error: { message: expect.stringContaining("only drafts and quotes returned for changes") } });
    const second = await callRoute(createQuoteRoute, { user: contractorA, body: { jobId, lines: [] } });
    expect(second.status).toBe(409);
  });

  it("will not submit without lines or a validity date, naming the field", async () => {
    const jobId = await jobOutForQuotes();
    const created = await callRoute(createQuoteRoute, { user: contractorA, body: { jobId } });
    const id = (created.json as { id: string }).id;
    const empty = await callRoute(submitRoute, { user: contractorA, params: { id }, body: {} });
    expect(empty.status).toBe(422);
    expect(empty.json).toMatchObject({ error: { details: [{ field: "lines" }] } });
    await callRoute(patchQuoteRoute, { user: contractorA, method: "PATCH", params: { id }, body: { lines: [part(5_000)] } });
    const undated = await callRoute(submitRoute, { user: contractorA, params: { id }, body: {} });
    expect(undated.json).toMatchObject({ error: { details: [{ field: "validUntil" }] } });
    expect((await database.query.quotes.findFirst({ where: eq(quotes.id, id) }))?.status).toBe("draft");
  });

  it("withdraws a submitted quote; a withdrawn quote is final", async () => {
    const jobId = await jobOutForQuotes();
    const { id } = await submittedQuote(jobId);
    expect((await callRoute(withdrawRoute, { user: contractorA, params: { id }, body: { reason: "Cannot get parts" } })).status).toBe(200);
    const again = await callRoute(withdrawRoute, { user: contractorA, params: { id }, body: {} });
    expect(again.status).toBe(409);
  });

  it("tells the managers when a quote is submitted, except those who turned such notices off", async () => {
    await database.update(users).set({ notifyNonEssential: false }).where(eq(users.id, manager2.userId));
    try {
      const jobId = await jobOutForQuotes();
      const { id } = await submittedQuote(jobId);
      const mails = await database.select().from(outboxMessages).where(eq(outboxMessages.kind, "quote.submitted"));
      const forThis = mails.filter((m) => m.textBody.includes(`/jobs/${jobId}`));
      expect(forThis.map((m) => m.toAddress)).toContain("manager@mirrabel-health.example");
      expect(forThis.map((m) => m.toAddress)).not.toContain("manager2@mirrabel-health.example");
      expect(forThis[0]?.htmlBody).toContain("Compare the quotes");
      expect(id).toBeTruthy();
    } finally {
      await database.update(users).set({ notifyNonEssential: true }).where(eq(users.id, manager2.userId));
    }
  });
});

describe("decisions", () => {
  it("accepts below the threshold: the job is awarded, the other quote declined with the reason, each firm told", async () => {
    const jobId = await jobOutForQuotes();
    const a = await submittedQuote(jobId, contractorA, [part(200_000)]);
    const b = await submittedQuote(jobId, contractorB, [part(250_000)]);
    const accepted = await callRoute(decisionRoute, { user: manager, params: { id: a.id }, body: { decision: "accept", version: a.version } });
    expect(accepted.json).toMatchObject({ status: "accepted", needsFinance: false });
    expect(await database.query.jobs.findFirst({ where: eq(jobs.id, jobId) })).toMatchObject({ state: "awarded", awardedFirmId: firmA.id });
    const other = await database.query.quotes.findFirst({ where: eq(quotes.id, b.id) });
    expect(other?.status).toBe("declined");
    const otherDecision = await database.query.decisions.findFirst({ where: eq(decisions.quoteId, b.id) });
    expect(otherDecision?.reason).toBe("The work was awarded to another workshop");
    const decided = await database.select().from(outboxMessages).where(eq(outboxMessages.kind, "quote.decided"));
    const forJob = decided.filter((m) => m.textBody.includes(`/quotes/${a.id}`) || m.textBody.includes(`/quotes/${b.id}`));
    expect(forJob.map((m) => m.toAddress).sort()).toEqual(["contractor@spindleflat-4x4.example", "contractor@tallowbark-fitout.example"]);
    const audit = await database.query.auditEntries.findFirst({ where: and(eq(auditEntries.entityId, a.id), eq(auditEntries.action, "quote.accept")) });
    expect(audit).toMatchObject({ actorId: manager.userId });
  });

  it("above the threshold waits for finance, then finance approves and the job is awarded", async () => {
    const jobId = await jobOutForQuotes();
    // $5,000.00 excl. + GST = $5,500.00 > the $5,000.00 threshold (incl. GST)
    const a = await submittedQuote(jobId, contractorA, [part(500_000)]);
    const accepted = await callRoute(decisionRoute, { user: manager, params: { id: a.id }, body: { decision: "accept", version: a.version } });
    expect(accepted.json).toMatchObject({ status: "awaiting_finance", needsFinance: true });
    expect((await database.query.jobs.findFirst({ where: eq(jobs.id, jobId) }))?.state).toBe("quoting");
    const financeMail = (await database.select().from(outboxMessages).where(eq(outboxMessages.kind, "quote.finance_needed"))).filter((m) => m.subject.includes("$5,500.00"));
    expect(financeMail.map((m) => m.toAddress)).toContain("finance@mirrabel-health.example");

    const managerTries = await callRoute(financeRoute, { user: manager, params: { id: a.id }, body: { approve: true, version: 3 } });
    expect(managerTries.status).toBe(403);
    const quote = (await database.query.quotes.findFirst({ where: eq(quotes.id, a.id) }))!;
    const approved = await callRoute(financeRoute, { user: finance, params: { id: a.id }, body: { approve: true, version: quote.version } });
    expect(approved.json).toMatchObject({ status: "accepted" });
    expect(await database.query.jobs.findFirst({ where: eq(jobs.id, jobId) })).toMatchObject({ state: "awarded", awardedFirmId: firmA.id });
    const twice = await callRoute(financeRoute, { user: finance, params: { id: a.id }, body: { approve: true, version: quote.version + 1 } });
    expect(twice.status).toBe(409);
  });

  it("two simultaneous decisions on one quote: exactly one wins, the other is a 409, one decision row", async () => {
    const jobId = await jobOutForQuotes();
    const a = await submittedQuote(jobId, contractorA, [part(100_000)]);
    const [first, second] = await Promise.all([
      callRoute(decisionRoute, { user: manager, params: { id: a.id }, body: { decision: "accept", version: a.version } }),
      callRoute(decisionRoute, { user: manager2, params: { id: a.id }, body: { decision: "decline", reason: "Too dear", version: a.version } }),
    ]);
    const statuses = [first.status, second.status].sort();
    expect(statuses).toEqual([200, 409]);
    const loser = first.status === 409 ? first : second;
    expect(loser.json).toMatchObject({ error: { code: "conflict" } });
    const rows = await database.select().from(decisions).where(eq(decisions.quoteId, a.id));
    expect(rows).toHaveLength(1);
    const quote = await database.query.quotes.findFirst({ where: eq(quotes.id, a.id) });
    expect(quote?.status).toBe(rows[0]!.decision === "accept" ? "accepted" : "declined");
  });

  it("a decision on a stale version is refused, and decisions are final", async () => {
    const jobId = await jobOutForQuotes();
    const a = await submittedQuote(jobId);
    const stale = await callRoute(decisionRoute, { user: manager, params: { id: a.id }, body: { decision: "accept", version: a.version - 1 } });
    expect(stale.status).toBe(409);
    await callRoute(decisionRoute, { user: manager, params: { id: a.id }, body: { decision: "decline", reason: "Out of area", version: a.version } });
    const after = await callRoute(decisionRoute, { user: manager, params: { id: a.id }, body: { decision: "accept", version: a.version + 1 } });
    expect(after.status).toBe(409);
    expect(after.json).toMatchObject({ error: { message: expect.stringContaining("decisions are final") } });
  });

  it("nobody decides their own work", async () => {
    const jobId = await jobOutForQuotes();
    const a = await submittedQuote(jobId);
    // The contractor has no decision right at all; a manager who submitted it would be refused by the own-work rule.
    expect((await callRoute(decisionRoute, { user: contractorA, params: { id: a.id }, body: { decision: "accept", version: a.version } })).status).toBe(403);
    await database.update(quotes).set({ submittedBy: manager.userId }).where(eq(quotes.id, a.id));
    const own = await callRoute(decisionRoute, { user: manager, params: { id: a.id }, body: { decision: "accept", version: a.version } });
    expect(own.status).toBe(403);
    expect(own.json).toMatchObject({ error: { message: expect.stringContaining("Nobody decides their own work") } });
    expect(await database.select().from(decisions).where(eq(decisions.quoteId, a.id))).toHaveLength(0);
  });

  it("a contractor cannot move a job on before it is awarded to their firm", async () => {
    const jobId = await jobOutForQuotes();
    await submittedQuote(jobId);
    const moved = await callRoute(progressRoute, { user: contractorA, params: { id: jobId }, body: { to: "in_workshop" } });
    expect(moved.status).toBe(403);
    expect((await database.query.jobs.findFirst({ where: eq(jobs.id, jobId) }))?.state).toBe("quoting");
  });
});

describe("who may read and change quotes", () => {
  it("a contractor of firm A can neither read nor change firm B's quote", async () => {
    const jobId = await jobOutForQuotes();
    const b = await submittedQuote(jobId, contractorB, [part(77_700)]);
    expect((await callRoute(getQuoteRoute, { user: contractorA, params: { id: b.id } })).status).toBe(404);
    expect((await callRoute(patchQuoteRoute, { user: contractorA, method: "PATCH", params: { id: b.id }, body: { lines: [] } })).status).toBe(404);
    expect((await callRoute(withdrawRoute, { user: contractorA, params: { id: b.id }, body: {} })).status).toBe(404);
    const list = await callRoute(listQuotesRoute, { user: contractorA, url: `http://localhost/api/quotes?jobId=${jobId}` });
    const items = (list.json as { items: { firmId: string; totalCents: number }[] }).items;
    expect(items.every((q) => q.firmId === firmA.id)).toBe(true);
    expect(items.some((q) => q.totalCents === 85_470)).toBe(false);
  });

  it("a contractor cannot quote a job not offered to their firm, nor another organisation's", async () => {
    const raised = await callRoute(raiseJobRoute, { user: manager, body: { vehicleId: vehicle.id, title: "Only B", freeText: ["x"] } });
    const id = (raised.json as { id: string }).id;
    await callRoute(offerRoute, { user: manager, params: { id }, body: { firmIds: [firmB.id] } });
    expect((await callRoute(createQuoteRoute, { user: contractorA, body: { jobId: id } })).status).toBe(404);
    expect((await callRoute(createQuoteRoute, { user: otherOrgContractor, body: { jobId: id } })).status).toBe(404);
  });

  it("a driver cannot reach quotes at all; finance and managers cannot edit quote lines", async () => {
    expect((await callRoute(listQuotesRoute, { user: driver, url: "http://localhost/api/quotes" })).status).toBe(403);
    const jobId = await jobOutForQuotes();
    const a = await submittedQuote(jobId);
    expect((await callRoute(getQuoteRoute, { user: driver, params: { id: a.id } })).status).toBe(403);
    for (const user of [finance, manager, admin]) {
      expect((await callRoute(patchQuoteRoute, { user, method: "PATCH", params: { id: a.id }, body: { lines: [part(1)] } })).status, user.email).toBe(403);
      expect((await callRoute(createQuoteRoute, { user, body: { jobId } })).status, user.email).toBe(403);
    }
  });

  it("every quote item carries firmId, jobId, status, totalCents and gstCents", async () => {
    const { json, status } = await callRoute(listQuotesRoute, { user: finance, url: "http://localhost/api/quotes" });
    expect(status).toBe(200);
    const items = (json as { items: Record<string, unknown>[] }).items;
    expect(items.length).toBeGreaterThan(0);
    for (const item of items) expect(item).toMatchObject({ firmId: expect.any(String), jobId: expect.any(String), status: expect.any(String), totalCents: expect.any(Number), gstCents: expect.any(Number) });
  });
});
