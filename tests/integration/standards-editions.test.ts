import { and, count, eq } from "drizzle-orm";
import { beforeAll, describe, expect, it, vi } from "vitest";
import { GET as compareRoute } from "@/app/api/editions/compare/route";
import { DELETE as deleteLineRoute, PATCH as patchLineRoute } from "@/app/api/editions/[id]/lines/[lineId]/route";
import { POST as addLineRoute } from "@/app/api/editions/[id]/lines/route";
import { POST as publishRoute } from "@/app/api/editions/[id]/publish/route";
import { POST as rolloutRoute } from "@/app/api/editions/[id]/rollout/route";
import { GET as editionRoute } from "@/app/api/editions/[id]/route";
import { POST as newDraftRoute } from "@/app/api/standards/[id]/editions/route";
import { GET as standardRoute } from "@/app/api/standards/[id]/route";
import { GET as listStandardsRoute, POST as createStandardRoute } from "@/app/api/standards/route";
import { GET as varianceRoute } from "@/app/api/vehicles/[id]/variance/route";
import { auditEntries, editionLines, editions, lineDependencies, standards, vehicles } from "@/db/schema";
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
let finance: User;
let driver: User;
let contractor: User;
let otherManager: User;

type ErrorBody = { error: { code: string; message: string; details: { field?: string; message: string }[] } };
const err = (json: unknown) => (json as ErrorBody).error;

const line = (code: string, title: string, extra: Record<string, unknown> = {}) => ({
  code,
  title,
  category: "recovery",
  requirement: "must_fit",
  quantity: 1,
  massKg: 2,
  zone: "tub",
  massKind: "constant",
  standardCostCents: 10_000,
  ...extra,
});

async function addLine(editionId: string, body: Record<string, unknown>, user = manager) {
  return callRoute(addLineRoute, { user, params: { id: editionId }, body });
}

const idOf = async (fleetNumber: string) => (await database.query.vehicles.findFirst({ where: eq(vehicles.fleetNumber, fleetNumber) }))!.id;

beforeAll(async () => {
  manager = await signedInAs(database, "manager@mirrabel-health.example");
  finance = await signedInAs(database, "finance@mirrabel-health.example");
  driver = await signedInAs(database, "driver@mirrabel-health.example");
  contractor = await signedInAs(database, "contractor@tallowbark-fitout.example");
  otherManager = await signedInAs(database, "manager@gidgee-trust.example");
});

