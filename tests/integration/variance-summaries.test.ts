import { and, eq, inArray, isNotNull, ne, sql } from "drizzle-orm";
import { beforeAll, describe, expect, it, vi } from "vitest";
import { concessions, depots, editionLines, editions, evidence, fitments, jobs, lineDependencies, vehicles, vehicleVarianceSummaries } from "@/db/schema";
import { loadFleetVariance, type VarianceFilter } from "@/db/variance";
import { loadFleetVarianceFigures, SUMMARY_RULES_VERSION, varianceStatusByVehicle, type SummaryReadStats } from "@/db/variance-summary";
import { grantConcession, recordFitment, removeFitment } from "@/lib/commands/fitments";
import { getFleetVariance } from "@/lib/commands/variance";
import { confirmRollout, publishEdition, startDraft, updateLine } from "@/lib/commands/standards";
import { execute } from "@/lib/server/operation";
import type { SignedIn } from "@/lib/server/session";
import { criticalGapCount, earliestExpiry, expiringItemsOf } from "@/lib/readiness";
import { varianceStatus, vehicleFigures } from "@/lib/variance";
import { useTestDatabase } from "../helpers/db";
import { signedInAs } from "../helpers/users";

// The stored summaries are a cache of the full judgement (db/variance.ts): every check here
// compares the two on the demo fleet after one kind of write. The expected figures are the full
// loader's own, computed in the same test; none is typed in by hand.

const database = await useTestDatabase();
let manager: SignedIn;
const DAY_MS = 86_400_000;

const idOf = async (fleetNumber: string) =>
  (await database.query.vehicles.findFirst({ where: and(eq(vehicles.orgId, manager.orgId), eq(vehicles.fleetNumber, fleetNumber)) }))!.id;
const rowOf = async (vehicleId: string) => database.query.vehicleVarianceSummaries.findFirst({ where: eq(vehicleVarianceSummaries.vehicleId, vehicleId) });
const storedCount = async () => (await database.select({ n: sql<number>`count(*)` }).from(vehicleVarianceSummaries).where(eq(vehicleVarianceSummaries.orgId, manager.orgId)))[0]!.n;

/** Reads the figures from the summaries and checks them against the full judgement at `now`. */
async function expectSameAsFull(now = new Date(), filter?: VarianceFilter): Promise<SummaryReadStats> {
  const stats: SummaryReadStats = { stored: 0, judged: 0, written: 0 };
  const figures = await loadFleetVarianceFigures(database, manager, filter, now, { stats });
  const full = await loadFleetVariance(database, manager, filter, now);
  const { details: withValidity, ...fleet } = figures;
  const { details: fullDetails, ...fullFleet } = full;
  expect(fleet).toEqual(fullFleet);
  // Each figure holds until its stored row's valid_until (the row written back by this read).
  const stored = await database
    .select({ vehicleId: vehicleVarianceSummaries.vehicleId, validUntil: vehicleVarianceSummaries.validUntil })
    .from(vehicleVarianceSummaries)
    .where(isNotNull(vehicleVarianceSummaries.status));
  const storedUntil = new Map(stored.map((r) => [r.vehicleId, r.validUntil?.getTime() ?? null]));
  for (const f of withValidity) {
    if (f.editionId === null) expect(f.validUntil).toBeNull();
    else if (storedUntil.has(f.vehicleId)) expect(f.validUntil).toBe(storedUntil.get(f.vehicleId));
  }
  // The readiness facts kept beside the figures are the full judgement's (lib/readiness).
  const fullById = new Map(fullDetails.map((d) => [d.vehicleId, d]));
  for (const f of withValidity) {
    const d = fullById.get(f.vehicleId)!;
    expect(f.readinessFacts).toEqual(
      d.editionId === null
        ? null
        : {
            criticalGaps: criticalGapCount(d.variance),
            earliestExpiryMs: earliestExpiry(expiringItemsOf(d.lines, d.fitments, { registration: null, registrationExpiry: null }))?.getTime() ?? null,
          },
    );
  }
  const details = withValidity.map(({ validUntil: _validUntil, readinessFacts: _readinessFacts, ...rest }) => rest);
  expect(details).toEqual(
    fullDetails.map((d) => ({
      vehicleId: d.vehicleId,
      fleetNumber: d.fleetNumber,
      depotId: d.depotId,
      platformId: d.platformId,
      editionId: d.editionId,
      ...vehicleFigures(d.variance),
    })),
  );
  return stats;
}

