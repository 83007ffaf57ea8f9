import { and, eq } from "drizzle-orm";
import { describe, expect, it, vi } from "vitest";
import { GET as listJobsRoute, POST as raiseJobRoute } from "@/app/api/jobs/route";
import { GET as getJobRoute } from "@/app/api/jobs/[id]/route";
import { POST as offerRoute } from "@/app/api/jobs/[id]/offers/route";
import { POST as cancelRoute } from "@/app/api/jobs/[id]/cancel/route";
import { POST as progressRoute } from "@/app/api/jobs/[id]/progress/route";
import type { Database } from "@/db/client";
import { auditEntries, contractorFirms, editionLines, editions, fitments, jobLines, jobOffers, jobs, lineDependencies, outboxMessages, standards, vehicles } from "@/db/schema";
import { useTestDatabase } from "../helpers/db";
import { callRoute, requestUser } from "../helpers/route";
import { signedInAs } from "../helpers/users";

vi.mock("@/lib/server/session", async (original) => ({
  ...(await original<typeof import("@/lib/server/session")>()),
  currentUser: async () => requestUser.current,
}));

const database = await useTestDatabase();

/**
 * A small invented edition on one vehicle: tyres fitted below the load index (off-spec),
 * springs that depend on the tyres, a lift that waits for an engineering sign-off, recovery
 * boards with no dependency, and a first-aid kit that is fitted (meets).
 */
async function editionOnVehicle(db: Database, fleetNumber: string) {
  const vehicle = (await db.query.vehicles.findFirst({ where: eq(vehicles.fleetNumber, fleetNumber) }))!;
  const [standard] = await db.insert(standards).values({ orgId: vehicle.orgId, name: `Job test standard ${fleetNumber}` }).returning();
  const [edition] = await db.insert(editions).values({ orgId: vehicle.orgId, standardId: standard!.id, number: 1, status: "published", publishedAt: new Date() }).returning();
  const line = (code: string, category: (typeof editionLines.$inferInsert)["category"], title: string, extra: Partial<typeof editionLines.$inferInsert> = {}) => ({
    orgId: vehicle.orgId,
    editionId: edition!.id,
    key: `jt-${code.toLowerCase()}`,
    code,
    category,
    title,
    requirement: "must_fit" as const,
    ...extra,
  });
  const rows = await db
    .insert(editionLines)
    .values([
      line("TYR-01", "tyres", "All-terrain tyres LI ≥ 121", { quantity: 4, criteria: [{ attribute: "loadIndex", op: "gte", value: 121 }], evidenceNeeded: ["photo"], standardCostCents: 180_000, sortOrder: 1 }),
      line("SUS-01", "suspension", "Springs rated for the constant load", { evidenceNeeded: ["certificate"], standardCostCents: 250_000, sortOrder: 2 }),
      line("ENG-01", "engineering", "Engineering sign-off for the lift", { evidenceNeeded: ["engineering_signoff"], standardCostCents: 90_000, sortOrder: 3 }),
      line("SUS-02", "suspension", "40 mm lift kit", { evidenceNeeded: ["photo"], standardCostCents: 120_000, sortOrder: 4 }),
      line("REC-01", "recovery", "Recovery boards, pair", { evidenceNeeded: ["photo"], standardCostCents: 40_000, sortOrder: 5 }),
      line("SAF-01", "safety", "First-aid kit", { standardCostCents: 9_000, sortOrder: 6 }),
    ])
    .returning();
  const byCode = new Map(rows.map((r) => [r.code, r]));
  await db.insert(lineDependencies).values([
    { lineId: byCode.get("SUS-01")!.id, dependsOnLineId: byCode.get("TYR-01")!.id },
    { lineId: byCode.get("SUS-02")!.id, dependsOnLineId: byCode.get("ENG-01")!.id },
  ]);
  await db.update(vehicles).set({ editionId: edition!.id }).where(eq(vehicles.id, vehicle.id));
  await db.insert(fitments).values([
    { orgId: vehicle.orgId, vehicleId: vehicle.id, lineKey: "jt-tyr-01", label: "Tyres LI 116", quantity: 4, attributes: { loadIndex: 116 }, fittedAt: new Date("2025-01-01") },
    { orgId: vehicle.orgId, vehicleId: vehicle.id, lineKey: "jt-saf-01", label: "First-aid kit", quantity: 1, fittedAt: new Date("2025-01-01") },
  ]);
  return vehicle;
}