describe("a new standard and its first draft", () => {
  let standardId = "";
  let editionId = "";

  it("creates the standard with a draft edition 1, audited", async () => {
    const { status, json } = await callRoute(createStandardRoute, { user: manager, body: { name: "Town runabout fit-out", description: "Sealed-road pool vehicles" } });
    expect(status).toBe(201);
    ({ id: standardId, editionId } = json as { id: string; editionId: string });
    const edition = await database.query.editions.findFirst({ where: eq(editions.id, editionId) });
    expect(edition).toMatchObject({ number: 1, status: "draft", standardId });
    const audit = await database.query.auditEntries.findFirst({ where: and(eq(auditEntries.action, "standard.create"), eq(auditEntries.entityId, standardId)) });
    expect(audit?.actorId).toBe(manager.userId);
  });

  it("refuses a second standard of the same name with 409 naming the field", async () => {
    const { status, json } = await callRoute(createStandardRoute, { user: manager, body: { name: "Town runabout fit-out" } });
    expect(status).toBe(409);
    expect(err(json).details[0]?.field).toBe("name");
  });

  it("adds lines with criteria, cost in cents and dependencies", async () => {
    const kit = await addLine(editionId, line("SF-01", "First-aid kit", { category: "safety", checkable: true, expiryMonths: 12 }));
    expect(kit.status).toBe(201);
    const tyres = await addLine(editionId, line("TY-01", "Highway tyres", {
      category: "tyres",
      massKg: 0,
      zone: null,
      criteria: [
        { attribute: "tyreSize", op: "eq", value: "265/70R17" },
        { attribute: "loadIndex", op: "gte", value: 121 },
      ],
      evidenceNeeded: ["photo"],
    }));
    expect(tyres.status).toBe(201);
    const tyresId = (tyres.json as { id: string }).id;
    const springs = await addLine(editionId, line("SU-01", "Rear springs", {
      category: "suspension",
      massKg: 0,
      zone: null,
      criteria: [{ attribute: "springRatingKg", op: "between", value: [350, 450], unit: "kg" }],
      dependsOn: [tyresId],
    }));
    expect(springs.status).toBe(201);
    const stored = await database.select().from(editionLines).where(eq(editionLines.editionId, editionId));
    expect(stored.map((l) => l.code).sort()).toEqual(["SF-01", "SU-01", "TY-01"]);
    expect(stored.find((l) => l.code === "SU-01")?.criteria).toEqual([{ attribute: "springRatingKg", op: "between", value: [350, 450], unit: "kg" }]);
    const deps = await database.select().from(lineDependencies).where(eq(lineDependencies.lineId, (springs.json as { id: string }).id));
    expect(deps.map((d) => d.dependsOnLineId)).toEqual([tyresId]);
  });

  it("names each bad field of a line (422)", async () => {
    const { status, json } = await addLine(editionId, { code: "", title: "x", category: "cargo", requirement: "must_fit", quantity: 0, massKg: -1, massKind: "constant", standardCostCents: 1.5 });
    expect(status).toBe(422);
    expect(err(json).details.map((d) => d.field).sort()).toEqual(["category", "code", "massKg", "quantity", "standardCostCents"]);
    expect(await database.$count(editionLines, eq(editionLines.editionId, editionId))).toBe(3);
  });

  it("reads the line form's text fields: dollars to cents, criteria rows, ticked boxes", async () => {
    const { status, json } = await addLine(editionId, {
      code: "ST-01",
      title: "Fridge slide",
      category: "storage",
      requirement: "must_fit",
      quantity: "1",
      massKg: "18.5",
      xMm: "",
      zone: "tub",
      "criteria.0.attribute": "slideRatingKg",
      "criteria.0.op": "between",
      "criteria.0.value": "80",
      "criteria.0.high": "120",
      "criteria.0.unit": "kg",
      "criteria.1.attribute": "",
      "criteria.1.op": "gte",
      "criteria.1.value": "",
      evidenceNeeded: ["photo", "certificate"],
      standardCost: "1,250.50",
      checkable: "true",
      expiryMonths: "",
    });
    expect(status).toBe(201);
    const row = await database.query.editionLines.findFirst({ where: eq(editionLines.id, (json as { id: string }).id) });
    // Money in integer cents: $1,250.50 → 125,050 c (Rigline rule).
    expect(row).toMatchObject({ standardCostCents: 125_050, massKg: 18.5, xMm: null, zone: "tub", checkable: true, expiryMonths: null, evidenceNeeded: ["photo", "certificate"] });
    expect(row?.criteria).toEqual([{ attribute: "slideRatingKg", op: "between", value: [80, 120], unit: "kg" }]);
    await callRoute(deleteLineRoute, { user: manager, method: "DELETE", params: { id: editionId, lineId: row!.id } });
  });

  it("names every bad field of the form at once, the dollar amount among them", async () => {
    const { status, json } = await addLine(editionId, { code: "", title: "Fridge slide", category: "storage", requirement: "must_fit", quantity: "1", massKg: "2", zone: "tub", standardCost: "12.345" });
    expect(status).toBe(422);
    expect(err(json).details.map((d) => d.field).sort()).toEqual(["code", "standardCost"]);
  });

  it("refuses a dependency cycle, naming the lines, and saves nothing", async () => {
    const lines = await database.select().from(editionLines).where(eq(editionLines.editionId, editionId));
    const tyres = lines.find((l) => l.code === "TY-01")!;
    const springs = lines.find((l) => l.code === "SU-01")!;
    const { status, json } = await callRoute(patchLineRoute, { user: manager, method: "PATCH", params: { id: editionId, lineId: tyres.id }, body: { dependsOn: [springs.id] } });
    expect(status).toBe(422);
    expect(err(json).message).toContain('TY-01 "Highway tyres"');
    expect(err(json).message).toContain('SU-01 "Rear springs"');
    expect(err(json).details[0]?.field).toBe("dependsOn");
    expect(await database.$count(lineDependencies, eq(lineDependencies.lineId, tyres.id))).toBe(0);
  });

  it("refuses to delete a line another line depends on, naming the dependent line", async () => {
    const lines = await database.select().from(editionLines).where(eq(editionLines.editionId, editionId));
    const tyres = lines.find((l) => l.code === "TY-01")!;
    const { status, json } = await callRoute(deleteLineRoute, { user: manager, method: "DELETE", params: { id: editionId, lineId: tyres.id } });
    expect(status).toBe(409);
    expect(err(json).message).toContain('SU-01 "Rear springs" depends on it');
    expect(await database.$count(editionLines, eq(editionLines.id, tyres.id))).toBe(1);
  });

  it("changes a line partly (PATCH keeps the other fields and the key)", async () => {
    const before = (await database.select().from(editionLines).where(and(eq(editionLines.editionId, editionId), eq(editionLines.code, "SF-01"))))[0]!;
    const { status } = await callRoute(patchLineRoute, { user: manager, method: "PATCH", params: { id: editionId, lineId: before.id }, body: { standardCostCents: 12_500 } });
    expect(status).toBe(200);
    const after = (await database.select().from(editionLines).where(eq(editionLines.id, before.id)))[0]!;
    expect(after).toMatchObject({ standardCostCents: 12_500, key: before.key, title: "First-aid kit", checkable: true, expiryMonths: 12 });
  });

  it("publishes in one step; the published edition then refuses every edit with 409", async () => {
    const published = await callRoute(publishRoute, { user: manager, params: { id: editionId } });
    expect(published.status).toBe(200);
    const row = await database.query.editions.findFirst({ where: eq(editions.id, editionId) });
    expect(row).toMatchObject({ status: "published", publishedBy: manager.userId });
    expect(row?.publishedAt).toBeInstanceOf(Date);

    const lines = await database.select().from(editionLines).where(eq(editionLines.editionId, editionId));
    const add = await addLine(editionId, line("RC-01", "Snatch strap"));
    expect(add.status).toBe(409);
    expect(err(add.json).message).toMatch(/never changes/);
    const patch = await callRoute(patchLineRoute, { user: manager, method: "PATCH", params: { id: editionId, lineId: lines[0]!.id }, body: { title: "Changed" } });
    expect(patch.status).toBe(409);
    const del = await callRoute(deleteLineRoute, { user: manager, method: "DELETE", params: { id: editionId, lineId: lines[0]!.id } });
    expect(del.status).toBe(409);
    const again = await callRoute(publishRoute, { user: manager, params: { id: editionId } });
    expect(again.status).toBe(409);
    expect(await database.$count(editionLines, eq(editionLines.editionId, editionId))).toBe(3);
  });

  it("starts a new draft copied from the published edition, keys kept, ids new", async () => {
    const { status, json } = await callRoute(newDraftRoute, { user: manager, params: { id: standardId }, body: {} });
    expect(status).toBe(201);
    const draft = json as { id: string; number: number; lines: number };
    expect(draft).toMatchObject({ number: 2, lines: 3 });
    const a = await database.select().from(editionLines).where(eq(editionLines.editionId, editionId));
    const b = await database.select().from(editionLines).where(eq(editionLines.editionId, draft.id));
    expect(b.map((l) => l.key).sort()).toEqual(a.map((l) => l.key).sort());
    expect(b.some((l) => a.some((x) => x.id === l.id))).toBe(false);
    // The dependency moved to the copied lines.
    const springsB = b.find((l) => l.code === "SU-01")!;
    const [dep] = await database.select().from(lineDependencies).where(eq(lineDependencies.lineId, springsB.id));
    expect(b.find((l) => l.id === dep?.dependsOnLineId)?.code).toBe("TY-01");
    // Only one draft at a time.
    const second = await callRoute(newDraftRoute, { user: manager, params: { id: standardId }, body: {} });
    expect(second.status).toBe(409);
  });

  it("compares two editions line by line: added, removed, changed with before → after", async () => {
    const standard = (await callRoute(standardRoute, { user: manager, params: { id: standardId } })).json as { editions: { id: string; number: number }[] };
    const draftId = standard.editions.find((e) => e.number === 2)!.id;
    const draftLines = await database.select().from(editionLines).where(eq(editionLines.editionId, draftId));
    const kit = draftLines.find((l) => l.code === "SF-01")!;
    await callRoute(patchLineRoute, { user: manager, method: "PATCH", params: { id: draftId, lineId: kit.id }, body: { quantity: 2 } });
    await callRoute(deleteLineRoute, { user: manager, method: "DELETE", params: { id: draftId, lineId: draftLines.find((l) => l.code === "SU-01")!.id } });
    await addLine(draftId, line("RC-01", "Snatch strap"));
    const { status, json } = await callRoute(compareRoute, { user: finance, url: `http://localhost/api/editions/compare?a=${editionId}&b=${draftId}` });
    expect(status).toBe(200);
    const c = json as { added: { code: string }[]; removed: { code: string }[]; changed: { code: string; changes: { field: string; before: unknown; after: unknown }[] }[]; counts: Record<string, number> };
    expect(c.added.map((l) => l.code)).toEqual(["RC-01"]);
    expect(c.removed.map((l) => l.code)).toEqual(["SU-01"]);
    expect(c.changed).toEqual([expect.objectContaining({ code: "SF-01", changes: [{ field: "quantity", before: 1, after: 2 }] })]);
    expect(c.counts).toEqual({ added: 1, removed: 1, changed: 1, unchanged: 1 });
  });
});

