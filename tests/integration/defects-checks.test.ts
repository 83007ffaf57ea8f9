import { eq } from "drizzle-orm";
import exifr from "exifr";
import { beforeAll, describe, expect, it, vi } from "vitest";
import { GET as listChecksRoute, POST as postCheck } from "@/app/api/checks/route";
import { GET as getCheckRoute } from "@/app/api/checks/[id]/route";
import { GET as checkPhotoRoute } from "@/app/api/checks/[id]/photos/[photoId]/route";
import { GET as checklistRoute } from "@/app/api/vehicles/[id]/checklist/route";
import { auditEntries, evidence, preTripChecks } from "@/db/schema";
import { GENERAL_CHECK_ITEMS } from "@/lib/defects";
import { storage } from "@/lib/server/storage";
import { useTestDatabase } from "../helpers/db";
import { callRoute, requestUser } from "../helpers/route";
import { signedInAs } from "../helpers/users";
import { MIRRABEL, jpegWithGps, makeEdition, makeVehicle, orgId, useTempStorage, uuid } from "../unit/defects/db-fixtures";

vi.mock("@/lib/server/session", async (original) => ({
  ...(await original<typeof import("@/lib/server/session")>()),
  currentUser: async () => requestUser.current,
}));

// The general walk-round is common practice for a pre-trip check; which lines join it (those
// marked checkable) and the rules on answers are Rigline's own.

const database = await useTestDatabase();
useTempStorage();

const DRIVER = "driver@mirrabel-health.example";
const DRIVER2 = "driver2@mirrabel-health.example";
let vehicle: string;
let theirs: string;

beforeAll(async () => {
  const org = await orgId(database, MIRRABEL);
  const edition = await makeEdition(database, org, [
    { key: "kit-first-aid", code: "SA-01", title: "Remote first-aid kit", category: "safety", checkable: true, expiryMonths: 12 },
    { key: "sat-messenger", code: "CM-02", title: "Satellite messenger", category: "communications", checkable: true },
    { key: "drawers", code: "ST-01", title: "Cargo drawers", category: "storage" },
  ]);
  vehicle = await makeVehicle(database, org, { fleetNumber: "CHK-001", editionId: edition, drivers: [DRIVER] });
  theirs = await makeVehicle(database, org, { fleetNumber: "CHK-002", editionId: edition, drivers: [DRIVER2] });
});

const allPass = () => [
  ...GENERAL_CHECK_ITEMS.map((i) => ({ key: i.key, result: "pass" })),
  { key: "line.kit-first-aid", result: "pass" },
  { key: "line.sat-messenger", result: "pass" },
];

describe("the checklist of a vehicle", () => {
  it("is the general walk-round, then the edition's checkable lines only", async () => {
    const { status, json } = await callRoute(checklistRoute, { user: await signedInAs(database, DRIVER), params: { id: vehicle } });
    expect(status).toBe(200);
    const items = (json as { items: { key: string; label: string }[] }).items;
    expect(items.map((i) => i.key)).toEqual([...GENERAL_CHECK_ITEMS.map((i) => i.key), "line.kit-first-aid", "line.sat-messenger"]);
    expect(items.at(-1)?.label).toBe("Satellite messenger");
  });

  it("is not shown for a vehicle the driver is not assigned (404)", async () => {
    expect((await callRoute(checklistRoute, { user: await signedInAs(database, DRIVER), params: { id: theirs } })).status).toBe(404);
  });
});