const manager = await signedInAs(database, "manager@mirrabel-health.example");
const contractorA = await signedInAs(database, "contractor@tallowbark-fitout.example");
const contractorB = await signedInAs(database, "contractor@spindleflat-4x4.example");
const driver = await signedInAs(database, "driver@mirrabel-health.example");
const finance = await signedInAs(database, "finance@mirrabel-health.example");
const otherOrgManager = await signedInAs(database, "manager@gidgee-trust.example");
const firmA = (await database.query.contractorFirms.findFirst({ where: eq(contractorFirms.name, "Tallowbark Fit-Out Workshop") }))!;
const firmB = (await database.query.contractorFirms.findFirst({ where: eq(contractorFirms.name, "Spindle Flat 4x4 Works") }))!;
const vehicle = await editionOnVehicle(database, "MH-010");

async function raise(body: Record<string, unknown>) {
  return callRoute(raiseJobRoute, { user: manager, body: { vehicleId: vehicle.id, title: "Close the gaps", ...body } });
}

describe("raising a job from a vehicle's variance", () => {
  it("raises a job with spec lines and free-text work, numbered, audited", async () => {
    const { status, json } = await raise({ lineKeys: ["jt-tyr-01", "jt-rec-01"], freeText: ["Check the rear diff breather"], dueAt: "2026-09-30" });
    expect(status).toBe(201);
    const { id, number } = json as { id: string; number: number };
    expect(number).toBeGreaterThanOrEqual(1);
    const lines = await database.select().from(jobLines).where(eq(jobLines.jobId, id));
    expect(lines.map((l) => [l.lineKey, l.description])).toEqual([
      ["jt-tyr-01", "TYR-01 All-terrain tyres LI ≥ 121"],
      ["jt-rec-01", "REC-01 Recovery boards, pair"],
      [null, "Check the rear diff breather"],
    ]);
    const job = await database.query.jobs.findFirst({ where: eq(jobs.id, id) });
    expect(job).toMatchObject({ state: "open", createdBy: manager.userId, costKind: "capital" });
    const audit = await database.query.auditEntries.findFirst({ where: and(eq(auditEntries.entityId, id), eq(auditEntries.action, "job.raise")) });
    expect(audit?.actorId).toBe(manager.userId);
  });

  it("refuses a line with no gap (it already meets) and a line not in the edition, naming the field", async () => {
    const meets = await raise({ lineKeys: ["jt-saf-01"] });
    expect(meets.status).toBe(422);
    expect(meets.json).toMatchObject({ error: { details: [{ field: "lineKeys.0" }] } });
    const unknown = await raise({ lineKeys: ["no-such-line"] });
    expect(unknown.status).toBe(422);
    const empty = await raise({ lineKeys: [], freeText: [] });
    expect(empty.status).toBe(422);
    expect(empty.json).toMatchObject({ error: { details: [{ field: "lineKeys" }] } });
  });

  it("shows the build order: lines waiting on unmet prerequisites are marked", async () => {
    const { json: raised } = await raise({ lineKeys: ["jt-sus-01", "jt-sus-02"] });
    const { status, json } = await callRoute(getJobRoute, { user: manager, params: { id: (raised as { id: string }).id } });
    expect(status).toBe(200);
    const detail = json as { lines: { lineKey: string; blockedBy: string[]; awardBlockedBy: { label: string; reason: string }[] }[]; canAwardLines: boolean };
    const springs = detail.lines.find((l) => l.lineKey === "jt-sus-01")!;
    const lift = detail.lines.find((l) => l.lineKey === "jt-sus-02")!;
    expect(springs.blockedBy).toEqual(["TYR-01 All-terrain tyres LI ≥ 121"]);
    expect(springs.awardBlockedBy).toEqual([{ label: "TYR-01 All-terrain tyres LI ≥ 121", reason: "not-included" }]);
    expect(lift.awardBlockedBy).toEqual([{ label: "ENG-01 Engineering sign-off for the lift", reason: "awaiting-sign-off" }]);
    expect(detail.canAwardLines).toBe(false);
  });

  it("refuses another organisation's vehicle as not found, and roles that may not raise jobs", async () => {
    const foreign = await callRoute(raiseJobRoute, { user: otherOrgManager, body: { vehicleId: vehicle.id, title: "x", freeText: ["y"] } });
    expect(foreign.status).toBe(404);
    for (const user of [finance, contractorA, driver]) {
      const refused = await callRoute(raiseJobRoute, { user, body: { vehicleId: vehicle.id, title: "x", freeText: ["y"] } });
      expect(refused.status, user.email).toBe(403);
    }
  });
});

