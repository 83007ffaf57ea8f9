import { and, eq, isNull } from "drizzle-orm";
import { beforeAll, describe, expect, it, vi } from "vitest";
import { DELETE as removeFitmentRoute } from "@/app/api/fitments/[id]/route";
import { GET as listFitmentsRoute, POST as recordFitmentRoute } from "@/app/api/vehicles/[id]/fitments/route";
import { POST as concessionRoute } from "@/app/api/vehicles/[id]/variance/concessions/route";
import { GET as varianceRoute } from "@/app/api/vehicles/[id]/variance/route";
import { auditEntries, fitments, vehicles } from "@/db/schema";
import { useTestDatabase } from "../helpers/db";
import { callRoute, requestUser } from "../helpers/route";
import { signedInAs } from "../helpers/users";

vi.mock("@/lib/server/session", async (original) => ({
  ...(await original<typeof import("@/lib/server/session")>()),
  currentUser: async () => requestUser.current,
}));

const database = await useTestDatabase();
type User = Awaited<ReturnType<typeof signedInAs>>;
let manager: User;
type Line = { code: string; key: string; status: string; failing: { attribute: string; actual: unknown }[]; concession: { reason: string } | null };
type Variance = { summary: Record<string, number>; lines: Line[]; extras: { label: string }[] };

const idOf = async (fleetNumber: string) => (await database.query.vehicles.findFirst({ where: eq(vehicles.fleetNumber, fleetNumber) }))!.id;
const varianceOf = async (vehicleId: string) => (await callRoute(varianceRoute, { user: manager, params: { id: vehicleId } })).json as Variance;
const lineOf = (v: Variance, code: string) => v.lines.find((l) => l.code === code)!;
const record = (vehicleId: string, body: Record<string, unknown>, user = manager) => callRoute(recordFitmentRoute, { user, params: { id: vehicleId }, body });

beforeAll(async () => {
  manager = await signedInAs(database, "manager@mirrabel-health.example");
});

describe("recording what is fitted", () => {
  it("a fitment for a short line with its measured values turns the line to meets, with who recorded it", async () => {
    // MH-005 is in fit-out: only its tyres and wheels are on (db/seed/standards.ts).
    const vehicleId = await idOf("MH-005");
    expect(lineOf(await varianceOf(vehicleId), "EL-03").status).toBe("short");
    const { status, json } = await record(vehicleId, { lineKey: "winch-cable", quantity: 1, attributes: { cableAreaMm2: 25 }, fittedAt: "2026-01-15" });
    expect(status).toBe(201);
    const row = await database.query.fitments.findFirst({ where: eq(fitments.id, (json as { id: string }).id) });
    expect(row).toMatchObject({ lineKey: "winch-cable", label: "Main supply cable, battery to front and rear", recordedBy: manager.userId, attributes: { cableAreaMm2: 25 } });
    expect(lineOf(await varianceOf(vehicleId), "EL-03").status).toBe("meets");
    const audit = await database.query.auditEntries.findFirst({ where: and(eq(auditEntries.action, "fitment.record"), eq(auditEntries.entityId, row!.id)) });
    expect(audit?.actorId).toBe(manager.userId);
  });

  it("a measured value below the criterion is off-spec, naming the value found (form fields as text)", async () => {
    const vehicleId = await idOf("MH-005");
    // Rigline rule: a fuse of 100 A recorded against a line that asks 40–80 A fails "between".
    await record(vehicleId, { lineKey: "supply-fuses", quantity: "2", "attributes.fuseRatingA": "100" });
    const fuses = lineOf(await varianceOf(vehicleId), "EL-04");
    expect(fuses.status).toBe("off_spec");
    expect(fuses.failing).toEqual([expect.objectContaining({ attribute: "fuseRatingA", actual: 100 })]);
  });

  it("takes the fitment form's text fields as sent: blank dates, measured values, the extra marker", async () => {
    const vehicleId = await idOf("MH-005");
    const line = await record(vehicleId, { lineKey: "dual-battery", quantity: "1", "attributes.capacityAh": "120", fittedAt: "2026-01-20", expiresAt: "" });
    expect(line.status).toBe(201);
    expect((line.json as { expiresAt: string | null }).expiresAt).toBeNull();
    const extra = await record(vehicleId, { lineKey: "__extra__", label: "Dash camera", massKg: "", xMm: "", zone: "", massKind: "constant", quantity: "1", fittedAt: "", expiresAt: "" });
    expect(extra.status).toBe(201);
    // The auxiliary battery line needs an accepted photo: fitted and measured, it is unproven until then.
    expect(lineOf(await varianceOf(vehicleId), "EL-01").status).toBe("unproven");
  });

  it("a line's expiry is set from its expiry months when none is given", async () => {
    const vehicleId = await idOf("MH-005");
    const { json } = await record(vehicleId, { lineKey: "first-aid-kit", fittedAt: "2026-02-01" });
    // First-aid kit line: 12 months → 2027-02-01.
    expect(new Date((json as { expiresAt: string }).expiresAt).toISOString().slice(0, 10)).toBe("2027-02-01");
  });

  it("an extra carries its own label, mass and position", async () => {
    const vehicleId = await idOf("MH-005");
    const { status } = await record(vehicleId, { lineKey: "", label: "Rooftop tent", massKg: "58", zone: "roof", massKind: "constant" });
    expect(status).toBe(201);
    const row = await database.query.fitments.findFirst({ where: and(eq(fitments.vehicleId, vehicleId), eq(fitments.label, "Rooftop tent")) });
    expect(row).toMatchObject({ lineKey: null, massKg: 58, zone: "roof", massKind: "constant" });
    expect((await varianceOf(vehicleId)).extras.map((e) => e.label)).toContain("Rooftop tent");
  });

  it("refuses a line the vehicle's edition does not have, an extra without a label, and a future date", async () => {
    const vehicleId = await idOf("MH-005");
    const before = await database.$count(fitments, eq(fitments.vehicleId, vehicleId));
    const badLine = await record(vehicleId, { lineKey: "no-such-line" });
    expect(badLine.status).toBe(422);
    expect((badLine.json as { error: { details: { field: string }[] } }).error.details[0]?.field).toBe("lineKey");
    const noLabel = await record(vehicleId, { lineKey: null });
    expect((noLabel.json as { error: { details: { field: string }[] } }).error.details[0]?.field).toBe("label");
    const future = await record(vehicleId, { label: "Spare jack", fittedAt: new Date(Date.now() + 5 * 86_400_000).toISOString() });
    expect((future.json as { error: { details: { field: string }[] } }).error.details[0]?.field).toBe("fittedAt");
    expect(await database.$count(fitments, eq(fitments.vehicleId, vehicleId))).toBe(before);
  });

  it("removing sets the removal date, keeps the record, and the line is short again; removing twice is 409", async () => {
    const vehicleId = await idOf("MH-005");
    const row = await database.query.fitments.findFirst({ where: and(eq(fitments.vehicleId, vehicleId), eq(fitments.lineKey, "winch-cable"), isNull(fitments.removedAt)) });
    const { status } = await callRoute(removeFitmentRoute, { user: manager, method: "DELETE", params: { id: row!.id } });
    expect(status).toBe(200);
    const after = await database.query.fitments.findFirst({ where: eq(fitments.id, row!.id) });
    expect(after?.removedAt).toBeInstanceOf(Date);
    expect(lineOf(await varianceOf(vehicleId), "EL-03").status).toBe("short");
    expect((await callRoute(removeFitmentRoute, { user: manager, method: "DELETE", params: { id: row!.id } })).status).toBe(409);
    const list = (await callRoute(listFitmentsRoute, { user: manager, params: { id: vehicleId }, url: "http://localhost/api?includeRemoved=true" })).json as { items: { id: string; removedAt: string | null }[] };
    expect(list.items.find((i) => i.id === row!.id)?.removedAt).not.toBeNull();
  });
});

