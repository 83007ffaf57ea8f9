import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, it, vi } from "vitest";
import { GET as massRoute } from "@/app/api/vehicles/[id]/mass/route";
import { DELETE as deletePlanRoute, PATCH as patchPlanRoute } from "@/app/api/vehicles/[id]/plan/[itemId]/route";
import { GET as listPlanRoute, POST as postPlanRoute } from "@/app/api/vehicles/[id]/plan/route";
import { auditEntries, contractorFirms, editionLines, editions, fitments, jobOffers, jobs, organisations, plannedItems, standards, vehicles } from "@/db/schema";
import type { MassResponse } from "@/lib/commands/mass";
import { useTestDatabase } from "../helpers/db";
import { callRoute, requestUser } from "../helpers/route";
import { signedInAs } from "../helpers/users";

vi.mock("@/lib/server/session", async (original) => ({
  ...(await original<typeof import("@/lib/server/session")>()),
  currentUser: async () => requestUser.current,
}));

const database = await useTestDatabase();

type Signed = Awaited<ReturnType<typeof signedInAs>>;
let manager: Signed;
let driver: Signed;
let contractor: Signed;
let finance: Signed;
let otherAdmin: Signed;
const ids: Record<string, string> = {};

async function vehicleId(fleetNumber: string) {
  const row = await database.query.vehicles.findFirst({ where: eq(vehicles.fleetNumber, fleetNumber) });
  if (!row) throw new Error(`no vehicle ${fleetNumber}`);
  return row.id;
}

async function mass(user: Signed | null, id: string, query = "") {
  return callRoute(massRoute, { user, params: { id }, url: `http://localhost/api/vehicles/${id}/mass${query}` });
}

const figures = (json: unknown) => json as MassResponse;
const check = (r: MassResponse, limit: string) => r.checks.find((c) => c.limit === limit);

beforeAll(async () => {
  manager = await signedInAs(database, "manager@mirrabel-health.example");
  driver = await signedInAs(database, "driver@mirrabel-health.example");
  contractor = await signedInAs(database, "contractor@tallowbark-fitout.example");
  finance = await signedInAs(database, "finance@mirrabel-health.example");
  otherAdmin = await signedInAs(database, "admin@gidgee-trust.example");
  // MH-037…039 carry no standard and nothing fitted: their figures are the platform's alone.
  ids.yendor = await vehicleId("MH-039"); // Yendor Terrus 4: kerb 2150 (1240 front), WB 3090, GVM 3100, GCM 5900
  ids.marrak = await vehicleId("MH-038"); // Marrak Outback 300: kerb 2580 (1390 front), WB 2850
  ids.corvane = await vehicleId("MH-037");
});