describe("sending a pre-trip check", () => {
  it("records the answers with their labels, once, however often it is sent", async () => {
    const driver = await signedInAs(database, DRIVER);
    const body = { clientId: uuid(), vehicleId: vehicle, items: allPass().map((i) => (i.key === "general.lights" ? { ...i, result: "fail", note: "Right indicator out" } : i)) };
    const first = await callRoute(postCheck, { user: driver, body });
    expect(first.status).toBe(201);
    expect(first.json).toMatchObject({ created: true, check: { counts: { pass: 9, fail: 1, na: 0 } } });
    const again = await callRoute(postCheck, { user: driver, body });
    expect(again.status).toBe(200);
    expect(again.json).toMatchObject({ created: false });
    const rows = await database.select().from(preTripChecks).where(eq(preTripChecks.clientId, body.clientId));
    expect(rows).toHaveLength(1);
    expect(rows[0]!.items.find((i) => i.key === "general.lights")).toEqual({ key: "general.lights", label: "Lights", result: "fail", note: "Right indicator out" });
    expect(rows[0]!.items.find((i) => i.key === "line.kit-first-aid")).toMatchObject({ label: "Remote first-aid kit", lineKey: "kit-first-aid" });
    const audits = await database.select().from(auditEntries).where(eq(auditEntries.entityId, rows[0]!.id));
    expect(audits.map((a) => a.action)).toEqual(["check.submit"]);
  });

  it("wants every item answered and words with every fault (422), and writes nothing otherwise", async () => {
    const driver = await signedInAs(database, DRIVER);
    const missing = { clientId: uuid(), vehicleId: vehicle, items: allPass().slice(1) };
    const a = await callRoute(postCheck, { user: driver, body: missing });
    expect(a.status).toBe(422);
    expect(a.json).toMatchObject({ error: { details: [{ field: "items", message: expect.stringContaining("Tyres and pressures") }] } });
    const mute = { clientId: uuid(), vehicleId: vehicle, items: allPass().map((i) => (i.key === "general.tyres" ? { ...i, result: "fail" } : i)) };
    const b = await callRoute(postCheck, { user: driver, body: mute });
    expect(b.status).toBe(422);
    expect(b.json).toMatchObject({ error: { details: [{ field: "items.0.note", message: "Say what is wrong" }] } });
    expect(await database.select().from(preTripChecks).where(eq(preTripChecks.clientId, missing.clientId))).toHaveLength(0);
  });

  it("keeps an item's photos, without the camera's position, and ties them to the item", async () => {
    const driver = await signedInAs(database, DRIVER);
    const form = new FormData();
    const clientId = uuid();
    form.set("clientId", clientId);
    form.set("vehicleId", vehicle);
    form.set("items", JSON.stringify(allPass().map((i) => (i.key === "general.tyres" ? { ...i, result: "fail", note: "Cut in the left front sidewall" } : i))));
    form.append("photos.general.tyres", new File([new Uint8Array(await jpegWithGps())], "tyre.jpg", { type: "image/jpeg" }));
    const { status, json } = await callRoute(postCheck, { user: driver, body: form });
    expect(status).toBe(201);
    const check = (json as { check: { id: string; photoIds: string[] } }).check;
    expect(check.photoIds).toHaveLength(1);
    const [photo] = await database.select().from(evidence).where(eq(evidence.checkId, check.id));
    expect(photo?.id).toBe(check.photoIds[0]);
    const [row] = await database.select().from(preTripChecks).where(eq(preTripChecks.id, check.id));
    expect(row!.items.find((i) => i.key === "general.tyres")?.photoIds).toEqual([photo!.id]);
    expect(await exifr.gps((await storage().get(photo!.storageKey))!.bytes)).toBeUndefined();
    const served = await callRoute(checkPhotoRoute, { user: driver, params: { id: check.id, photoId: photo!.id } });
    expect(served.status).toBe(200);
    expect((await callRoute(checkPhotoRoute, { user: await signedInAs(database, DRIVER2), params: { id: check.id, photoId: photo!.id } })).status).toBe(404);
  });

  it("is refused on a vehicle not assigned (404) and to roles that do not make checks (403)", async () => {
    const body = { clientId: uuid(), vehicleId: theirs, items: allPass() };
    expect((await callRoute(postCheck, { user: await signedInAs(database, DRIVER), body })).status).toBe(404);
    for (const email of ["manager@mirrabel-health.example", "finance@mirrabel-health.example", "contractor@tallowbark-fitout.example"]) {
      expect((await callRoute(postCheck, { user: await signedInAs(database, email), body: { ...body, vehicleId: vehicle } })).status, email).toBe(403);
    }
  });
});

describe("reading checks", () => {
  it("shows a driver their own checks only; managers see the organisation's; finance none (403)", async () => {
    const posted = await callRoute(postCheck, { user: await signedInAs(database, DRIVER2), body: { clientId: uuid(), vehicleId: theirs, items: allPass() } });
    const id = (posted.json as { check: { id: string } }).check.id;
    expect((await callRoute(getCheckRoute, { user: await signedInAs(database, DRIVER), params: { id } })).status).toBe(404);
    expect((await callRoute(getCheckRoute, { user: await signedInAs(database, "manager@mirrabel-health.example"), params: { id } })).status).toBe(200);
    expect((await callRoute(getCheckRoute, { user: await signedInAs(database, "finance@mirrabel-health.example"), params: { id } })).status).toBe(403);
    const mine = await callRoute(listChecksRoute, { user: await signedInAs(database, DRIVER), url: "http://localhost/api/checks" });
    const me = (await signedInAs(database, DRIVER)).userId;
    const items = (mine.json as { items: { driverId: string }[] }).items;
    expect(items.length).toBeGreaterThan(0);
    expect(items.every((i) => i.driverId === me)).toBe(true);
  });
});