describe("offering and moving a job", () => {
  it("offers to two firms with a due date: the job goes out for quotes and each firm is told", async () => {
    const { json } = await raise({ lineKeys: ["jt-rec-01"] });
    const id = (json as { id: string }).id;
    const before = await database.select().from(outboxMessages).where(eq(outboxMessages.kind, "job.offered"));
    const offered = await callRoute(offerRoute, { user: manager, params: { id }, body: { firmIds: [firmA.id, firmB.id], dueAt: "2026-10-15" } });
    expect(offered.status).toBe(200);
    const offers = await database.select().from(jobOffers).where(eq(jobOffers.jobId, id));
    expect(offers.map((o) => o.firmId).sort()).toEqual([firmA.id, firmB.id].sort());
    expect((await database.query.jobs.findFirst({ where: eq(jobs.id, id) }))?.state).toBe("quoting");
    const after = await database.select().from(outboxMessages).where(eq(outboxMessages.kind, "job.offered"));
    const fresh = after.filter((m) => !before.some((b) => b.id === m.id)).map((m) => m.toAddress);
    expect(fresh).toEqual(expect.arrayContaining(["contractor@tallowbark-fitout.example", "contractor@spindleflat-4x4.example", firmA.email, firmB.email]));
    const again = await callRoute(offerRoute, { user: manager, params: { id }, body: { firmIds: [firmA.id] } });
    expect(again.status).toBe(409);
  });

  it("answers 409 with the reason for an illegal move, and changes nothing", async () => {
    const { json } = await raise({ lineKeys: ["jt-rec-01"] });
    const id = (json as { id: string }).id;
    // open → in workshop is not a move of the job machine (and a manager may try it)
    const skip = await callRoute(progressRoute, { user: manager, params: { id }, body: { to: "in_workshop" } });
    expect(skip.status).toBe(409);
    expect(skip.json).toMatchObject({ error: { code: "conflict", message: expect.stringContaining("cannot become in the workshop") } });
    expect((await database.query.jobs.findFirst({ where: eq(jobs.id, id) }))?.state).toBe("open");

    const cancelled = await callRoute(cancelRoute, { user: manager, params: { id }, body: { reason: "Vehicle is being sold" } });
    expect(cancelled.status).toBe(200);
    const job = await database.query.jobs.findFirst({ where: eq(jobs.id, id) });
    expect(job).toMatchObject({ state: "cancelled", cancelReason: "Vehicle is being sold" });
    const twice = await callRoute(cancelRoute, { user: manager, params: { id }, body: { reason: "again" } });
    expect(twice.status).toBe(409);
    expect(twice.json).toMatchObject({ error: { message: "The job is already cancelled" } });
    const noReason = await callRoute(cancelRoute, { user: manager, params: { id }, body: {} });
    expect(noReason.status).toBe(422);
  });

  it("lets only the awarded firm's contractor move the work on", async () => {
    const { json } = await raise({ lineKeys: ["jt-rec-01"] });
    const id = (json as { id: string }).id;
    await callRoute(offerRoute, { user: manager, params: { id }, body: { firmIds: [firmA.id, firmB.id] } });
    await database.update(jobs).set({ state: "awarded", awardedFirmId: firmA.id }).where(eq(jobs.id, id));
    const wrongFirm = await callRoute(progressRoute, { user: contractorB, params: { id }, body: { to: "in_workshop" } });
    expect(wrongFirm.status).toBe(403);
    // Firm B learns the work went elsewhere, not to whom.
    const seenByB = await callRoute(getJobRoute, { user: contractorB, params: { id } });
    expect((seenByB.json as { job: { awardedFirmName: string; awardedFirmId: string } }).job).toMatchObject({ awardedFirmName: "Another workshop", awardedFirmId: "another" });
    expect(JSON.stringify(seenByB.json)).not.toContain(firmA.id);
    const moved = await callRoute(progressRoute, { user: contractorA, params: { id }, body: { to: "in_workshop" } });
    expect(moved.status).toBe(200);
    // evidence lodged needs evidence first
    const tooSoon = await callRoute(progressRoute, { user: contractorA, params: { id }, body: { to: "evidence_lodged" } });
    expect(tooSoon.status).toBe(409);
    // in the workshop the job can no longer be cancelled
    const late = await callRoute(cancelRoute, { user: manager, params: { id }, body: { reason: "changed our mind" } });
    expect(late.status).toBe(409);
    expect(late.json).toMatchObject({ error: { message: expect.stringContaining("can no longer be cancelled") } });
  });
});