describe("GET /api/vehicles/{id}/mass", () => {
  it("gives the platform's kerb axle loads when nothing is fitted", async () => {
    const { status, json } = await mass(manager, ids.yendor!);
    expect(status).toBe(200);
    const r = figures(json);
    expect(r.base).toMatchObject({ source: "platform", frontKg: 1240, rearKg: 910, totalKg: 2150 });
    expect(r.frontKg).toBeCloseTo(1240, 9);
    expect(r.rearKg).toBeCloseTo(910, 9);
    // Headroom is rating minus load: 1700 − 1240 = 460 (front) binds before 1900 − 910 and 3100 − 2150.
    expect(r.binding).toEqual({ limit: "front", marginKg: 460 });
    expect(r.bindingLabel).toBe("Front axle");
    expect(r.caution).toMatch(/certified weighbridge/);
    expect(r.ruleSet.label).toMatch(/example values/i);
  });

  it("puts occupants on the axles by the lever rule and names the binding limit", async () => {
    const r = figures((await mass(manager, ids.yendor!, "?occupants=2")).json);
    // Lever rule, statics of a simply supported beam (S, C): front = W (WB − x) / WB, rear = W x / WB.
    // Hand-worked: 2 × 80 kg (the organisation's person mass, common practice) = 160 kg in the cab
    // zone at 0.35 × 3090 = 1081.5 mm → front 160 × 0.65 = 104, rear 160 × 0.35 = 56 kg.
    expect(r.frontKg).toBeCloseTo(1240 + 104, 6);
    expect(r.rearKg).toBeCloseTo(910 + 56, 6);
    expect(r.grossKg).toBeCloseTo(2310, 6);
    // Headroom, hand-worked: front 1700 − 1344 = 356, rear 1900 − 966 = 934, GVM 3100 − 2310 = 790.
    expect(check(r, "front")).toMatchObject({ capacityKg: 1700, ok: true });
    expect(check(r, "front")!.headroomKg).toBeCloseTo(356, 6);
    expect(check(r, "rear")!.headroomKg).toBeCloseTo(934, 6);
    expect(check(r, "gvm")!.headroomKg).toBeCloseTo(790, 6);
    expect(r.binding!.limit).toBe("front");
    expect(r.binding!.marginKg).toBeCloseTo(356, 6);
  });

  it("uses the organisation's person mass", async () => {
    const org = await database.query.organisations.findFirst({ where: eq(organisations.slug, "mirrabel-health") });
    await database.update(organisations).set({ personMassKg: 90 }).where(eq(organisations.id, org!.id));
    try {
      const r = figures((await mass(manager, ids.yendor!, "?occupants=2")).json);
      // Hand-worked, lever rule (C): 180 kg at 1081.5 mm → front 117, rear 63.
      expect(r.frontKg).toBeCloseTo(1240 + 117, 6);
      expect(r.rearKg).toBeCloseTo(910 + 63, 6);
    } finally {
      await database.update(organisations).set({ personMassKg: 80 }).where(eq(organisations.id, org!.id));
    }
  });

  it("checks the towing case against GVM and GCM", async () => {
    // A 350 kg fit-out planned over the rear axle, 2 occupants, 70 L of extra diesel, a trailer.
    const add = await callRoute(postPlanRoute, {
      user: manager,
      params: { id: ids.yendor! },
      body: { label: "Touring fit-out", massKg: 350, xMm: 3090, massKind: "constant" },
    });
    expect(add.status).toBe(201);
    const r = figures((await mass(manager, ids.yendor!, "?includePlanned=1&occupants=2&fuelL=70&trailerAtmKg=2500&towballKg=250")).json);
    // ADR Definitions and Vehicle Categories (S); Qld mass regulation 2005 s 48(2) (P); case (C):
    // 2,150 + fit-out 350 + occupants 160 + 70 L diesel × 0.832 kg/L (58.24) + towball 250 = 2,968 ≤ GVM 3,100;
    // GTM = ATM 2,500 − 250 = 2,250; combination 2,968 + 2,250 = 5,218 ≤ GCM 5,900.
    expect(Math.round(r.grossKg!)).toBe(2968);
    expect(Math.round(r.combinationKg!)).toBe(5218);
    expect(check(r, "gvm")!.ok).toBe(true);
    expect(check(r, "gcm")).toMatchObject({ capacityKg: 5900, ok: true });
    expect(check(r, "towing")).toMatchObject({ loadKg: 2500, capacityKg: 3500, ok: true });
    expect(check(r, "towball")).toMatchObject({ loadKg: 250, capacityKg: 350, ok: true });
    expect(r.planned.map((p) => p.label)).toEqual(["Touring fit-out"]);
    await callRoute(deletePlanRoute, { user: manager, params: { id: ids.yendor!, itemId: (add.json as { id: string }).id } });
  });

  it("answers 422 naming the field for bad loading", async () => {
    for (const [query, field] of [
      ["?occupants=-1", "occupants"],
      ["?occupants=two", "occupants"],
      ["?cargoKg=lots", "cargoKg"],
      ["?trailerAtmKg=1000&towballKg=1200", "towballKg"],
    ] as const) {
      const { status, json } = await mass(manager, ids.yendor!, query);
      expect(status, query).toBe(422);
      expect((json as { error: { details: { field: string }[] } }).error.details.map((d) => d.field)).toContain(field);
    }
  });

  it("refuses a driver (403), lets finance read, and hides another organisation's vehicle (404)", async () => {
    expect((await mass(driver, ids.yendor!)).status).toBe(403);
    expect((await mass(finance, ids.yendor!)).status).toBe(200);
    const foreign = await mass(otherAdmin, ids.yendor!);
    expect(foreign.status).toBe(404);
    expect(foreign.json).toMatchObject({ error: { code: "not_found" } });
    expect((await mass(null, ids.yendor!)).status).toBe(401);
  });

  it("lets a contractor read only the vehicles of jobs offered to their firm", async () => {
    expect((await mass(contractor, ids.marrak!)).status).toBe(404);
    const firm = await database.query.contractorFirms.findFirst({ where: eq(contractorFirms.name, "Tallowbark Fit-Out Workshop") });
    const [job] = await database
      .insert(jobs)
      .values({ orgId: manager.orgId, number: 9101, vehicleId: ids.marrak!, title: "Rear bar and second spare", state: "quoting", createdBy: manager.userId })
      .returning();
    await database.insert(jobOffers).values({ jobId: job!.id, firmId: firm!.id });
    const { status, json } = await mass(contractor, ids.marrak!, "?occupants=1");
    expect(status).toBe(200);
    expect(figures(json).vehicle.fleetNumber).toBe("MH-038");
    // Read only: the contractor cannot change the plan.
    const refused = await callRoute(postPlanRoute, { user: contractor, params: { id: ids.marrak! }, body: { label: "Bar", massKg: 50, zone: "front" } });
    expect(refused.status).toBe(403);
    expect((await mass(contractor, ids.corvane!)).status).toBe(404);
  });
});