describe("concessions", () => {
  it("a manager's concession with a reason and expiry turns a short line into a concession", async () => {
    const vehicleId = await idOf("MH-008"); // short its shock absorbers
    expect(lineOf(await varianceOf(vehicleId), "SU-03").status).toBe("short");
    const expiresAt = new Date(Date.now() + 30 * 86_400_000).toISOString().slice(0, 10);
    const { status } = await callRoute(concessionRoute, { user: manager, params: { id: vehicleId }, body: { lineKey: "shocks", reason: "Shock absorbers on order; depot runs only until fitted", expiresAt } });
    expect(status).toBe(201);
    const line = lineOf(await varianceOf(vehicleId), "SU-03");
    expect(line.status).toBe("concession");
    expect(line.concession?.reason).toMatch(/on order/);
  });

  it("refuses a concession without a reason or ending in the past", async () => {
    const vehicleId = await idOf("MH-008");
    const noReason = await callRoute(concessionRoute, { user: manager, params: { id: vehicleId }, body: { lineKey: "shocks", reason: "", expiresAt: "2099-01-01" } });
    expect(noReason.status).toBe(422);
    const past = await callRoute(concessionRoute, { user: manager, params: { id: vehicleId }, body: { lineKey: "shocks", reason: "Long enough reason here", expiresAt: "2020-01-01" } });
    expect((past.json as { error: { details: { field: string }[] } }).error.details[0]?.field).toBe("expiresAt");
  });
});

describe("who may record fitments", () => {
  it("finance, drivers and contractors cannot record or remove (403); another organisation gets 404", async () => {
    const vehicleId = await idOf("MH-001");
    for (const email of ["finance@mirrabel-health.example", "driver@mirrabel-health.example", "contractor@tallowbark-fitout.example"]) {
      const user = await signedInAs(database, email);
      expect((await record(vehicleId, { label: "Anything" }, user)).status, email).toBe(403);
    }
    const row = await database.query.fitments.findFirst({ where: eq(fitments.vehicleId, vehicleId) });
    const driver = await signedInAs(database, "driver@mirrabel-health.example");
    expect((await callRoute(removeFitmentRoute, { user: driver, method: "DELETE", params: { id: row!.id } })).status).toBe(403);
    const other = await signedInAs(database, "manager@gidgee-trust.example");
    expect((await record(vehicleId, { label: "Anything" }, other)).status).toBe(404);
    expect((await callRoute(removeFitmentRoute, { user: other, method: "DELETE", params: { id: row!.id } })).status).toBe(404);
    const finance = await signedInAs(database, "finance@mirrabel-health.example");
    expect((await callRoute(listFitmentsRoute, { user: finance, params: { id: vehicleId } })).status).toBe(200);
  });
});