describe("who sees which jobs", () => {
  it("a contractor sees only jobs offered or awarded to their firm, and never who else was asked", async () => {
    const { json: onlyB } = await raise({ lineKeys: ["jt-rec-01"], title: "Only for Spindle Flat" });
    const idB = (onlyB as { id: string }).id;
    await callRoute(offerRoute, { user: manager, params: { id: idB }, body: { firmIds: [firmB.id] } });

    const listA = await callRoute(listJobsRoute, { user: contractorA, url: "http://localhost/api/jobs" });
    const itemsA = (listA.json as { items: { id: string; offers: { firmId: string }[] }[] }).items;
    expect(itemsA.some((j) => j.id === idB)).toBe(false);
    expect(itemsA.length).toBeGreaterThan(0);
    expect(itemsA.every((j) => j.offers.every((o) => o.firmId === firmA.id))).toBe(true);

    const readB = await callRoute(getJobRoute, { user: contractorA, params: { id: idB } });
    expect(readB.status).toBe(404);
    const offerAsContractor = await callRoute(offerRoute, { user: contractorA, params: { id: idB }, body: { firmIds: [firmA.id] } });
    expect(offerAsContractor.status).toBe(403);
  });

  it("filters by state, firm and overdue", async () => {
    const quoting = await callRoute(listJobsRoute, { user: manager, url: "http://localhost/api/jobs?state=quoting" });
    const items = (quoting.json as { items: { state: string }[] }).items;
    expect(items.length).toBeGreaterThan(0);
    expect(items.every((j) => j.state === "quoting")).toBe(true);
    const byFirm = await callRoute(listJobsRoute, { user: manager, url: `http://localhost/api/jobs?firmId=${firmB.id}` });
    expect((byFirm.json as { items: { offers: { firmId: string }[] }[] }).items.every((j) => j.offers.some((o) => o.firmId === firmB.id))).toBe(true);

    const { json } = await raise({ lineKeys: ["jt-rec-01"], title: "Late job", dueAt: "2020-01-01" });
    const overdue = await callRoute(listJobsRoute, { user: manager, url: "http://localhost/api/jobs?overdue=1" });
    const overdueItems = (overdue.json as { items: { id: string; overdue: boolean }[] }).items;
    expect(overdueItems.some((j) => j.id === (json as { id: string }).id)).toBe(true);
    expect(overdueItems.every((j) => j.overdue)).toBe(true);
    const bad = await callRoute(listJobsRoute, { user: manager, url: "http://localhost/api/jobs?state=lost" });
    expect(bad.status).toBe(422);
  });

  it("another organisation sees none of these jobs", async () => {
    const other = await callRoute(listJobsRoute, { user: otherOrgManager, url: "http://localhost/api/jobs" });
    const items = (other.json as { items: { vehicleId: string }[] }).items;
    expect(items.some((j) => j.vehicleId === vehicle.id)).toBe(false);
  });
});