describe("roll-out", () => {
  let draftId = "";
  let e1Id = "";

  beforeAll(async () => {
    const standard = await database.query.standards.findFirst({ where: and(eq(standards.orgId, manager.orgId), eq(standards.name, "Remote duty fit-out")) });
    const rows = await database.select().from(editions).where(eq(editions.standardId, standard!.id));
    draftId = rows.find((e) => e.number === 2)!.id;
    e1Id = rows.find((e) => e.number === 1)!.id;
  });

  it("refuses to roll out a draft (409)", async () => {
    const { status } = await callRoute(rolloutRoute, { user: manager, params: { id: draftId }, body: { vehicleIds: [await idOf("MH-002")], dryRun: true } });
    expect(status).toBe(409);
  });

  it("a dry run previews new short lines, cost and mass per vehicle and in total, and writes nothing", async () => {
    await callRoute(publishRoute, { user: manager, params: { id: draftId } });
    const ids = [await idOf("MH-002"), await idOf("MH-037")];
    const auditsBefore = await database.$count(auditEntries);
    const { status, json } = await callRoute(rolloutRoute, { user: manager, params: { id: draftId }, body: { vehicleIds: ids, dryRun: true } });
    expect(status).toBe(200);
    const preview = json as {
      dryRun: boolean;
      assigned: number;
      totals: { vehicles: number; costCents: number; addedMassKg: number; shortLines: number };
      vehicles: { fleetNumber: string; shortLines: { code: string; costCents: number; addedMassKg: number }[]; offSpecLines: { code: string }[]; costCents: number; addedMassKg: number }[];
    };
    expect(preview).toMatchObject({ dryRun: true, assigned: 0 });
    const mh002 = preview.vehicles.find((v) => v.fleetNumber === "MH-002")!;
    // Edition 2 against a vehicle that fully meets edition 1 (db/seed/standards.ts, by hand):
    // HF radio (now must fit) $4,550.00 and 8 kg; snake-bite kit $55.00 and 0.4 kg → short 2,
    // $4,605.00, 8.4 kg. The stronger snatch strap (11,000 kg) makes its 8,000 kg strap off-spec.
    expect(mh002.shortLines.map((l) => l.code).sort()).toEqual(["CM-03", "SF-07"]);
    expect(mh002.costCents).toBe(455_000 + 5_500);
    expect(mh002.addedMassKg).toBeCloseTo(8.4, 6);
    expect(mh002.offSpecLines.map((l) => l.code)).toEqual(["RC-01"]);
    expect(preview.totals.vehicles).toBe(2);
    expect(preview.totals.costCents).toBe(preview.vehicles.reduce((n, v) => n + v.costCents, 0));
    // Nothing was written.
    expect((await database.query.vehicles.findFirst({ where: eq(vehicles.id, ids[0]!) }))?.editionId).toBe(e1Id);
    expect(await database.$count(auditEntries)).toBe(auditsBefore);
  });

  it("a roll-out naming a vehicle it cannot find writes nothing at all", async () => {
    const ids = [await idOf("MH-002"), "no-such-vehicle"];
    const { status, json } = await callRoute(rolloutRoute, { user: manager, params: { id: draftId }, body: { vehicleIds: ids, dryRun: false } });
    expect(status).toBe(422);
    expect(err(json).details[0]?.field).toBe("vehicleIds");
    expect((await database.query.vehicles.findFirst({ where: eq(vehicles.id, ids[0]!) }))?.editionId).toBe(e1Id);
  });

  it("the real roll-out assigns every vehicle in one transaction with an audit entry each, and variance follows", async () => {
    const ids = [await idOf("MH-002"), await idOf("MH-003"), await idOf("MH-037")];
    const { status, json } = await callRoute(rolloutRoute, { user: manager, params: { id: draftId }, body: { vehicleIds: ids, dryRun: false } });
    expect(status).toBe(200);
    expect(json).toMatchObject({ dryRun: false, assigned: 3 });
    const [{ n }] = (await database.select({ n: count() }).from(vehicles).where(eq(vehicles.editionId, draftId))) as [{ n: number }];
    expect(n).toBe(3);
    const entries = await database.select().from(auditEntries).where(eq(auditEntries.action, "vehicle.assign_edition"));
    expect(entries.map((e) => e.entityId).sort()).toEqual([...ids].sort());
    expect(entries.find((e) => e.entityId === ids[0])?.before).toEqual({ editionId: e1Id });
    const variance = (await callRoute(varianceRoute, { user: manager, params: { id: ids[0]! } })).json as { editionId: string; summary: { short: number; offSpec: number } };
    expect(variance.editionId).toBe(draftId);
    expect(variance.summary).toMatchObject({ short: 2, offSpec: 1 });
  });
});

