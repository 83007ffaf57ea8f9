import { and, eq } from "drizzle-orm";
import { beforeAll, describe, expect, it, vi } from "vitest";
import { POST as postDefect } from "@/app/api/defects/route";
import { POST as raiseJobRoute } from "@/app/api/jobs/route";
import { POST as moveRoute } from "@/app/api/defects/[id]/moves/route";
import { GET as getDefectRoute } from "@/app/api/defects/[id]/route";
import { auditEntries, defects, jobs } from "@/db/schema";
import { useTestDatabase } from "../helpers/db";
import { callRoute, requestUser } from "../helpers/route";
import { signedInAs } from "../helpers/users";
import { GIDGEE, MIRRABEL, makeVehicle, orgId, useTempStorage, uuid } from "../unit/defects/db-fixtures";

vi.mock("@/lib/server/session", async (original) => ({
  ...(await original<typeof import("@/lib/server/session")>()),
  currentUser: async () => requestUser.current,
}));

// The moves are Rigline's own, from the permission table's states: reported → triaged → in
// repair (linked job) → resolved → closed; reported / triaged → closed (with reason); → merged.

const database = await useTestDatabase();
useTempStorage();

const DRIVER = "driver@mirrabel-health.example";
const MANAGER = "manager@mirrabel-health.example";
let mirrabel: string;
let vehicle: string;
let otherVehicle: string;
let jobNumber = 9000;

beforeAll(async () => {
  mirrabel = await orgId(database, MIRRABEL);
  vehicle = await makeVehicle(database, mirrabel, { fleetNumber: "TRI-001", drivers: [DRIVER] });
  otherVehicle = await makeVehicle(database, mirrabel, { fleetNumber: "TRI-002", drivers: [DRIVER] });
});

async function reported(over: Record<string, unknown> = {}): Promise<{ id: string; version: number }> {
  const { json, status } = await callRoute(postDefect, {
    user: await signedInAs(database, DRIVER),
    body: { clientId: uuid(), vehicleId: vehicle, severity: "before_next_trip", category: "lights_electrical", description: "Left spotlight flickers on corrugations", ...over },
  });
  expect(status).toBe(201);
  return (json as { defect: { id: string; version: number } }).defect;
}

async function move(email: string, id: string, body: Record<string, unknown>) {
  return callRoute(moveRoute, { user: await signedInAs(database, email), params: { id }, body });
}

async function makeJob(vehicleId: string, state: (typeof jobs.state.enumValues)[number] = "open"): Promise<string> {
  jobNumber += 1;
  const [row] = await database.insert(jobs).values({ orgId: mirrabel, number: jobNumber, vehicleId, title: "Repair from a defect", state }).returning({ id: jobs.id });
  return row!.id;
}

const stateOf = async (id: string) => (await database.query.defects.findFirst({ where: eq(defects.id, id) }))!;

