import { eq } from "drizzle-orm";
import { describe, expect, it, vi } from "vitest";
import { vehicles } from "@/db/schema";
import { GET as getVehicleRoute } from "@/app/api/vehicles/[id]/route";
import { GET as listUsersRoute } from "@/app/api/users/route";
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

describe("API conventions", () => {
  it("answers 401 in the one error shape when nobody is signed in", async () => {
    const { status, json } = await callRoute(listUsersRoute, { user: null });
    expect(status).toBe(401);
    expect(json).toMatchObject({ error: { code: "unauthenticated" } });
    expect(json).toEqual(errorShape);
  });

  it("answers 403 to a role the permission table refuses", async () => {
    for (const email of ["driver@mirrabel-health.example", "contractor@tallowbark-fitout.example", "finance@mirrabel-health.example"]) {
      const { status, json } = await callRoute(listUsersRoute, { user: await signedInAs(database, email) });
      expect(status, email).toBe(403);
      expect(json).toMatchObject({ error: { code: "forbidden" } });
    }
  });

  it("answers 200 to a role the table allows, scoped to its organisation", async () => {
    const { status, json } = await callRoute(listUsersRoute, { user: await signedInAs(database, "manager@gidgee-trust.example") });
    expect(status).toBe(200);
    const items = (json as { items: { email: string }[] }).items;
    expect(items.length).toBe(5);
    expect(items.every((i) => !i.email.includes("mirrabel"))).toBe(true);
  });

  it("answers 404, not 403, for another organisation's record, so ids reveal nothing", async () => {
    const vehicle = await database.query.vehicles.findFirst({ where: eq(vehicles.fleetNumber, "MH-002") });
    const { status, json } = await callRoute(getVehicleRoute, {
      user: await signedInAs(database, "admin@gidgee-trust.example"),
      params: { id: vehicle!.id },
    });
    expect(status).toBe(404);
    expect(json).toEqual(errorShape);
  });

  it("answers 422 naming the field for a malformed id", async () => {
    const { status, json } = await callRoute(getVehicleRoute, {
      user: await signedInAs(database, "manager@mirrabel-health.example"),
      params: { id: "" },
    });
    expect(status).toBe(422);
    expect((json as { error: { details: { field: string }[] } }).error.details[0]?.field).toBe("id");
  });
});