describe("who may touch standards", () => {
  it("a driver and a contractor cannot create, edit or publish (403)", async () => {
    const standard = await database.query.standards.findFirst({ where: eq(standards.orgId, manager.orgId) });
    const [edition] = await database.select().from(editions).where(eq(editions.standardId, standard!.id));
    for (const user of [driver, contractor]) {
      expect((await callRoute(createStandardRoute, { user, body: { name: "Mine" } })).status).toBe(403);
      expect((await addLine(edition!.id, line("X-01", "Anything"), user)).status).toBe(403);
      expect((await callRoute(publishRoute, { user, params: { id: edition!.id } })).status).toBe(403);
      expect((await callRoute(rolloutRoute, { user, params: { id: edition!.id }, body: { vehicleIds: ["x"], dryRun: true } })).status).toBe(403);
      expect((await callRoute(listStandardsRoute, { user })).status).toBe(403);
    }
  });

  it("finance reads standards but cannot change them", async () => {
    const list = await callRoute(listStandardsRoute, { user: finance });
    expect(list.status).toBe(200);
    expect((list.json as { items: { name: string }[] }).items.map((s) => s.name)).toContain("Remote duty fit-out");
    expect((await callRoute(createStandardRoute, { user: finance, body: { name: "Finance standard" } })).status).toBe(403);
  });

  it("a driver reads only the checkable lines of an edition their vehicle is on", async () => {
    const vehicle = await database.query.vehicles.findFirst({ where: eq(vehicles.fleetNumber, "MH-001") });
    const { status, json } = await callRoute(editionRoute, { user: driver, params: { id: vehicle!.editionId! } });
    expect(status).toBe(200);
    const lines = (json as { lines: { code: string; checkable: boolean }[] }).lines;
    expect(lines.length).toBeGreaterThan(0);
    expect(lines.every((l) => l.checkable)).toBe(true);
    expect(lines.map((l) => l.code)).toContain("SF-01");
  });

  it("another organisation's edition and standard are not found (404)", async () => {
    const standard = await database.query.standards.findFirst({ where: eq(standards.orgId, manager.orgId) });
    const [edition] = await database.select().from(editions).where(eq(editions.standardId, standard!.id));
    expect((await callRoute(editionRoute, { user: otherManager, params: { id: edition!.id } })).status).toBe(404);
    expect((await callRoute(standardRoute, { user: otherManager, params: { id: standard!.id } })).status).toBe(404);
    expect((await addLine(edition!.id, line("X-01", "Anything"), otherManager)).status).toBe(404);
    expect((await callRoute(publishRoute, { user: otherManager, params: { id: edition!.id } })).status).toBe(404);
    const compare = await callRoute(compareRoute, { user: otherManager, url: `http://localhost/api/editions/compare?a=${edition!.id}&b=${edition!.id}` });
    expect(compare.status).toBe(404);
  });
});
