import { eq, inArray, isNotNull } from "drizzle-orm";
import { beforeAll, describe, expect, it, vi } from "vitest";
import { GET as varianceRoute } from "@/app/api/vehicles/[id]/variance/route";
import { concessions, evidence, fitments, vehicles } from "@/db/schema";
import { loadFleetVariance, loadVehicleVariance, varianceStatusByVehicle } from "@/db/variance";
import { REMOTE_DUTY_LINES } from "@/db/seed/standards";
import { getFleetVariance } from "@/lib/commands/variance";
import { execute } from "@/lib/server/operation";
import { loadIndexKg } from "@/lib/tyres";
import { useTestDatabase } from "../helpers/db";
import { callRoute, requestUser } from "../helpers/route";
import { signedInAs } from "../helpers/users";

vi.mock("@/lib/server/session", async (original) => ({
  ...(await original<typeof import("@/lib/server/session")>()),
  currentUser: async () => requestUser.current,
}));

const database = await useTestDatabase();

// The demo's "Remote duty fit-out", edition 1 (db/seed/standards.ts), counted by hand:
// 65 lines = 54 must fit + 9 may fit + 2 must not fit (wheel spacers, roof light bar).
// A vehicle that has every must-fit line, proven, and neither prohibited item: 54 + 2 = 56 lines
// meet; the may-fit lines left off are "not fitted (optional)" and counted nowhere.
const MUST = REMOTE_DUTY_LINES.filter((l) => l.requirement === "must_fit").length;
const MUST_NOT = REMOTE_DUTY_LINES.filter((l) => l.requirement === "must_not_fit").length;

type Summary = { meets: number; short: number; offSpec: number; unproven: number; concession: number; prohibitedFitted: number; extra: number };
type VarianceBody = {
  editionId: string;
  summary: Summary;
  lines: { code: string; status: string; statusWord: string; failing: { attribute: string; actual: unknown; expected: unknown }[]; missingQuantity: number; concession: { reason: string } | null; concessionExpiredAt: string | null; expiredFitmentIds: string[] }[];
  extras: { label: string }[];
  buildOrder: { stage: number; lines: { label: string; blocked: boolean; blockedBy: { label: string }[] }[] }[];
};

let manager: Awaited<ReturnType<typeof signedInAs>>;
const idOf = async (fleetNumber: string) => (await database.query.vehicles.findFirst({ where: eq(vehicles.fleetNumber, fleetNumber) }))!.id;

async function varianceOf(fleetNumber: string, user = manager) {
  const { status, json } = await callRoute(varianceRoute, { user, params: { id: await idOf(fleetNumber) } });
  expect(status, fleetNumber).toBe(200);
  return json as VarianceBody;
}

const line = (body: VarianceBody, code: string) => body.lines.find((l) => l.code === code)!;

beforeAll(async () => {
  manager = await signedInAs(database, "manager@mirrabel-health.example");
  // The demo jobs (db/seed/jobs.ts) finish some work on a few vehicles. Set their fitments and
  // evidence aside, so the counts below are those of the standards seed alone, counted by hand.
  await database
    .update(fitments)
    .set({ removedAt: new Date(Date.now() - 60_000) })
    .where(inArray(fitments.id, database.select({ id: evidence.fitmentId }).from(evidence).where(isNotNull(evidence.jobId))));
  await database.delete(evidence).where(isNotNull(evidence.jobId));
});