describe("the what-if plan", () => {
  it("adds, moves and removes planned items, each changing the figures and audited", async () => {
    const id = ids.marrak!;
    const before = figures((await mass(manager, id, "?includePlanned=1")).json);
    expect(before.frontKg).toBeCloseTo(1390, 9);

    const bar = await callRoute(postPlanRoute, { user: manager, params: { id }, body: { label: "Rear bar", massKg: 60, zone: "rear_overhang" } });
    expect(bar.status).toBe(201);
    const barId = (bar.json as { id: string }).id;
    const withBar = figures((await mass(manager, id, "?includePlanned=1")).json);
    // Rear overhang zone: the platform's 1050 mm overhang less 150 mm (common practice) → 900 mm
    // behind the rear axle, x = 2850 + 900 = 3750 mm. Lever rule (C), hand-worked:
    // rear = 60 × 3750 / 2850 = 78.947 kg; front = 60 − 78.947 = −18.947 kg (the front lightens).
    expect(withBar.rearKg).toBeCloseTo(1190 + 78.947, 2);
    expect(withBar.frontKg).toBeCloseTo(1390 - 18.947, 2);
    expect(withBar.warnings.map((w) => w.code)).toContain("front-unloaded");
    // Without includePlanned the planned bar does not count.
    expect(figures((await mass(manager, id)).json).frontKg).toBeCloseTo(1390, 9);

    // Move it to a measured position and make it heavier.
    const moved = await callRoute(patchPlanRoute, { user: manager, method: "PATCH", params: { id, itemId: barId }, body: { massKg: 100, xMm: 3800, zone: null } });
    expect(moved.status).toBe(200);
    const withMoved = figures((await mass(manager, id, "?includePlanned=1")).json);
    // Lever rule (C): 100 kg at 3800 mm on 2850 mm → rear 133.333, front −33.333.
    expect(withMoved.rearKg).toBeCloseTo(1190 + 133.333, 2);
    expect(withMoved.frontKg).toBeCloseTo(1390 - 33.333, 2);

    const list = await callRoute(listPlanRoute, { user: manager, params: { id } });
    expect((list.json as { items: { label: string; xMm: number }[] }).items).toEqual([expect.objectContaining({ label: "Rear bar", xMm: 3800, massKg: 100 })]);

    const removed = await callRoute(deletePlanRoute, { user: manager, method: "DELETE", params: { id, itemId: barId } });
    expect(removed.status).toBe(200);
    expect(await database.query.plannedItems.findFirst({ where: eq(plannedItems.id, barId) })).toBeUndefined();
    const actions = (await database.select().from(auditEntries).where(eq(auditEntries.entityId, barId))).map((a) => a.action).sort();
    expect(actions).toEqual(["plan.add", "plan.remove", "plan.update"]);
  });

  it("answers 422 naming the field and saves nothing for a bad item", async () => {
    const id = ids.marrak!;
    const count = async () => (await database.select().from(plannedItems).where(eq(plannedItems.vehicleId, id))).length;
    const before = await count();
    for (const [body, field] of [
      [{ label: "Spare", massKg: "heavy", zone: "rear_overhang" }, "massKg"],
      [{ label: "Spare", massKg: 30 }, "xMm"],
      [{ label: "", massKg: 30, zone: "roof" }, "label"],
      [{ label: "Spare", massKg: 30, zone: "bonnet" }, "zone"],
      [{ label: "Spare", massKg: 30, xMm: "far back" }, "xMm"],
    ] as const) {
      const { status, json } = await callRoute(postPlanRoute, { user: manager, params: { id }, body });
      expect(status, JSON.stringify(body)).toBe(422);
      expect((json as { error: { details: { field: string }[] } }).error.details.map((d) => d.field)).toContain(field);
    }
    expect(await count()).toBe(before);
  });

  it("does not touch another organisation's planned item", async () => {
    const id = ids.marrak!;
    const added = await callRoute(postPlanRoute, { user: manager, params: { id }, body: { label: "Awning", massKg: 20, zone: "roof" } });
    const itemId = (added.json as { id: string }).id;
    const foreign = await callRoute(patchPlanRoute, { user: otherAdmin, method: "PATCH", params: { id, itemId }, body: { massKg: 1 } });
    expect(foreign.status).toBe(404);
    expect((await database.query.plannedItems.findFirst({ where: eq(plannedItems.id, itemId) }))?.massKg).toBe(20);
    await callRoute(deletePlanRoute, { user: manager, method: "DELETE", params: { id, itemId } });
  });

  it("plans a draft edition's short lines, at once and only once", async () => {
    const id = ids.corvane!;
    const [standard] = await database.insert(standards).values({ orgId: manager.orgId, name: "Test touring standard" }).returning();
    const [draft] = await database.insert(editions).values({ orgId: manager.orgId, standardId: standard!.id, number: 1, status: "draft" }).returning();
    await database.insert(editionLines).values([
      { orgId: manager.orgId, editionId: draft!.id, key: "t-bar", code: "PR-09", category: "protection", title: "Rear bar", requirement: "must_fit", massKg: 50, zone: "rear_overhang" },
      { orgId: manager.orgId, editionId: draft!.id, key: "t-spare", code: "TY-09", category: "tyres", title: "Second spare", requirement: "must_fit", quantity: 2, massKg: 30, xMm: 4000 },
      { orgId: manager.orgId, editionId: draft!.id, key: "t-hf", code: "CM-09", category: "communications", title: "HF radio", requirement: "may_fit", massKg: 8, zone: "cab" },
      { orgId: manager.orgId, editionId: draft!.id, key: "t-align", code: "EN-09", category: "engineering", title: "Alignment", requirement: "must_fit" },
    ]);
    const base = figures((await mass(manager, id)).json);
    const preview = figures((await mass(manager, id, `?editionId=${draft!.id}`)).json);
    // Must-fit lines with mass only: 50 + 2 × 30 = 110 kg (may-fit and massless lines add nothing).
    expect(preview.edition).toMatchObject({ id: draft!.id, plannedLines: 2 });
    expect(preview.grossKg! - base.grossKg!).toBeCloseTo(110, 9);
    expect(preview.planned.map((p) => p.label)).toEqual(["PR-09 Rear bar", "TY-09 Second spare × 2"]);

    const planned = await callRoute(postPlanRoute, { user: manager, params: { id }, body: { editionId: draft!.id } });
    expect(planned.status).toBe(201);
    expect((planned.json as { added: unknown[] }).added).toHaveLength(2);
    const again = await callRoute(postPlanRoute, { user: manager, params: { id }, body: { editionId: draft!.id } });
    expect(again.json).toMatchObject({ added: [], skipped: 2 });
    const rows = await database.select().from(plannedItems).where(eq(plannedItems.vehicleId, id));
    expect(rows.map((r) => [r.label, r.massKg]).sort()).toEqual([["PR-09 Rear bar", 50], ["TY-09 Second spare × 2", 60]]);
    const withPlan = figures((await mass(manager, id, "?includePlanned=1")).json);
    expect(withPlan.grossKg).toBeCloseTo(preview.grossKg!, 9);

    const foreignEdition = await callRoute(postPlanRoute, { user: otherAdmin, params: { id }, body: { editionId: draft!.id } });
    expect(foreignEdition.status).toBe(404);
    const unknown = await mass(manager, id, "?editionId=nope");
    expect(unknown.status).toBe(422);
    expect((unknown.json as { error: { details: { field: string }[] } }).error.details[0]?.field).toBe("editionId");
  });
});

