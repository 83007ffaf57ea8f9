import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, it, vi } from "vitest";
import { POST as chooseRoute } from "@/app/api/rule-sets/[id]/choose/route";
import { PATCH as patchRoute } from "@/app/api/rule-sets/[id]/route";
import { GET as listRoute, POST as copyRoute } from "@/app/api/rule-sets/route";
import { GET as massRoute } from "@/app/api/vehicles/[id]/mass/route";
import { seedRuleSets } from "@/db/rule-sets";
import { auditEntries, organisations, ruleSets, vehicles } from "@/db/schema";
import type { MassResponse } from "@/lib/commands/mass";
import { EXAMPLE_RULE_SETS, liftCheck, type RuleSet } from "@/lib/rules";
import { useTestDatabase } from "../helpers/db";
import { callRoute, requestUser } from "../helpers/route";
import { signedInAs } from "../helpers/users";

vi.mock("@/lib/server/session", async (original) => ({
  ...(await original<typeof import("@/lib/server/session")>()),
  currentUser: async () => requestUser.current,
}));

const database = await useTestDatabase();
type Signed = Awaited<ReturnType<typeof signedInAs>>;
let admin: Signed;
let manager: Signed;
let finance: Signed;
let driver: Signed;
let contractor: Signed;
let otherAdmin: Signed;

type Listed = { items: { id: string; name: string; shipped: boolean; orgId: string | null; rules: RuleSet }[]; inUseId: string; chosen: boolean };

beforeAll(async () => {
  admin = await signedInAs(database, "admin@mirrabel-health.example");
  manager = await signedInAs(database, "manager@mirrabel-health.example");
  finance = await signedInAs(database, "finance@mirrabel-health.example");
  driver = await signedInAs(database, "driver@mirrabel-health.example");
  contractor = await signedInAs(database, "contractor@tallowbark-fitout.example");
  otherAdmin = await signedInAs(database, "admin@gidgee-trust.example");
});