describe("manager triage", () => {
  it("walks a defect from reported to closed, one audit entry per move", async () => {
    const defect = await reported();
    const job = await makeJob(vehicle);
    expect((await move(MANAGER, defect.id, { move: "triage" })).json).toMatchObject({ state: "triaged" });
    expect((await move(MANAGER, defect.id, { move: "start_repair", jobId: job })).json).toMatchObject({ state: "in_repair", jobId: job });
    expect((await move(MANAGER, defect.id, { move: "resolve" })).json).toMatchObject({ state: "resolved" });
    expect((await move(MANAGER, defect.id, { move: "close" })).json).toMatchObject({ state: "closed" });
    const actions = (await database.select().from(auditEntries).where(eq(auditEntries.entityId, defect.id))).map((a) => a.action);
    expect(actions).toEqual(["defect.report", "defect.triage", "defect.start_repair", "defect.resolve", "defect.close"]);
    // The driver sees where their report stands, and the job that repaired it.
    const mine = await callRoute(getDefectRoute, { user: await signedInAs(database, DRIVER), params: { id: defect.id } });
    expect(mine.json).toMatchObject({ defect: { state: "closed", jobId: job }, jobNumber, moves: [] });
  });

  it("answers 409 with the reason for a move the states do not allow, and changes nothing", async () => {
    const defect = await reported();
    const job = await makeJob(vehicle);
    const early = await move(MANAGER, defect.id, { move: "start_repair", jobId: job });
    expect(early.status).toBe(409);
    expect(early.json).toMatchObject({ error: { code: "conflict", message: "It is reported: triage it before linking a repair job." } });
    expect((await move(MANAGER, defect.id, { move: "resolve" })).status).toBe(409);
    expect((await stateOf(defect.id)).state).toBe("reported");
  });

  it("closes an unrepaired defect only with a reason", async () => {
    const defect = await reported();
    const bare = await move(MANAGER, defect.id, { move: "close" });
    expect(bare.status).toBe(409);
    expect(bare.json).toMatchObject({ error: { message: "Say why it is closed without a repair." } });
    const closed = await move(MANAGER, defect.id, { move: "close", reason: "Not a fault: the spotlight switch was half on" });
    expect(closed.json).toMatchObject({ state: "closed", closeReason: "Not a fault: the spotlight switch was half on" });
    const audit = await database.query.auditEntries.findFirst({ where: and(eq(auditEntries.entityId, defect.id), eq(auditEntries.action, "defect.close")) });
    expect(audit?.reason).toBe("Not a fault: the spotlight switch was half on");
    // Final: nothing moves it again.
    expect((await move(MANAGER, defect.id, { move: "triage" })).status).toBe(409);
  });

  it("gives one result and one clear conflict when two managers move the same version", async () => {
    const defect = await reported();
    const first = await move(MANAGER, defect.id, { move: "triage", version: defect.version });
    const second = await move("manager2@mirrabel-health.example", defect.id, { move: "close", reason: "Duplicate of a phone call", version: defect.version });
    expect(first.status).toBe(200);
    expect(second.status).toBe(409);
    expect(second.json).toMatchObject({ error: { message: expect.stringContaining("changed by someone else") } });
    expect((await stateOf(defect.id)).state).toBe("triaged");
  });

  it("gives one result and one conflict when two managers press at the same moment", async () => {
    const defect = await reported();
    const [a, b] = await Promise.all([
      move(MANAGER, defect.id, { move: "triage", version: defect.version }),
      move("manager2@mirrabel-health.example", defect.id, { move: "close", reason: "Reported twice by phone", version: defect.version }),
    ]);
    expect([a.status, b.status].sort()).toEqual([200, 409]);
    const audits = await database.select().from(auditEntries).where(eq(auditEntries.entityId, defect.id));
    expect(audits.map((x) => x.action).filter((x) => x !== "defect.report")).toHaveLength(1);
  });

  it("links only an open job of the same vehicle", async () => {
    const defect = await reported();
    await move(MANAGER, defect.id, { move: "triage" });
    const elsewhere = await move(MANAGER, defect.id, { move: "start_repair", jobId: await makeJob(otherVehicle) });
    expect(elsewhere.status).toBe(422);
    expect(elsewhere.json).toMatchObject({ error: { details: [{ field: "jobId" }] } });
    const cancelled = await move(MANAGER, defect.id, { move: "start_repair", jobId: await makeJob(vehicle, "cancelled") });
    expect(cancelled.status).toBe(409);
    expect((await move(MANAGER, defect.id, { move: "start_repair", jobId: "no-such-job" })).status).toBe(404);
    expect((await stateOf(defect.id)).state).toBe("triaged");
  });

  it("merges a duplicate into the report kept, which takes the more urgent severity", async () => {
    const kept = await reported({ severity: "watch", description: "Radio crackles" });
    const duplicate = await reported({ severity: "before_next_trip", category: "communications", description: "UHF radio cuts out" });
    const merged = await move(MANAGER, duplicate.id, { move: "merge", intoId: kept.id });
    expect(merged.json).toMatchObject({ state: "merged", mergedIntoId: kept.id });
    expect((await stateOf(kept.id)).severity).toBe("before_next_trip");
    const view = await callRoute(getDefectRoute, { user: await signedInAs(database, MANAGER), params: { id: kept.id } });
    expect((view.json as { mergedIn: { id: string }[] }).mergedIn.map((m) => m.id)).toEqual([duplicate.id]);
    // Not into itself, not across vehicles, not into a closed report.
    const other = await reported();
    expect((await move(MANAGER, other.id, { move: "merge", intoId: other.id })).status).toBe(422);
    const closed = await reported();
    await move(MANAGER, closed.id, { move: "close", reason: "Fixed on the road by the driver" });
    expect((await move(MANAGER, other.id, { move: "merge", intoId: closed.id })).status).toBe(409);
  });

  it("refuses triage to everyone but managers (403), and another organisation's defect is not found (404)", async () => {
    const defect = await reported();
    for (const email of [DRIVER, "admin@mirrabel-health.example", "finance@mirrabel-health.example", "contractor@tallowbark-fitout.example"]) {
      expect((await move(email, defect.id, { move: "triage" })).status, email).toBe(403);
    }
    expect((await move("manager@gidgee-trust.example", defect.id, { move: "triage" })).status).toBe(404);
    expect((await stateOf(defect.id)).state).toBe("reported");
    const gidgee = await orgId(database, GIDGEE);
    expect(gidgee).not.toBe(mirrabel);
  });

  it("names the field when the move is malformed (422)", async () => {
    const defect = await reported();
    const { status, json } = await move(MANAGER, defect.id, { move: "merge" });
    expect(status).toBe(422);
    expect(json).toMatchObject({ error: { code: "validation_failed", details: [{ field: "intoId" }] } });
  });

  it("lets a contractor read a defect once it is linked to a job awarded to their firm", async () => {
    const defect = await reported();
    const firm = await database.query.contractorFirms.findFirst({ where: (f, { eq: is }) => is(f.name, "Tallowbark Fit-Out Workshop") });
    const job = await makeJob(vehicle, "awarded");
    await database.update(jobs).set({ awardedFirmId: firm!.id }).where(eq(jobs.id, job));
    const contractor = await signedInAs(database, "contractor@tallowbark-fitout.example");
    expect((await callRoute(getDefectRoute, { user: contractor, params: { id: defect.id } })).status).toBe(404);
    await move(MANAGER, defect.id, { move: "triage" });
    await move(MANAGER, defect.id, { move: "start_repair", jobId: job });
    expect((await callRoute(getDefectRoute, { user: contractor, params: { id: defect.id } })).status).toBe(200);
    expect((await callRoute(getDefectRoute, { user: await signedInAs(database, "contractor@spindleflat-4x4.example"), params: { id: defect.id } })).status).toBe(404);
  });
});