describe("fitted items", () => {
  it("takes a linked fitment's mass and position from its edition line, an extra's from itself", async () => {
    const id = ids.corvane!; // Corvane Trailhand 79: kerb 2265 (1300 front, 965 rear), WB 3180
    const [standard] = await database.insert(standards).values({ orgId: manager.orgId, name: "Test patrol standard" }).returning();
    const [edition] = await database.insert(editions).values({ orgId: manager.orgId, standardId: standard!.id, number: 1, status: "published" }).returning();
    await database.insert(editionLines).values([
      { orgId: manager.orgId, editionId: edition!.id, key: "p-bar", code: "PR-01", category: "protection", title: "Front bar", requirement: "must_fit", massKg: 72, xMm: -650 },
    ]);
    await database.update(vehicles).set({ editionId: edition!.id }).where(eq(vehicles.id, id));
    const fittedAt = new Date("2026-01-10T00:00:00Z");
    await database.insert(fitments).values([
      // The line's figures apply: the fitment's own mass and place are ignored.
      { orgId: manager.orgId, vehicleId: id, lineKey: "p-bar", label: "Bar as fitted", quantity: 1, massKg: 5, zone: "tub", fittedAt },
      { orgId: manager.orgId, vehicleId: id, lineKey: null, label: "Seat covers", quantity: 2, massKg: 4, zone: "cab", fittedAt },
      { orgId: manager.orgId, vehicleId: id, lineKey: null, label: "Old canopy", quantity: 1, massKg: 90, zone: "tub", fittedAt, removedAt: new Date("2026-02-01T00:00:00Z") },
    ]);
    const r = figures((await mass(manager, id)).json);
    expect(r.lines.filter((l) => l.kind === "item").map((l) => [l.label, l.massKg, Math.round(l.xMm!)]).sort()).toEqual([
      ["PR-01 Front bar", 72, -650],
      ["Seat covers", 8, Math.round(0.35 * 3180)],
    ]);
    // Lever rule (C), hand-worked: 72 kg at −650 mm → front 72 × 3830 / 3180 = 86.717, rear −14.717;
    // 8 kg in the cab (1113 mm) → front 5.2, rear 2.8. The removed canopy counts for nothing.
    expect(r.frontKg).toBeCloseTo(1300 + 86.717 + 5.2, 2);
    expect(r.rearKg).toBeCloseTo(965 - 14.717 + 2.8, 2);
    expect(r.grossKg).toBeCloseTo(2265 + 80, 6);
  });
});