describe("GET /api/vehicles/{id}/variance on the demo fleet", () => {
  it("the seed table has the shape counted above", () => {
    expect(REMOTE_DUTY_LINES).toHaveLength(65);
    expect(MUST).toBe(54);
    expect(MUST_NOT).toBe(2);
  });

  it("MH-002 fully meets: 56 lines meet, nothing short", async () => {
    const body = await varianceOf("MH-002");
    // Rigline rule, hand-counted: 54 must-fit + 2 must-not-fit meet.
    expect(body.summary).toEqual({ meets: 56, short: 0, offSpec: 0, unproven: 0, concession: 0, prohibitedFitted: 0, extra: 0 });
    expect(body.buildOrder).toEqual([]);
  });

  it("MH-001 meets with a may-fit airbag kit and an extra dash camera", async () => {
    const body = await varianceOf("MH-001");
    // 56 + the fitted may-fit airbags = 57 meet; the dash camera is an extra.
    expect(body.summary).toEqual({ meets: 57, short: 0, offSpec: 0, unproven: 0, concession: 0, prohibitedFitted: 0, extra: 1 });
    expect(body.extras.map((e) => e.label)).toEqual(["Dash camera"]);
  });

  it("MH-007 is off-spec on its tyres: load index 116 where 121 is asked", async () => {
    const body = await varianceOf("MH-007");
    expect(body.summary).toEqual({ meets: 55, short: 0, offSpec: 1, unproven: 0, concession: 0, prohibitedFitted: 0, extra: 0 });
    const tyres = line(body, "TY-01");
    expect(tyres.statusWord).toBe("Off-spec");
    expect(tyres.failing).toEqual([expect.objectContaining({ attribute: "loadIndex", actual: 116, expected: 121 })]);
    // Why it matters: per tyre, LI 116 carries 1250 kg against 1450 kg for LI 121
    // (ISO 4000-1 / ETRTO load index table (S)).
    expect(loadIndexKg(116)).toBe(1250);
    expect(loadIndexKg(121)).toBe(1450);
  });

  it("MH-009 is unproven where evidence is lodged but not accepted", async () => {
    const body = await varianceOf("MH-009");
    expect(body.summary).toMatchObject({ meets: 54, unproven: 2, short: 0 });
    expect(line(body, "PR-01").status).toBe("unproven");
    expect(line(body, "EN-01").status).toBe("unproven");
  });

  it("MH-010's missing snorkel is covered by a current concession, and it still counts as meeting", async () => {
    const body = await varianceOf("MH-010");
    expect(body.summary).toEqual({ meets: 55, short: 0, offSpec: 0, unproven: 0, concession: 1, prohibitedFitted: 0, extra: 0 });
    expect(line(body, "WD-01").concession?.reason).toMatch(/back order/);
    const status = await varianceStatusByVehicle(database, manager, [await idOf("MH-010")], new Date());
    expect([...status.byVehicle.values()]).toEqual(["meets_standard"]);
  });

  it("an expired concession counts as short (MH-013)", async () => {
    const body = await varianceOf("MH-013");
    const snorkel = line(body, "WD-01");
    expect(snorkel.status).toBe("short");
    expect(snorkel.concession).toBeNull();
    expect(snorkel.concessionExpiredAt).not.toBeNull();
    expect(body.summary).toMatchObject({ meets: 55, short: 1, concession: 0 });
  });

  it("an expired first-aid kit leaves its line short (MH-011)", async () => {
    const body = await varianceOf("MH-011");
    const kit = line(body, "SF-01");
    expect(kit.status).toBe("short");
    expect(kit.missingQuantity).toBe(1);
    expect(kit.expiredFitmentIds).toHaveLength(1);
  });

  it("a prohibited item fitted is named (MH-012: wheel spacers)", async () => {
    const body = await varianceOf("MH-012");
    expect(body.summary).toEqual({ meets: 55, short: 0, offSpec: 0, unproven: 0, concession: 0, prohibitedFitted: 1, extra: 1 });
    expect(line(body, "SD-05").statusWord).toBe("Prohibited item fitted");
  });

  it("MH-005 (in fit-out, tyres and wheels only): the build order marks blocked lines with what blocks them", async () => {
    const body = await varianceOf("MH-005");
    // 54 must-fit − TY-01 − TY-02 = 52 short; those two + 2 must-not-fit = 4 meet.
    expect(body.summary).toMatchObject({ meets: 4, short: 52 });
    const all = body.buildOrder.flatMap((s) => s.lines);
    expect(all).toHaveLength(52);
    const winch = all.find((l) => l.label.startsWith("RC-04"))!;
    expect(winch.blocked).toBe(true);
    expect(winch.blockedBy.map((b) => b.label)).toEqual(expect.arrayContaining(["PR-01 Front protection bar, airbag-compatible"]));
    const alignment = all.find((l) => l.label.startsWith("EN-02"))!;
    const lift = all.find((l) => l.label.startsWith("SU-05"))!;
    const stageOf = (label: string) => body.buildOrder.find((s) => s.lines.some((l) => l.label === label))!.stage;
    // Common practice: the alignment comes after the suspension work; the lift waits for the sign-off.
    expect(stageOf(alignment.label)).toBeGreaterThan(stageOf(lift.label));
    expect(lift.blockedBy.map((b) => b.label)).toContain("EN-01 Engineering sign-off for the lift and tyre change");
  });

  it("a vehicle without an edition answers no summary (MH-037)", async () => {
    const { json } = await callRoute(varianceRoute, { user: manager, params: { id: await idOf("MH-037") } });
    expect(json).toMatchObject({ editionId: null, summary: null, status: "no_edition", lines: [] });
  });

  it("a removed fitment counts for nothing: removing MH-003's UHF radio makes it short", async () => {
    const id = await idOf("MH-003");
    const uhf = await database.query.fitments.findFirst({ where: (f, { and, eq }) => and(eq(f.vehicleId, id), eq(f.lineKey, "uhf-radio")) });
    await database.update(fitments).set({ removedAt: new Date(Date.now() - 1000) }).where(eq(fitments.id, uhf!.id));
    const body = await varianceOf("MH-003");
    expect(line(body, "CM-01").status).toBe("short");
    await database.update(fitments).set({ removedAt: null }).where(eq(fitments.id, uhf!.id));
  });
});

