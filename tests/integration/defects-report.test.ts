import { and, eq } from "drizzle-orm";
import exifr from "exifr";
import sharp from "sharp";
import { beforeAll, describe, expect, it, vi } from "vitest";
import { GET as listDefectsRoute, POST as postDefect } from "@/app/api/defects/route";
import { GET as getDefectRoute } from "@/app/api/defects/[id]/route";
import { GET as getPhotoRoute } from "@/app/api/defects/[id]/photos/[photoId]/route";
import { auditEntries, defects, evidence, outboxMessages } from "@/db/schema";
import { AlreadyRecorded, recordDefect } from "@/lib/commands/defects";
import { execute } from "@/lib/server/operation";
import { storage } from "@/lib/server/storage";
import { useTestDatabase } from "../helpers/db";
import { callRoute, requestUser } from "../helpers/route";
import { signedInAs } from "../helpers/users";
import { GIDGEE, MIRRABEL, jpegWithGps, makeVehicle, orgId, useTempStorage, uuid, vehicleState } from "../unit/defects/db-fixtures";

vi.mock("@/lib/server/session", async (original) => ({
  ...(await original<typeof import("@/lib/server/session")>()),
  currentUser: async () => requestUser.current,
}));

// Rules checked here are Rigline's own (the permission table and the defect flow of the
// product brief); no external source.

const database = await useTestDatabase();
useTempStorage();

const DRIVER = "driver@mirrabel-health.example";
const DRIVER2 = "driver2@mirrabel-health.example";
let mirrabel: string;
let mine: string;
let theirs: string;
let foreign: string;

beforeAll(async () => {
  mirrabel = await orgId(database, MIRRABEL);
  mine = await makeVehicle(database, mirrabel, { fleetNumber: "TST-MINE", drivers: [DRIVER] });
  theirs = await makeVehicle(database, mirrabel, { fleetNumber: "TST-THEIRS", drivers: [DRIVER2] });
  foreign = await makeVehicle(database, await orgId(database, GIDGEE), { fleetNumber: "TST-GT", drivers: ["driver@gidgee-trust.example"] });
});

const report = (over: Record<string, unknown> = {}) => ({
  clientId: uuid(),
  vehicleId: mine,
  severity: "watch",
  category: "body_glass",
  description: "Stone chip low on the windscreen, passenger side",
  odometerKm: 48210,
  ...over,
});

const rowsWith = (clientId: string) => database.select().from(defects).where(eq(defects.clientId, clientId));

