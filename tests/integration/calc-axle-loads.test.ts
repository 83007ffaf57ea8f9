import { describe, expect, it, vi } from "vitest";
import { POST as axleLoadsRoute } from "@/app/api/calc/axle-loads/route";
import { useTestDatabase } from "../helpers/db";
import { callRoute, requestUser } from "../helpers/route";
import { signedInAs } from "../helpers/users";

vi.mock("@/lib/server/session", async (original) => ({
  ...(await original<typeof import("@/lib/server/session")>()),
  currentUser: async () => requestUser.current,
}));

const database = await useTestDatabase();
const manager = await signedInAs(database, "manager@mirrabel-health.example");

type AxleResult = {
  frontKg: number;
  rearKg: number;
  grossKg: number;
  headroom: { frontKg: number; rearKg: number; gvmKg: number; gcmKg?: number };
  binding: { limit: string; marginKg: number };
  caution: string;
};
type ErrorJson = { error: { code: string; message: string; details: { field?: string; message: string }[] } };

// Invented vehicle: wheelbase 3000 mm, 1200 kg front / 950 kg rear before the items (2150 kg).
const vehicle = {
  wheelbaseMm: 3000,
  base: { frontKg: 1200, rearKg: 950 },
  ratings: { frontKg: 1450, rearKg: 1880, gvmKg: 3100, gcmKg: 5900 },
};

const post = (body: unknown) => callRoute(axleLoadsRoute, { user: manager, url: "http://localhost/api/calc/axle-loads", body });

describe("POST /api/calc/axle-loads", () => {
  it("adds one item by the lever rule: 100 kg at 1.0 m on WB 3.0 m → 66.67 / 33.33 kg", async () => {
    const { status, json } = await post({ ...vehicle, items: [{ label: "drawer system", massKg: 100, xMm: 1000 }] });
    expect(status).toBe(200);
    const r = json as AxleResult;
    // Lever rule, statics of a simply supported beam (C): front 66.67, rear 33.33 kg
    expect(r.frontKg - 1200).toBeCloseTo(66.67, 2);
    expect(r.rearKg - 950).toBeCloseTo(33.33, 2);
    expect(r.grossKg).toBeCloseTo(2250, 9);
  });

  it("behind the rear axle an item unloads the front: 100 kg at 3.8 m on WB 3.0 m → −26.67 / 126.67 kg", async () => {
    const { status, json } = await post({ ...vehicle, items: [{ label: "second spare", massKg: 100, xMm: 3800 }] });
    expect(status).toBe(200);
    const r = json as AxleResult;
    // Lever rule, statics of a simply supported beam (C): front −26.67, rear 126.67 kg
    expect(r.frontKg - 1200).toBeCloseTo(-26.67, 2);
    expect(r.rearKg - 950).toBeCloseTo(126.67, 2);
  });

  it("the beam textbook case: 10 kN at 1 m on a 4 m span → 7.5 kN / 2.5 kN", async () => {
    const { status, json } = await post({
      wheelbaseMm: 4000,
      base: { frontKg: 0, rearKg: 0 },
      ratings: { frontKg: 20_000, rearKg: 20_000, gvmKg: 40_000 },
      items: [{ massKg: 10_000, xMm: 1000 }],
    });
    expect(status).toBe(200);
    const r = json as AxleResult;
    // Lever rule, statics of a simply supported beam (S, beam textbook example); units carry through
    expect(r.frontKg).toBeCloseTo(7500, 9);
    expect(r.rearKg).toBeCloseTo(2500, 9);
    expect(r.headroom.gcmKg).toBeUndefined();
  });

  it("the towing case: vehicle 2,968 kg ≤ GVM 3,100; combination 5,218 kg ≤ GCM 5,900", async () => {
    // ADR Definitions and Vehicle Categories (S); Qld mass regulation 2005 s 48(2) (P); case (C):
    // tare 2,150 + fit-out 350 + occupants 160 + 70 L diesel × 0.832 = 58 + towball 250 = 2,968;
    // GTM = 2,500 − 250 = 2,250; combination 2,968 + 2,250 = 5,218.
    const { status, json } = await post({
      ...vehicle,
      items: [
        { label: "fit-out", massKg: 350, xMm: 2400 },
        { label: "occupants", massKg: 160, xMm: 1100 },
        { label: "diesel 70 L", massKg: 70 * 0.832, xMm: 1500 },
      ],
      trailer: { atmKg: 2500, towballKg: 250 },
    });
    expect(status).toBe(200);
    const r = json as AxleResult;
    expect(Math.round(r.grossKg)).toBe(2968);
    expect(r.headroom.gvmKg).toBeGreaterThan(0);
    expect(Math.round(5900 - (r.headroom.gcmKg ?? Number.NaN))).toBe(5218);
    expect(r.headroom.gcmKg).toBeGreaterThan(0);
    // Front + rear is the gross (lever rule, S), and the limit with the least headroom binds.
    expect(r.frontKg + r.rearKg).toBeCloseTo(r.grossKg, 6);
    const margins = { gvm: r.headroom.gvmKg, front: r.headroom.frontKg, rear: r.headroom.rearKg, gcm: r.headroom.gcmKg ?? Infinity };
    expect(r.binding.marginKg).toBeCloseTo(Math.min(...Object.values(margins)), 9);
    expect(margins[r.binding.limit as keyof typeof margins]).toBeCloseTo(r.binding.marginKg, 9);
  });

  it("returns the caution with the result", async () => {
    const { json } = await post({ ...vehicle, items: [] });
    expect((json as AxleResult).caution).toMatch(/Planning aid only/);
    expect((json as AxleResult).caution).toMatch(/weighbridge/);
  });

  it("answers 422 naming the field for a negative mass", async () => {
    const { status, json } = await post({ ...vehicle, items: [{ massKg: 20, xMm: 0 }, { label: "bar", massKg: -70, xMm: -600 }] });
    expect(status).toBe(422);
    const body = json as ErrorJson;
    expect(body.error.code).toBe("validation_failed");
    expect(body.error.details.map((d) => d.field)).toContain("items.1.massKg");
    expect(body.error.details.find((d) => d.field === "items.1.massKg")?.message).toMatch(/negative/);
  });

  it("answers 422 naming the field for a towball download above the ATM and for a missing rating", async () => {
    const ball = await post({ ...vehicle, items: [], trailer: { atmKg: 100, towballKg: 200 } });
    expect(ball.status).toBe(422);
    expect((ball.json as ErrorJson).error.details[0]?.field).toBe("trailer.towballKg");
    const noGvm = await post({ ...vehicle, ratings: { frontKg: 1450, rearKg: 1880 }, items: [] });
    expect(noGvm.status).toBe(422);
    expect((noGvm.json as ErrorJson).error.details.map((d) => d.field)).toContain("ratings.gvmKg");
  });
});
