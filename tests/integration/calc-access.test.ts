import { describe, expect, it, vi } from "vitest";
import { POST as axleLoadsRoute } from "@/app/api/calc/axle-loads/route";
import { POST as batteryRoute } from "@/app/api/calc/battery/route";
import { POST as cableRoute } from "@/app/api/calc/cable/route";
import { POST as tyreChangeRoute } from "@/app/api/calc/tyre-change/route";
import { useTestDatabase } from "../helpers/db";
import { callRoute, requestUser } from "../helpers/route";
import { signedInAs } from "../helpers/users";

vi.mock("@/lib/server/session", async (original) => ({
  ...(await original<typeof import("@/lib/server/session")>()),
  currentUser: async () => requestUser.current,
}));

const database = await useTestDatabase();

const errorShape = {
  error: { code: expect.any(String), message: expect.any(String), details: expect.any(Array) },
};

// One valid body per calculator (invented figures; the computations are checked in the other files).
const endpoints = [
  {
    name: "axle-loads",
    handler: axleLoadsRoute,
    body: { wheelbaseMm: 3000, base: { frontKg: 1200, rearKg: 950 }, ratings: { frontKg: 1450, rearKg: 1880, gvmKg: 3100 }, items: [{ massKg: 70, xMm: -600 }] },
    resultKey: "binding",
  },
  { name: "tyre-change", handler: tyreChangeRoute, body: { from: "265/70R17", to: "285/70R17" }, resultKey: "speedometer" },
  { name: "cable", handler: cableRoute, body: { currentA: 20, lengthOneWayM: 5, systemV: 12 }, resultKey: "fuseA" },
  {
    name: "battery",
    handler: batteryRoute,
    body: { consumers: [{ label: "Camp fridge", powerW: 60, hoursPerDay: 12 }], systemV: 12, daysAutonomy: 2, chemistry: "agm" },
    resultKey: "plan",
  },
] as const;

const everyRole = [
  "admin@mirrabel-health.example",
  "manager@mirrabel-health.example",
  "finance@mirrabel-health.example",
  "driver@mirrabel-health.example",
  "contractor@tallowbark-fitout.example",
];

describe("calculator API access and error shape", () => {
  for (const endpoint of endpoints) {
    const url = `http://localhost/api/calc/${endpoint.name}`;

    it(`${endpoint.name}: 401 in the one error shape without a user`, async () => {
      const { status, json } = await callRoute(endpoint.handler, { user: null, url, body: endpoint.body });
      expect(status).toBe(401);
      expect(json).toEqual(errorShape);
      expect(json).toMatchObject({ error: { code: "unauthenticated" } });
    });

    it(`${endpoint.name}: 400 for a malformed JSON body`, async () => {
      const user = await signedInAs(database, "manager@mirrabel-health.example");
      const { status, json } = await callRoute(endpoint.handler, { user, url, body: '{"oops": ', headers: { "content-type": "application/json" } });
      expect(status).toBe(400);
      expect(json).toEqual(errorShape);
      expect(json).toMatchObject({ error: { code: "bad_request" } });
    });

    it(`${endpoint.name}: 422 in the one error shape for an empty body`, async () => {
      const user = await signedInAs(database, "manager@mirrabel-health.example");
      const { status, json } = await callRoute(endpoint.handler, { user, url, body: "" });
      expect(status).toBe(422);
      expect(json).toEqual(errorShape);
      const details = (json as { error: { details: { field?: string }[] } }).error.details;
      expect(details.length).toBeGreaterThan(0);
      expect(details.every((d) => typeof d.field === "string" && d.field.length > 0)).toBe(true);
    });

    it(`${endpoint.name}: every role may use it (200)`, async () => {
      for (const email of everyRole) {
        const { status, json } = await callRoute(endpoint.handler, { user: await signedInAs(database, email), url, body: endpoint.body });
        expect(status, email).toBe(200);
        expect(json as Record<string, unknown>, email).toHaveProperty(endpoint.resultKey);
        expect(typeof (json as { caution?: unknown }).caution, email).toBe("string");
      }
    });
  }

  it("gives the same answer to every organisation: nothing is stored or scoped", async () => {
    const body = endpoints[2].body;
    const a = await callRoute(cableRoute, { user: await signedInAs(database, "manager@mirrabel-health.example"), body });
    const b = await callRoute(cableRoute, { user: await signedInAs(database, "manager@gidgee-trust.example"), body });
    expect(a.status).toBe(200);
    expect(b.json).toEqual(a.json);
  });
});