describe("raising a repair job from a defect", () => {
  const raise = async (body: Record<string, unknown>) =>
    callRoute(raiseJobRoute, { user: await signedInAs(database, MANAGER), body: { vehicleId: vehicle, title: "Repair the spotlight", freeText: ["Replace the left spotlight loom"], costKind: "operating", ...body } });
  const jobCount = async () => (await database.select({ id: jobs.id }).from(jobs).where(eq(jobs.orgId, mirrabel))).length;

  it("links a triaged defect to the new job and puts it in repair, in one step", async () => {
    const defect = await reported();
    await move(MANAGER, defect.id, { move: "triage" });
    const { status, json } = await raise({ defectId: defect.id });
    expect(status).toBe(201);
    const jobId = (json as { id: string }).id;
    expect(await stateOf(defect.id)).toMatchObject({ state: "in_repair", jobId });
    const actions = (await database.select().from(auditEntries).where(eq(auditEntries.entityId, defect.id))).map((a) => a.action);
    expect(actions).toEqual(["defect.report", "defect.triage", "defect.start_repair"]);
  });

  it("raises nothing when the defect cannot be linked: not triaged yet (409), on another vehicle (422), unknown (422)", async () => {
    const untriaged = await reported();
    const before = await jobCount();
    const early = await raise({ defectId: untriaged.id });
    expect(early.status).toBe(409);
    expect((await stateOf(untriaged.id)).state).toBe("reported");

    const elsewhere = await reported({ vehicleId: otherVehicle });
    await move(MANAGER, elsewhere.id, { move: "triage" });
    const wrongVehicle = await raise({ defectId: elsewhere.id });
    expect(wrongVehicle.status).toBe(422);
    expect(wrongVehicle.json).toMatchObject({ error: { details: [{ field: "defectId", message: "That defect is on another vehicle" }] } });
    expect((await stateOf(elsewhere.id)).state).toBe("triaged");

    const unknown = await raise({ defectId: uuid() });
    expect(unknown.status).toBe(422);
    expect(unknown.json).toMatchObject({ error: { details: [{ field: "defectId" }] } });
    // The job and the link stand or fall together.
    expect(await jobCount()).toBe(before);
  });
});
