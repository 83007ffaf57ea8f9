import { describe, expect, it, vi } from "vitest";
import { GET as listVehicles } from "@/app/api/vehicles/route";
import { readinessByVehicle } from "@/db/readiness";
import { useTestDatabase } from "../helpers/db";
import { callRoute, requestUser } from "../helpers/route";
import { signedInAs } from "../helpers/users";

vi.mock("@/lib/server/session", async (original) => ({
  ...(await original<typeof import("@/lib/server/session")>()),
  currentUser: async () => requestUser.current,
}));

const database = await useTestDatabase();

type Page = { items: { id: string }[]; total: number };

describe("register filter by trip readiness", () => {
  it("lists exactly the vehicles in each readiness state, and the three states cover the register", async () => {
    const manager = await signedInAs(database, "manager@mirrabel-health.example");
    const all = (await callRoute(listVehicles, { user: manager, url: "http://localhost/api/vehicles?pageSize=100" })).json as Page;
    let covered = 0;
    for (const state of ["ready", "limited", "not_ready"] as const) {
      const { status, json } = await callRoute(listVehicles, { user: manager, url: `http://localhost/api/vehicles?pageSize=100&readiness=${state}` });
      expect(status).toBe(200);
      const page = json as Page;
      const judged = await readinessByVehicle(database, manager, page.items.map((i) => i.id), new Date());
      for (const item of page.items) expect(judged.get(item.id)?.state, item.id).toBe(state);
      covered += page.total;
    }
    expect(covered).toBe(all.total);
  });

  it("refuses an unknown readiness value naming the field", async () => {
    const manager = await signedInAs(database, "manager@mirrabel-health.example");
    const { status, json } = await callRoute(listVehicles, { user: manager, url: "http://localhost/api/vehicles?readiness=maybe" });
    expect(status).toBe(422);
    expect((json as { error: { details: { field: string }[] } }).error.details[0]?.field).toBe("readiness");
  });
});