describe("rule sets", () => {
  it("are seeded once as the shipped examples, whatever the number of seed runs", async () => {
    await seedRuleSets(database);
    const rows = await database.select().from(ruleSets);
    expect(rows.filter((r) => r.orgId === null).map((r) => r.id).sort()).toEqual(EXAMPLE_RULE_SETS.map((r) => r.id).sort());
    expect(rows.every((r) => r.exampleOnly)).toBe(true);
  });

  it("are listed to admin, manager and finance, and refused to drivers and contractors", async () => {
    for (const user of [admin, manager, finance]) {
      const { status, json } = await callRoute(listRoute, { user });
      expect(status).toBe(200);
      const listed = json as Listed;
      expect(listed.items.filter((i) => i.shipped)).toHaveLength(EXAMPLE_RULE_SETS.length);
      expect(listed.chosen).toBe(false);
      expect(listed.inUseId).toBe(EXAMPLE_RULE_SETS[0]!.id);
    }
    for (const user of [driver, contractor]) expect((await callRoute(listRoute, { user })).status).toBe(403);
  });

  it("lets the admin choose the organisation's set; a manager may not", async () => {
    const setB = EXAMPLE_RULE_SETS[1]!;
    expect((await callRoute(chooseRoute, { user: manager, params: { id: setB.id } })).status).toBe(403);
    const { status } = await callRoute(chooseRoute, { user: admin, params: { id: setB.id } });
    expect(status).toBe(200);
    const org = await database.query.organisations.findFirst({ where: eq(organisations.id, admin.orgId) });
    expect(org?.ruleSetId).toBe(setB.id);
    const audit = await database.query.auditEntries.findFirst({ where: eq(auditEntries.action, "ruleSet.choose") });
    expect(audit).toMatchObject({ actorId: admin.userId, after: { ruleSetId: setB.id } });
    // The vehicle figures name the set in use.
    const vehicle = await database.query.vehicles.findFirst({ where: eq(vehicles.fleetNumber, "MH-039") });
    const mass = await callRoute(massRoute, { user: manager, params: { id: vehicle!.id }, url: "http://localhost/x" });
    expect((mass.json as MassResponse).ruleSet).toMatchObject({ id: setB.id, name: setB.name, chosen: true });
    // Another organisation keeps its own choice.
    const other = await callRoute(listRoute, { user: otherAdmin });
    expect((other.json as Listed).chosen).toBe(false);
    expect((await callRoute(chooseRoute, { user: admin, params: { id: "no-such-set" } })).status).toBe(404);
  });

  it("copies a set into an editable one the organisation owns, and validates edits by field", async () => {
    const source = EXAMPLE_RULE_SETS[0]!;
    const copied = await callRoute(copyRoute, { user: admin, body: { copyFromId: source.id, name: "Our state rules" } });
    expect(copied.status).toBe(201);
    const copyId = (copied.json as { id: string }).id;
    const row = await database.query.ruleSets.findFirst({ where: eq(ruleSets.id, copyId) });
    expect(row).toMatchObject({ orgId: admin.orgId, name: "Our state rules", exampleOnly: true });

    for (const [body, field] of [
      [{ combinedLiftMaxMm: "lots" }, "combinedLiftMaxMm"],
      [{ tyreLiftShareMaxMm: 80 }, "tyreLiftShareMaxMm"], // more than the 75 mm combined limit
      [{ suspensionLiftMaxTravelFraction: 1.5 }, "suspensionLiftMaxTravelFraction"],
      [{ name: "" }, "name"],
      [{ tyreDiameterIncreaseMaxMm: "" }, "tyreDiameterIncreaseMaxMm"], // clearing the only diameter limit
    ] as const) {
      const { status, json } = await callRoute(patchRoute, { user: admin, method: "PATCH", params: { id: copyId }, body });
      expect(status, JSON.stringify(body)).toBe(422);
      expect((json as { error: { details: { field: string }[] } }).error.details.map((d) => d.field)).toContain(field);
    }
    expect((await database.query.ruleSets.findFirst({ where: eq(ruleSets.id, copyId) }))?.limits).toEqual(row?.limits);

    const edited = await callRoute(patchRoute, {
      user: admin,
      method: "PATCH",
      params: { id: copyId },
      body: { combinedLiftMaxMm: "80", suspensionLiftMaxTravelFraction: "1/3", tyreDiameterIncreaseMaxPct: 7 },
    });
    expect(edited.status).toBe(200);
    const listed = (await callRoute(listRoute, { user: finance })).json as Listed;
    const mine = listed.items.find((i) => i.id === copyId)!;
    expect(mine).toMatchObject({ shipped: false, name: "Our state rules" });
    expect(mine.rules).toMatchObject({ combinedLiftMaxMm: 80, tyreDiameterIncreaseMaxMm: 50, tyreDiameterIncreaseMaxPct: 7, exampleOnly: true });
    expect(mine.rules.suspensionLiftMaxTravelFraction).toBeCloseTo(1 / 3, 12);
    // The edited set decides the lift check. Queensland guidance (S): tyre lift = ½ × diameter
    // increase; 50 mm suspension + 60 mm more diameter → 80 mm, within this set's 80 mm.
    const lift = liftCheck({ suspensionLiftMm: 50, tyreDiameterIncreaseMm: 60 }, mine.rules);
    expect(lift.combinedLiftMm).toBe(80);
    expect(lift.findings.find((f) => f.code === "combined-lift")?.severity).toBe("ok");

    // Chosen, it is the set in use.
    expect((await callRoute(chooseRoute, { user: admin, params: { id: copyId } })).status).toBe(200);
    expect(((await callRoute(listRoute, { user: manager })).json as Listed).inUseId).toBe(copyId);
  });

  it("never changes a shipped set, nor another organisation's", async () => {
    const shipped = EXAMPLE_RULE_SETS[2]!;
    const refused = await callRoute(patchRoute, { user: admin, method: "PATCH", params: { id: shipped.id }, body: { combinedLiftMaxMm: 100 } });
    expect(refused.status).toBe(409);
    const mine = ((await callRoute(listRoute, { user: admin })).json as Listed).items.find((i) => !i.shipped)!;
    expect((await callRoute(patchRoute, { user: otherAdmin, method: "PATCH", params: { id: mine.id }, body: { combinedLiftMaxMm: 1 } })).status).toBe(404);
    expect((await callRoute(chooseRoute, { user: otherAdmin, params: { id: mine.id } })).status).toBe(404);
    expect(((await callRoute(listRoute, { user: otherAdmin })).json as Listed).items.some((i) => i.id === mine.id)).toBe(false);
    expect((await callRoute(patchRoute, { user: manager, method: "PATCH", params: { id: mine.id }, body: { combinedLiftMaxMm: 1 } })).status).toBe(403);
  });
});