describe("reporting a defect", () => {
  it("writes the report and its audit entry, answering 201", async () => {
    const body = report({ latitude: -23.7, longitude: 133.87 });
    const { status, json } = await callRoute(postDefect, { user: await signedInAs(database, DRIVER), body });
    expect(status).toBe(201);
    expect(json).toMatchObject({ created: true, grounded: false, defect: { clientId: body.clientId, state: "reported", severity: "watch", odometerKm: 48210, latitude: -23.7 } });
    const [row] = await rowsWith(body.clientId);
    expect(row?.reportedBy).toBe((await signedInAs(database, DRIVER)).userId);
    const audit = await database.query.auditEntries.findFirst({ where: and(eq(auditEntries.action, "defect.report"), eq(auditEntries.entityId, row!.id)) });
    expect(audit?.after).toMatchObject({ severity: "watch", state: "reported" });
  });

  it("is idempotent on the device id: the same report twice makes one row and answers 200 the second time", async () => {
    const driver = await signedInAs(database, DRIVER);
    const body = report();
    const first = await callRoute(postDefect, { user: driver, body });
    const second = await callRoute(postDefect, { user: driver, body });
    expect(first.status).toBe(201);
    expect(second.status).toBe(200);
    expect(second.json).toMatchObject({ created: false, defect: { id: (first.json as { defect: { id: string } }).defect.id } });
    expect(await rowsWith(body.clientId)).toHaveLength(1);
    const audits = await database.select().from(auditEntries).where(and(eq(auditEntries.action, "defect.report"), eq(auditEntries.entityId, (first.json as { defect: { id: string } }).defect.id)));
    expect(audits).toHaveLength(1);
  });

  it("makes one row when two copies of a report arrive at the same moment", async () => {
    const driver = await signedInAs(database, DRIVER);
    const body = report();
    const answers = await Promise.all([callRoute(postDefect, { user: driver, body }), callRoute(postDefect, { user: driver, body })]);
    expect(answers.map((a) => a.status).sort()).toEqual([200, 201]);
    expect(await rowsWith(body.clientId)).toHaveLength(1);
  });

  it("rolls back a copy that reaches the recording step after the first was written", async () => {
    // Two copies in flight both pass the early look-up; the later one meets the row at the
    // recording step, is rolled back and answered with the report already held.
    const driver = await signedInAs(database, DRIVER);
    const body = report();
    const first = await execute(recordDefect, driver, { ...body, storedPhotos: [] });
    const late = await execute(recordDefect, driver, { ...body, storedPhotos: [] }).catch((e: unknown) => e);
    expect(late).toBeInstanceOf(AlreadyRecorded);
    expect((late as AlreadyRecorded<{ id: string }>).record.id).toBe(first.defect.id);
    expect(await rowsWith(body.clientId)).toHaveLength(1);
  });

  it("refuses a device id already used for a different report (409)", async () => {
    const driver = await signedInAs(database, DRIVER);
    const body = report();
    await callRoute(postDefect, { user: driver, body });
    const other = await callRoute(postDefect, { user: await signedInAs(database, DRIVER2), body: { ...body, vehicleId: theirs } });
    expect(other.status).toBe(409);
  });

  it("answers 404 for a vehicle not assigned to the driver, and for another organisation's vehicle", async () => {
    const driver = await signedInAs(database, DRIVER);
    for (const vehicleId of [theirs, foreign]) {
      const body = report({ vehicleId });
      const { status, json } = await callRoute(postDefect, { user: driver, body });
      expect(status).toBe(404);
      expect(json).toMatchObject({ error: { code: "not_found" } });
      expect(await rowsWith(body.clientId)).toHaveLength(0);
    }
  });

  it("answers 403 to roles the table does not let report", async () => {
    for (const email of ["manager@mirrabel-health.example", "finance@mirrabel-health.example", "contractor@tallowbark-fitout.example"]) {
      const { status } = await callRoute(postDefect, { user: await signedInAs(database, email), body: report() });
      expect(status, email).toBe(403);
    }
  });

  it("names each bad field (422) and writes nothing", async () => {
    const body = report({ severity: "soon", description: "", odometerKm: -1 });
    const { status, json } = await callRoute(postDefect, { user: await signedInAs(database, DRIVER), body });
    expect(status).toBe(422);
    const fields = (json as { error: { details: { field: string }[] } }).error.details.map((d) => d.field).sort();
    expect(fields).toEqual(["description", "odometerKm", "severity"]);
    expect(await rowsWith(body.clientId)).toHaveLength(0);
    const half = await callRoute(postDefect, { user: await signedInAs(database, DRIVER), body: report({ latitude: 12 }) });
    expect(half.json).toMatchObject({ error: { code: "validation_failed", details: [{ field: "longitude" }] } });
  });
});