/** A write's effect: the first read judges what the write cleared, the next reads only stored rows. */
async function expectRejudgedThenStored(now = new Date()): Promise<SummaryReadStats> {
  const first = await expectSameAsFull(now);
  const second = await expectSameAsFull(now);
  expect(second.judged).toBe(0);
  expect(second.stored).toBe(first.stored + first.judged);
  return first;
}

beforeAll(async () => {
  manager = await signedInAs(database, "manager@mirrabel-health.example");
});

describe("variance summaries equal the full judgement", () => {
  it("cold: every vehicle with an edition is judged and written back; warm: all are read back", async () => {
    await database.delete(vehicleVarianceSummaries);
    const cold = await expectSameAsFull();
    // 36 vehicles on edition 1 are not retired (the demo profiles: MH-001…036); 3 have no edition.
    expect(cold.judged).toBe(36);
    expect(cold.written).toBe(36);
    const warm = await expectSameAsFull();
    expect(warm).toEqual({ stored: 39, judged: 0, written: 0 });
  });

  it("the fleet view's figures are those of the full judgement", async () => {
    const view = await execute(getFleetVariance, manager, {});
    const full = await loadFleetVariance(database, manager, undefined, new Date());
    expect(view.overall).toEqual(full.overall);
    expect(view.statusCounts).toEqual(full.statusCounts);
    expect(view.vehicleStatusCounts).toEqual(full.vehicleStatusCounts);
    const withGaps = full.details.filter((d) => varianceStatus(d.variance) === "gaps");
    expect(view.vehiclesWithGaps.map((v) => v.vehicleId).sort()).toEqual(withGaps.map((d) => d.vehicleId).sort());
  });

  it("a fitment recorded clears only its vehicle, which is judged again", async () => {
    await expectSameAsFull();
    const before = await storedCount();
    const mh008 = await idOf("MH-008");
    await execute(recordFitment, manager, { vehicleId: mh008, lineKey: "shocks", label: "Shock absorbers", quantity: 4 });
    expect(await rowOf(mh008)).toBeUndefined();
    expect(await storedCount()).toBe(before - 1);
    const stats = await expectRejudgedThenStored();
    expect(stats.judged).toBe(1);
    expect((await rowOf(mh008))?.status).not.toBeNull();
  });

  it("a fitment removed", async () => {
    const mh002 = await idOf("MH-002");
    const [snorkel] = await database.select().from(fitments).where(and(eq(fitments.vehicleId, mh002), eq(fitments.lineKey, "snorkel")));
    await expectSameAsFull();
    await execute(removeFitment, manager, { id: snorkel!.id });
    expect(await rowOf(mh002)).toBeUndefined();
    const stats = await expectRejudgedThenStored();
    expect(stats.judged).toBe(1);
    expect((await rowOf(mh002))?.status).toBe("gaps");
  });

  it("a fitment's measured value changed", async () => {
    const mh001 = await idOf("MH-001");
    const [tyres] = await database.select().from(fitments).where(and(eq(fitments.vehicleId, mh001), eq(fitments.lineKey, "tyres-all-terrain")));
    await expectSameAsFull();
    const offSpecBefore = (await rowOf(mh001))!.offSpec;
    await database.update(fitments).set({ attributes: { ...tyres!.attributes, loadIndex: 110 } }).where(eq(fitments.id, tyres!.id));
    expect(await rowOf(mh001)).toBeUndefined();
    expect((await expectRejudgedThenStored()).judged).toBe(1);
    expect((await rowOf(mh001))!.offSpec).toBe(offSpecBefore + 1);
  });

  it("a fitment deleted outright", async () => {
    const mh004 = await idOf("MH-004");
    const [any] = await database.select().from(fitments).where(eq(fitments.vehicleId, mh004)).limit(1);
    await expectSameAsFull();
    await database.delete(fitments).where(eq(fitments.id, any!.id));
    expect(await rowOf(mh004)).toBeUndefined();
    expect((await expectRejudgedThenStored()).judged).toBe(1);
  });

  it("a concession granted, and its lapse by time alone at valid_until", async () => {
    const now = new Date();
    await expectSameAsFull(now);
    // A vehicle with a short line and no concession yet.
    const held = new Set((await database.select({ vehicleId: concessions.vehicleId }).from(concessions)).map((c) => c.vehicleId));
    const target = (await loadFleetVariance(database, manager, undefined, now)).details.find(
      (d) => !held.has(d.vehicleId) && d.variance?.lines.some((l) => l.status === "short"),
    )!;
    expect(target).toBeDefined();
    const mh012 = target.vehicleId;
    const gapLine = target.variance!.lines.find((l) => l.status === "short")!;
    const expiresAt = new Date(now.getTime() + 10 * DAY_MS);
    await execute(grantConcession, manager, { vehicleId: mh012, lineKey: gapLine.key, reason: "Parts are on back order from the supplier", expiresAt: expiresAt.toISOString().slice(0, 10) });
    expect(await rowOf(mh012)).toBeUndefined();
    const later = new Date(now.getTime() + 1000);
    expect((await expectRejudgedThenStored(later)).judged).toBe(1);
    const row = (await rowOf(mh012))!;
    expect(row.concession).toBe(1);
    const [granted] = await database.select().from(concessions).where(and(eq(concessions.vehicleId, mh012), eq(concessions.lineKey, gapLine.key)));
    // valid_until is the earliest instant time alone changes the judgement: at the latest the lapse.
    expect(row.validUntil).not.toBeNull();
    expect(row.validUntil!.getTime()).toBeLessThanOrEqual(granted!.expiresAt.getTime());

    // Just before valid_until the stored row serves; at valid_until it is judged again.
    const justBefore = new Date(row.validUntil!.getTime() - 1);
    await expectSameAsFull(justBefore);
    expect((await rowOf(mh012))!.computedAt.getTime()).toBe(later.getTime());
    await expectSameAsFull(row.validUntil!);
    expect((await rowOf(mh012))!.computedAt.getTime()).toBe(row.validUntil!.getTime());

    // After the lapse the line shows what it really is, and the figures still agree.
    const lapsed = new Date(granted!.expiresAt.getTime() + 1);
    await expectSameAsFull(lapsed);
    expect((await rowOf(mh012))!.concession).toBe(0);
  });

  it("a fitment that expires makes its row stale at the expiry", async () => {
    const mh003 = await idOf("MH-003");
    const now = new Date();
    const expiry = new Date(now.getTime() + 2 * DAY_MS);
    await database.update(fitments).set({ expiresAt: expiry }).where(and(eq(fitments.vehicleId, mh003), eq(fitments.lineKey, "first-aid-kit")));
    await expectSameAsFull(now);
    const row = (await rowOf(mh003))!;
    expect(row.status).toBe("meets_standard");
    expect(row.validUntil?.getTime()).toBeLessThanOrEqual(expiry.getTime());
    await expectSameAsFull(expiry);
    // The kit has expired: the line is short (lib/variance rule), and the stored row says so.
    expect((await rowOf(mh003))!.status).toBe("gaps");
    expect((await rowOf(mh003))!.computedAt.getTime()).toBe(expiry.getTime());
  });

  it("a fitment dated later starts to count at its fitting date", async () => {
    const mh006 = await idOf("MH-006");
    const now = new Date();
    const fittedAt = new Date(now.getTime() + 3_600_000);
    await database.insert(fitments).values({ orgId: manager.orgId, vehicleId: mh006, lineKey: null, label: "Cargo barrier", fittedAt });
    await expectSameAsFull(now);
    expect((await rowOf(mh006))!.extra).toBe(0);
    expect((await rowOf(mh006))!.validUntil?.getTime()).toBeLessThanOrEqual(fittedAt.getTime());
    await expectSameAsFull(fittedAt);
    expect((await rowOf(mh006))!.extra).toBe(1);
  });

  it("a query as at an earlier moment than the stored row is judged afresh", async () => {
    const now = new Date();
    await expectSameAsFull(now);
    const stats = await expectSameAsFull(new Date(now.getTime() - 30 * DAY_MS));
    expect(stats.judged).toBe(36);
  });

  it("evidence lodged on a job for a line key, accepted, and the job deleted", async () => {
    const mh009 = await idOf("MH-009");
    const before = await loadFleetVariance(database, manager, undefined, new Date());
    const unproven = before.details.find((d) => d.vehicleId === mh009)!.variance!.lines.find((l) => l.status === "unproven")!;
    expect(unproven).toBeDefined();
    await expectSameAsFull();
    const [job] = await database.insert(jobs).values({ orgId: manager.orgId, number: 9001, vehicleId: mh009, title: "Sign-off visit" }).returning();
    const piece = { orgId: manager.orgId, jobId: job!.id, lineKey: unproven.key, filename: "proof.pdf", contentType: "application/pdf", sizeBytes: 10, sha256: "0".repeat(64), storageKey: "k/proof" };
    const needed = (await database.select().from(editionLines).where(eq(editionLines.id, unproven.lineId)))[0]!.evidenceNeeded;
    // Lodged only: nothing the judgement reads has changed, so the row stays.
    await database.insert(evidence).values(needed.map((kind) => ({ ...piece, kind })));
    expect(await rowOf(mh009)).toBeDefined();
    await database.update(evidence).set({ status: "accepted" }).where(eq(evidence.jobId, job!.id));
    expect(await rowOf(mh009)).toBeUndefined();
    expect((await expectRejudgedThenStored()).judged).toBe(1);
    expect((await rowOf(mh009))!.unproven).toBe((await loadFleetVariance(database, manager, undefined, new Date())).details.find((d) => d.vehicleId === mh009)!.variance!.summary.unproven);
    await database.delete(jobs).where(eq(jobs.id, job!.id));
    expect(await rowOf(mh009)).toBeUndefined();
    expect((await expectRejudgedThenStored()).judged).toBe(1);
  });

  it("evidence accepted on a fitment", async () => {
    await expectSameAsFull();
    const mh009 = await idOf("MH-009");
    const lodged = await database
      .select({ id: evidence.id })
      .from(evidence)
      .innerJoin(fitments, eq(fitments.id, evidence.fitmentId))
      .where(and(eq(fitments.vehicleId, mh009), eq(evidence.status, "lodged")));
    expect(lodged.length).toBeGreaterThan(0);
    const unprovenBefore = (await rowOf(mh009))!.unproven;
    await database.update(evidence).set({ status: "accepted", reviewedAt: new Date() }).where(inArray(evidence.id, lodged.map((e) => e.id)));
    expect(await rowOf(mh009)).toBeUndefined();
    expect((await expectRejudgedThenStored()).judged).toBe(1);
    expect((await rowOf(mh009))!.unproven).toBeLessThan(unprovenBefore);
  });

  it("an edition assigned to a vehicle that had none", async () => {
    await expectSameAsFull();
    const mh037 = await idOf("MH-037");
    const mh001 = await database.query.vehicles.findFirst({ where: eq(vehicles.id, await idOf("MH-001")) });
    await database.update(vehicles).set({ editionId: mh001!.editionId }).where(eq(vehicles.id, mh037));
    expect((await expectRejudgedThenStored()).judged).toBe(1);
    expect((await rowOf(mh037))!.editionId).toBe(mh001!.editionId);
    await database.update(vehicles).set({ editionId: null }).where(eq(vehicles.id, mh037));
    expect(await rowOf(mh037)).toBeUndefined();
    expect((await expectRejudgedThenStored()).judged).toBe(0);
  });

  it("a line edited in a draft leaves the published edition's rows; publishing and rolling out judges the moved vehicles", async () => {
    await expectSameAsFull();
    const mh010 = await idOf("MH-010");
    const current = (await database.query.vehicles.findFirst({ where: eq(vehicles.id, mh010) }))!;
    const published = (await database.query.editions.findFirst({ where: eq(editions.id, current.editionId!) }))!;
    // The demo has a draft of the next edition already; otherwise start one.
    const existing = await database.query.editions.findFirst({ where: and(eq(editions.standardId, published.standardId), eq(editions.status, "draft")) });
    const draft = existing ?? (await execute(startDraft, manager, { standardId: published.standardId }));
    const [shocks] = await database.select().from(editionLines).where(and(eq(editionLines.editionId, draft.id), eq(editionLines.key, "shocks")));
    const before = await storedCount();
    await execute(updateLine, manager, { editionId: draft.id, lineId: shocks!.id, quantity: 2, standardCostCents: 70_000 });
    // Nobody is on the draft yet: every stored row still holds.
    expect(await storedCount()).toBe(before);
    expect((await expectSameAsFull()).judged).toBe(0);
    await execute(publishEdition, manager, { id: draft.id });
    const mh008 = await idOf("MH-008");
    await execute(confirmRollout, manager, { editionId: draft.id, vehicleIds: [mh010, mh008], dryRun: false });
    expect(await rowOf(mh010)).toBeUndefined();
    expect(await rowOf(mh008)).toBeUndefined();
    expect((await expectRejudgedThenStored()).judged).toBe(2);
    expect((await rowOf(mh008))!.editionId).toBe(draft.id);
  });

  it("a line of an edition in use changed in the database clears every vehicle on that edition", async () => {
    await expectSameAsFull();
    const mh001 = (await database.query.vehicles.findFirst({ where: eq(vehicles.id, await idOf("MH-001")) }))!;
    const onEdition = (await database.select({ id: vehicles.id }).from(vehicles).where(and(eq(vehicles.editionId, mh001.editionId!), sql`${vehicles.state} <> 'retired'`))).length;
    await database.update(editionLines).set({ standardCostCents: 99_900 }).where(and(eq(editionLines.editionId, mh001.editionId!), eq(editionLines.key, "snorkel")));
    const left = await database.select().from(vehicleVarianceSummaries).where(eq(vehicleVarianceSummaries.editionId, mh001.editionId!));
    expect(left).toEqual([]);
    expect((await expectRejudgedThenStored()).judged).toBe(onEdition);
  });

  it("a vehicle retired leaves the fleet figures, and with retired vehicles asked for it still agrees", async () => {
    await expectSameAsFull();
    const mh003 = await idOf("MH-003");
    await database.update(vehicles).set({ state: "retired" }).where(eq(vehicles.id, mh003));
    const stats = await expectSameAsFull();
    expect(stats.judged).toBe(0);
    const withRetired = await expectSameAsFull(new Date(), { includeRetired: true });
    expect(withRetired.stored + withRetired.judged).toBeGreaterThan(stats.stored);
    await expectSameAsFull(new Date(), { state: "retired" });
  });

  it("filtered and scoped reads agree too", async () => {
    const mh001 = (await database.query.vehicles.findFirst({ where: eq(vehicles.id, await idOf("MH-001")) }))!;
    await expectSameAsFull(new Date(), { depotId: mh001.depotId });
    await expectSameAsFull(new Date(), { platformId: mh001.platformId });
    await expectSameAsFull(new Date(), { editionId: mh001.editionId });
    const driver = await signedInAs(database, "driver@mirrabel-health.example");
    const figures = await loadFleetVarianceFigures(database, driver, undefined, new Date());
    const full = await loadFleetVariance(database, driver, undefined, new Date());
    expect(figures.overall).toEqual(full.overall);
    expect(figures.details.map((d) => d.vehicleId)).toEqual(full.details.map((d) => d.vehicleId));
  });

  it("the register's status per vehicle is the full judgement's", async () => {
    const all = await database.select({ id: vehicles.id }).from(vehicles).where(eq(vehicles.orgId, manager.orgId));
    const ids = all.map((v) => v.id);
    const status = await varianceStatusByVehicle(database, manager, ids, new Date());
    const full = await loadFleetVariance(database, manager, { includeRetired: true }, new Date());
    expect(Object.fromEntries(status.byVehicle)).toEqual(Object.fromEntries(full.details.map((d) => [d.vehicleId, varianceStatus(d.variance)])));
  });
});