describe("who sees which variance", () => {
  it("a driver sees an assigned vehicle, and gets 404 for another", async () => {
    const driver = await signedInAs(database, "driver@mirrabel-health.example");
    const own = await varianceOf("MH-005", driver);
    expect(own.summary.short).toBe(52);
    const { status } = await callRoute(varianceRoute, { user: driver, params: { id: await idOf("MH-002") } });
    expect(status).toBe(404);
  });

  it("a contractor with no jobs sees no vehicle's variance", async () => {
    const contractor = await signedInAs(database, "contractor@spindleflat-4x4.example");
    const fleet = await loadFleetVariance(database, contractor, undefined, new Date());
    const visible = await database.select({ id: vehicles.id }).from(vehicles).where(eq(vehicles.orgId, contractor.orgId));
    expect(fleet.overall.vehicles).toBeLessThan(visible.length);
  });

  it("another organisation's vehicle is not found (404)", async () => {
    const other = await signedInAs(database, "manager@gidgee-trust.example");
    const { status, json } = await callRoute(varianceRoute, { user: other, params: { id: await idOf("MH-002") } });
    expect(status).toBe(404);
    expect(json).toMatchObject({ error: { code: "not_found" } });
    expect(await loadVehicleVariance(database, other, await idOf("MH-002"), new Date())).toBeNull();
  });
});

describe("fleet variance", () => {
  it("share fully meeting and counts, hand-counted from the demo profiles", async () => {
    const result = await execute(getFleetVariance, manager, {});
    // 39 vehicles not retired: 36 on edition 1 (MH-001…036), 3 without (MH-037…039).
    // Fully meeting: MH-001…004, 006, 010 (concession), 031…034, 036 = 11 (MH-005, 015, 025, 035
    // are in fit-out); so the share is 11 / 36.
    expect(result.overall).toMatchObject({ vehicles: 39, withEdition: 36, noEdition: 3, fullyMeeting: 11 });
    expect(result.overall.shareFullyMeeting).toBeCloseTo(11 / 36, 10);
    expect(result.vehicleStatusCounts).toEqual({ meets_standard: 11, gaps: 25, no_edition: 3 });
    expect(result.statusCounts).toMatchObject({ offSpec: 1, unproven: 2, concession: 1, prohibitedFitted: 1, extra: 3 });
    expect(result.byDepot.map((d) => d.name)).toEqual(["Ochre Well", "Salt Pan Creek", "Tarrin Junction"]);
    expect(result.byDepot.reduce((n, d) => n + d.vehicles, 0)).toBe(39);
    expect(result.byPlatform).toHaveLength(4);
    expect(result.vehiclesWithGaps[0]?.gaps).toBe(52);
  });

  it("cost to close MH-008 is the standard cost of its one short line (shock absorbers)", async () => {
    const fleet = await loadFleetVariance(database, manager, undefined, new Date());
    const mh008 = fleet.vehicles.find((v) => v.vehicleId === fleet.details.find((d) => d.fleetNumber === "MH-008")!.vehicleId)!;
    const shocks = REMOTE_DUTY_LINES.find((l) => l.key === "shocks")!;
    expect(mh008.costToCloseCents).toBe(shocks.costCents);
    // The shock absorbers line has no mass of its own in the demo, so nothing to add.
    expect(mh008.massToCloseKg).toBe(0);
  });

  it("a driver's fleet is their assigned vehicles only", async () => {
    const driver = await signedInAs(database, "driver@mirrabel-health.example");
    const result = await execute(getFleetVariance, driver, {});
    expect(result.overall.vehicles).toBe(3);
  });

  it("runs a fixed number of queries whatever the fleet size", async () => {
    // Count statements sent by the loader for the whole fleet and for a driver's three vehicles.
    const client = (database as unknown as { $client: { execute: (...a: unknown[]) => Promise<unknown> } }).$client;
    const original = client.execute.bind(client);
    let statements = 0;
    client.execute = (...args: unknown[]) => {
      statements++;
      return original(...args);
    };
    const driver = await signedInAs(database, "driver@mirrabel-health.example");
    try {
      await loadFleetVariance(database, manager, undefined, new Date());
      statements = 0;
      await loadFleetVariance(database, manager, undefined, new Date());
      const whole = statements;
      statements = 0;
      await loadFleetVariance(database, driver, undefined, new Date());
      expect(statements).toBe(whole);
      expect(whole).toBeLessThanOrEqual(8);
    } finally {
      client.execute = original;
    }
  });

  it("concessions are kept by line key", async () => {
    const rows = await database.select().from(concessions).where(eq(concessions.orgId, manager.orgId));
    expect(rows.map((r) => r.lineKey).sort()).toEqual(["snorkel", "snorkel"]);
  });
});