describe("a stop defect", () => {
  it("grounds the vehicle at once and queues a mail to every manager of the organisation", async () => {
    const vehicle = await makeVehicle(database, mirrabel, { fleetNumber: "TST-STOP", drivers: [DRIVER] });
    const before = await database.select().from(outboxMessages).where(eq(outboxMessages.kind, "defect_stop"));
    const body = report({ vehicleId: vehicle, severity: "stop", category: "brakes", description: "Brake pedal sinks to the floor" });
    const { status, json } = await callRoute(postDefect, { user: await signedInAs(database, DRIVER), body });
    expect(status).toBe(201);
    expect(json).toMatchObject({ grounded: true, managersNotified: 2 });

    const state = await vehicleState(database, vehicle);
    expect(state.state).toBe("grounded");
    expect(state.groundedReason).toContain("Brake pedal sinks to the floor");

    const mails = (await database.select().from(outboxMessages).where(eq(outboxMessages.kind, "defect_stop"))).filter((m) => !before.some((b) => b.id === m.id));
    // Both Mirrabel managers, nobody else (not the other organisation's manager, not the admin).
    expect(mails.map((m) => m.toAddress).sort()).toEqual(["manager2@mirrabel-health.example", "manager@mirrabel-health.example"]);
    expect(mails[0]?.subject).toBe("Stop defect: TST-STOP is grounded");
    expect(mails[0]?.textBody).toContain("/defects/");

    const grounding = await database.query.auditEntries.findFirst({ where: and(eq(auditEntries.action, "vehicle.ground"), eq(auditEntries.entityId, vehicle)) });
    expect(grounding?.before).toMatchObject({ state: "in_service" });
    expect(grounding?.after).toMatchObject({ state: "grounded" });
  });

  it("mails managers who turned off other notices too (a safety notice)", async () => {
    const vehicle = await makeVehicle(database, mirrabel, { fleetNumber: "TST-STOP2", drivers: [DRIVER] });
    const { users } = await import("@/db/schema");
    await database.update(users).set({ notifyNonEssential: false }).where(eq(users.email, "manager2@mirrabel-health.example"));
    const body = report({ vehicleId: vehicle, severity: "stop", category: "tyres_wheels", description: "Sidewall torn on the left rear" });
    await callRoute(postDefect, { user: await signedInAs(database, DRIVER), body });
    const mails = await database.select().from(outboxMessages).where(eq(outboxMessages.subject, "Stop defect: TST-STOP2 is grounded"));
    expect(mails.map((m) => m.toAddress)).toContain("manager2@mirrabel-health.example");
    await database.update(users).set({ notifyNonEssential: true }).where(eq(users.email, "manager2@mirrabel-health.example"));
  });

  it("does not ground or mail again when the same report is sent twice", async () => {
    const vehicle = await makeVehicle(database, mirrabel, { fleetNumber: "TST-STOP3", drivers: [DRIVER] });
    const body = report({ vehicleId: vehicle, severity: "stop", category: "steering_suspension", description: "Steering wanders badly" });
    const driver = await signedInAs(database, DRIVER);
    await callRoute(postDefect, { user: driver, body });
    const again = await callRoute(postDefect, { user: driver, body });
    expect(again.json).toMatchObject({ created: false, grounded: false });
    const mails = await database.select().from(outboxMessages).where(eq(outboxMessages.subject, "Stop defect: TST-STOP3 is grounded"));
    expect(mails).toHaveLength(2);
  });
});

describe("photos from the phone", () => {
  it("stores each photo as a JPEG without the camera's GPS position, and serves it to the reporter only", async () => {
    const original = await jpegWithGps();
    expect(await exifr.gps(original)).toMatchObject({ latitude: -23.7 });
    const form = new FormData();
    const body = report();
    for (const [k, v] of Object.entries(body)) form.set(k, String(v));
    form.append("photos", new File([new Uint8Array(original)], "IMG_0042.JPG", { type: "image/jpeg" }));
    const driver = await signedInAs(database, DRIVER);
    const { status, json } = await callRoute(postDefect, { user: driver, body: form });
    expect(status).toBe(201);
    const defect = (json as { defect: { id: string; photoIds: string[] } }).defect;
    expect(defect.photoIds).toHaveLength(1);

    const [row] = await database.select().from(evidence).where(eq(evidence.defectId, defect.id));
    expect(row).toMatchObject({ kind: "photo", contentType: "image/jpeg", filename: "IMG_0042.jpg", uploadedBy: driver.userId });
    const stored = await storage().get(row!.storageKey);
    expect(await exifr.gps(stored!.bytes)).toBeUndefined();
    expect((await sharp(stored!.bytes).metadata()).format).toBe("jpeg");

    const mineAnswer = await callRoute(getPhotoRoute, { user: driver, params: { id: defect.id, photoId: row!.id } });
    expect(mineAnswer.status).toBe(200);
    expect(mineAnswer.response.headers.get("content-type")).toBe("image/jpeg");
    const otherDriver = await callRoute(getPhotoRoute, { user: await signedInAs(database, DRIVER2), params: { id: defect.id, photoId: row!.id } });
    expect(otherDriver.status).toBe(404);
  });

  it("refuses a file that is not a picture whatever its name (415), and writes nothing", async () => {
    const form = new FormData();
    const body = report();
    for (const [k, v] of Object.entries(body)) form.set(k, String(v));
    form.append("photos", new File([new TextEncoder().encode("just some text, not a photo")], "tyre.jpg", { type: "image/jpeg" }));
    const { status, json } = await callRoute(postDefect, { user: await signedInAs(database, DRIVER), body: form });
    expect(status).toBe(415);
    expect(json).toMatchObject({ error: { code: "unsupported_media_type", details: [{ field: "photos.0" }] } });
    expect(await rowsWith(body.clientId)).toHaveLength(0);
  });

  it("refuses an oversized photo (413)", async () => {
    const form = new FormData();
    const body = report();
    for (const [k, v] of Object.entries(body)) form.set(k, String(v));
    form.append("photos", new File([new Uint8Array(10 * 1024 * 1024 + 1)], "big.jpg", { type: "image/jpeg" }));
    const { status } = await callRoute(postDefect, { user: await signedInAs(database, DRIVER), body: form });
    expect(status).toBe(413);
    expect(await rowsWith(body.clientId)).toHaveLength(0);
  });
});