describe("the triggers", () => {
  /** Warms every row, runs `write`, and returns the vehicles whose rows it cleared. */
  async function clearedBy(write: () => Promise<unknown>): Promise<string[]> {
    await expectSameAsFull();
    await expectSameAsFull(new Date(), { includeRetired: true });
    const before = await database.select({ id: vehicleVarianceSummaries.vehicleId }).from(vehicleVarianceSummaries);
    await write();
    const after = new Set((await database.select({ id: vehicleVarianceSummaries.vehicleId }).from(vehicleVarianceSummaries)).map((r) => r.id));
    return before.map((r) => r.id).filter((id) => !after.has(id)).sort();
  }
  const onEdition = async (editionId: string) =>
    (await database.select({ id: vehicleVarianceSummaries.vehicleId }).from(vehicleVarianceSummaries).where(eq(vehicleVarianceSummaries.editionId, editionId))).map((r) => r.id).sort();

  it("a concession changed or deleted clears its vehicle", async () => {
    const [c] = await database.select().from(concessions).where(eq(concessions.orgId, manager.orgId)).limit(1);
    expect(await clearedBy(() => database.update(concessions).set({ expiresAt: new Date(Date.now() + DAY_MS) }).where(eq(concessions.id, c!.id)))).toEqual([c!.vehicleId]);
    expect(await clearedBy(() => database.delete(concessions).where(eq(concessions.id, c!.id)))).toEqual([c!.vehicleId]);
    await expectRejudgedThenStored();
  });

  it("a dependency between lines, or the edition's status, clears every vehicle on that edition", async () => {
    const mh001 = (await database.query.vehicles.findFirst({ where: eq(vehicles.id, await idOf("MH-001")) }))!;
    const editionId = mh001.editionId!;
    await expectSameAsFull(new Date(), { includeRetired: true });
    const all = await onEdition(editionId);
    const lines = await database.select().from(editionLines).where(eq(editionLines.editionId, editionId));
    const deps = await database.select().from(lineDependencies);
    // Two lines with no dependency between them yet (the first line and one that does not depend on it).
    const a = lines[0]!;
    const b = lines.find((l) => l.id !== a.id && !deps.some((d) => (d.lineId === l.id && d.dependsOnLineId === a.id) || (d.lineId === a.id && d.dependsOnLineId === l.id)))!;
    expect(await clearedBy(() => database.insert(lineDependencies).values({ lineId: b.id, dependsOnLineId: a.id }))).toEqual(all);
    expect(await clearedBy(() => database.delete(lineDependencies).where(and(eq(lineDependencies.lineId, b.id), eq(lineDependencies.dependsOnLineId, a.id))))).toEqual(all);
    const status = (await database.query.editions.findFirst({ where: eq(editions.id, editionId) }))!.status;
    expect(await clearedBy(() => database.update(editions).set({ status: "retired" }).where(eq(editions.id, editionId)))).toEqual(all);
    await database.update(editions).set({ status }).where(eq(editions.id, editionId));
    await expectRejudgedThenStored();
  });

  it("a job moved to another vehicle clears both", async () => {
    const [job] = await database.select().from(jobs).where(eq(jobs.orgId, manager.orgId)).limit(1);
    const other = await idOf(job!.vehicleId === (await idOf("MH-002")) ? "MH-004" : "MH-002");
    const cleared = await clearedBy(() => database.update(jobs).set({ vehicleId: other }).where(eq(jobs.id, job!.id)));
    expect(cleared).toEqual([job!.vehicleId, other].sort());
    await database.update(jobs).set({ vehicleId: job!.vehicleId }).where(eq(jobs.id, job!.id));
    await expectRejudgedThenStored();
  });

  it("a vehicle's depot, platform or state leave its row: the fleet view reads them live", async () => {
    const v = (await database.query.vehicles.findFirst({ where: eq(vehicles.id, await idOf("MH-006")) }))!;
    const [otherDepot] = await database.select().from(depots).where(and(eq(depots.orgId, manager.orgId), ne(depots.id, v.depotId!))).limit(1);
    expect(await clearedBy(() => database.update(vehicles).set({ depotId: otherDepot!.id, state: "grounded", groundedReason: "Brake fault" }).where(eq(vehicles.id, v.id)))).toEqual([]);
    // …and the figures by depot still agree with the full judgement.
    expect((await expectSameAsFull()).judged).toBe(0);
    await database.update(vehicles).set({ depotId: v.depotId, state: v.state, groundedReason: v.groundedReason }).where(eq(vehicles.id, v.id));
  });
});