describe("the brake warning", () => {
  it("warns when the loaded mass is above standard by more than the organisation's margin, unless brakes are upgraded", async () => {
    const id = ids.yendor!; // kerb 2150 kg
    // Common practice: heavier vehicles on taller tyres need better brakes; the default 500 kg margin
    // echoes a loaded touring fit-out being commonly 500–600 kg above standard.
    // Hand-worked: 2 occupants (160) + 400 kg cargo = 560 kg above the kerb mass, over the 500 kg margin.
    const loaded = figures((await mass(manager, id, "?occupants=2&cargoKg=400")).json);
    expect(loaded.aboveStandardKg).toBeCloseTo(560, 6);
    expect(loaded.warnings.map((w) => w.code)).toContain("brakes");
    // 160 + 300 = 460 kg: within the margin.
    expect(figures((await mass(manager, id, "?occupants=2&cargoKg=300")).json).warnings.map((w) => w.code)).not.toContain("brakes");

    // The organisation's margin decides.
    await database.update(organisations).set({ brakeWarningMarginKg: 600 }).where(eq(organisations.id, manager.orgId));
    expect(figures((await mass(manager, id, "?occupants=2&cargoKg=400")).json).warnings.map((w) => w.code)).not.toContain("brakes");
    await database.update(organisations).set({ brakeWarningMarginKg: 500 }).where(eq(organisations.id, manager.orgId));

    // A fitted brake upgrade silences it; an assessment alone does not.
    await database.insert(fitments).values({ orgId: manager.orgId, vehicleId: id, label: "Brake upgrade assessment", quantity: 1, fittedAt: new Date("2026-02-01T00:00:00Z") });
    expect(figures((await mass(manager, id, "?occupants=2&cargoKg=400")).json).warnings.map((w) => w.code)).toContain("brakes");
    await database.insert(fitments).values({ orgId: manager.orgId, vehicleId: id, label: "Brake upgrade kit, front and rear", quantity: 1, fittedAt: new Date("2026-02-02T00:00:00Z") });
    expect(figures((await mass(manager, id, "?occupants=2&cargoKg=400")).json).warnings.map((w) => w.code)).not.toContain("brakes");
  });
});