describe("reading defects", () => {
  it("lets a driver read their own report but not another driver's (404)", async () => {
    const body = report({ vehicleId: theirs, description: "Rear door seal lets dust in" });
    const posted = await callRoute(postDefect, { user: await signedInAs(database, DRIVER2), body });
    const id = (posted.json as { defect: { id: string } }).defect.id;
    expect((await callRoute(getDefectRoute, { user: await signedInAs(database, DRIVER2), params: { id } })).status).toBe(200);
    const other = await callRoute(getDefectRoute, { user: await signedInAs(database, DRIVER), params: { id } });
    expect(other.status).toBe(404);
    const list = await callRoute(listDefectsRoute, { user: await signedInAs(database, DRIVER), url: "http://localhost/api/defects?pageSize=100" });
    const items = (list.json as { items: { id: string; reportedBy: string }[] }).items;
    expect(items.some((i) => i.id === id)).toBe(false);
    const me = (await signedInAs(database, DRIVER)).userId;
    expect(items.length).toBeGreaterThan(0);
    expect(items.every((i) => i.reportedBy === me)).toBe(true);
  });

  it("lets managers, admins and finance read every report of their organisation, and nobody another organisation's", async () => {
    const body = report({ description: "Bull bar bracket cracked" });
    const posted = await callRoute(postDefect, { user: await signedInAs(database, DRIVER), body });
    const id = (posted.json as { defect: { id: string } }).defect.id;
    for (const email of ["manager@mirrabel-health.example", "admin@mirrabel-health.example", "finance@mirrabel-health.example"]) {
      expect((await callRoute(getDefectRoute, { user: await signedInAs(database, email), params: { id } })).status, email).toBe(200);
    }
    expect((await callRoute(getDefectRoute, { user: await signedInAs(database, "manager@gidgee-trust.example"), params: { id } })).status).toBe(404);
    // A contractor sees only defects linked to their jobs: none here.
    expect((await callRoute(getDefectRoute, { user: await signedInAs(database, "contractor@tallowbark-fitout.example"), params: { id } })).status).toBe(404);
  });

  it("filters by open state and severity", async () => {
    const { json, status } = await callRoute(listDefectsRoute, { user: await signedInAs(database, "manager@mirrabel-health.example"), url: "http://localhost/api/defects?state=open&severity=stop&pageSize=100" });
    expect(status).toBe(200);
    const items = (json as { items: { severity: string; state: string }[] }).items;
    expect(items.length).toBeGreaterThanOrEqual(3);
    expect(items.every((i) => i.severity === "stop" && ["reported", "triaged", "in_repair"].includes(i.state))).toBe(true);
    const bad = await callRoute(listDefectsRoute, { user: await signedInAs(database, "manager@mirrabel-health.example"), url: "http://localhost/api/defects?state=lost" });
    expect(bad.status).toBe(422);
  });
});