describe("writing summaries back", () => {
  it("a change made while a vehicle is being judged keeps the older figures out of the table", async () => {
    await expectSameAsFull();
    const mh007 = await idOf("MH-007");
    await database.update(fitments).set({ quantity: 4 }).where(and(eq(fitments.vehicleId, mh007), eq(fitments.lineKey, "tyres-all-terrain")));
    const stats: SummaryReadStats = { stored: 0, judged: 0, written: 0 };
    await loadFleetVarianceFigures(database, manager, undefined, new Date(), {
      stats,
      // Between the judgement and the write, someone records a fitment on the same vehicle.
      beforeWrite: async () => {
        await database.insert(fitments).values({ orgId: manager.orgId, vehicleId: mh007, lineKey: null, label: "Fire extinguisher bracket", fittedAt: new Date(Date.now() - 1000) });
      },
    });
    expect(stats).toMatchObject({ judged: 1, written: 0 });
    expect(await rowOf(mh007)).toBeUndefined();
    expect((await expectRejudgedThenStored()).judged).toBe(1);
  });

  it("a refused claim or write leaves the read correct and stores nothing", async () => {
    const warn = vi.spyOn(console, "warn").mockImplementation(() => {});
    const mh002 = await idOf("MH-002");
    try {
      await expectSameAsFull();
      await database.run(sql`create trigger test_refuse_insert before insert on vehicle_variance_summaries begin select raise(abort, 'refused for the test'); end`);
      await database.update(fitments).set({ quantity: 1 }).where(eq(fitments.vehicleId, mh002));
      const refusedClaim = await expectSameAsFull();
      expect(refusedClaim).toMatchObject({ judged: 1, written: 0 });
      expect(await rowOf(mh002)).toBeUndefined();
      await database.run(sql`drop trigger test_refuse_insert`);

      await database.run(sql`create trigger test_refuse_update before update of status on vehicle_variance_summaries begin select raise(abort, 'refused for the test'); end`);
      const refusedWrite = await expectSameAsFull();
      expect(refusedWrite).toMatchObject({ judged: 1, written: 0 });
      // Only the claim is there, and a claim is never read as figures.
      expect((await rowOf(mh002))?.status).toBeNull();
      expect((await expectSameAsFull()).judged).toBe(1);
    } finally {
      await database.run(sql`drop trigger if exists test_refuse_insert`);
      await database.run(sql`drop trigger if exists test_refuse_update`);
      warn.mockRestore();
    }
    expect((await expectRejudgedThenStored()).judged).toBe(1);
  });

  it("a row judged by other rules is judged again", async () => {
    await expectSameAsFull();
    const mh002 = await idOf("MH-002");
    await database.update(vehicleVarianceSummaries).set({ rulesVersion: SUMMARY_RULES_VERSION - 1, meets: 0 }).where(eq(vehicleVarianceSummaries.vehicleId, mh002));
    expect((await expectRejudgedThenStored()).judged).toBe(1);
    expect((await rowOf(mh002))!.rulesVersion).toBe(SUMMARY_RULES_VERSION);
  });

  it("inside a transaction the summaries are written with it, and undone with it", async () => {
    const mh002 = await idOf("MH-002");
    await database.update(fitments).set({ quantity: 1 }).where(eq(fitments.vehicleId, mh002));
    await expect(
      database.transaction(async (tx) => {
        const figures = await loadFleetVarianceFigures(tx, manager, undefined, new Date());
        expect(figures.details.some((d) => d.vehicleId === mh002)).toBe(true);
        expect(await tx.query.vehicleVarianceSummaries.findFirst({ where: eq(vehicleVarianceSummaries.vehicleId, mh002) })).toBeDefined();
        throw new Error("roll back");
      }),
    ).rejects.toThrow("roll back");
    expect(await rowOf(mh002)).toBeUndefined();
    expect((await expectRejudgedThenStored()).judged).toBe(1);
  });
});
