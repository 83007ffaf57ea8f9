import ExcelJS from "exceljs";
import Papa from "papaparse";
import { and, eq } from "drizzle-orm";
import { beforeAll, describe, expect, it, vi } from "vitest";
import { GET as varianceExportRoute } from "@/app/api/variance/export/route";
import { listFleetSnapshots, recordFleetSnapshot, recordTodaysSnapshot } from "@/db/costs";
import { fleetReadinessCounts } from "@/db/readiness";
import { fleetSnapshots, platforms, vehicles } from "@/db/schema";
import { loadFleetVariance } from "@/db/variance";
import { fleetTrends } from "@/lib/commands/costs";
import { UTF8_BOM } from "@/lib/spreadsheet";
import { execute } from "@/lib/server/operation";
import type { SignedIn } from "@/lib/server/session";
import { useTestDatabase } from "../helpers/db";
import { callRoute, requestUser } from "../helpers/route";
import { signedInAs } from "../helpers/users";

vi.mock("@/lib/server/session", async (original) => ({
  ...(await original<typeof import("@/lib/server/session")>()),
  currentUser: async () => requestUser.current,
}));

const database = await useTestDatabase();
let finance: SignedIn;

beforeAll(async () => {
  finance = await signedInAs(database, "finance@mirrabel-health.example");
  // A platform name a careless import could bring in, on one vehicle.
  const [vehicle] = await database.select().from(vehicles).where(and(eq(vehicles.orgId, finance.orgId), eq(vehicles.fleetNumber, "MH-012")));
  await database.update(platforms).set({ make: "=HYPERLINK(\"http://x\")" }).where(eq(platforms.id, vehicle!.platformId));
});

async function csvRows(response: Response): Promise<string[][]> {
  const text = new TextDecoder("utf-8", { ignoreBOM: true }).decode(await response.arrayBuffer());
  expect(text.startsWith(UTF8_BOM)).toBe(true);
  const parsed = Papa.parse<string[]>(text.slice(UTF8_BOM.length), { newline: "\r\n" });
  expect(parsed.errors).toEqual([]);
  return parsed.data;
}

const url = (query: string) => `http://localhost/api/variance/export?${query}`;

describe("GET /api/variance/export", () => {
  it("lists every vehicle's variance as CSV, the same as the fleet variance, with a totals row", async () => {
    const { status, response } = await callRoute(varianceExportRoute, { user: finance, url: url("format=csv") });
    expect(status).toBe(200);
    expect(response.headers.get("content-disposition")).toMatch(/^attachment; filename="rigline-variance-\d{4}-\d{2}-\d{2}\.csv"$/);
    const rows = await csvRows(response);
    const fleet = await loadFleetVariance(database, finance, {}, new Date());
    expect(rows[0]?.slice(0, 6)).toEqual(["Fleet no.", "Depot", "Platform", "Standard and edition", "Status", "Lines meeting"]);
    expect(rows).toHaveLength(fleet.details.length + 2);
    const byFleetNumber = new Map(rows.slice(1, -1).map((r) => [r[0], r]));
    for (const d of fleet.details) {
      const row = byFleetNumber.get(d.fleetNumber)!;
      expect(row, d.fleetNumber).toBeDefined();
      if (d.variance) expect(row.slice(5, 12).map(Number), d.fleetNumber).toEqual([d.variance.summary.meets, d.variance.summary.short, d.variance.summary.offSpec, d.variance.summary.unproven, d.variance.summary.concession, d.variance.summary.prohibitedFitted, d.variance.summary.extra]);
      else expect(row[4]).toBe("No standard assigned");
    }
    const totals = rows[rows.length - 1]!;
    expect(totals[0]).toBe(`${fleet.details.length} vehicles`);
    expect(totals[4]).toBe(`${fleet.overall.fullyMeeting} of ${fleet.overall.withEdition} meet`);
    expect(Math.round(Number(totals[12]) * 100)).toBe(fleet.overall.costToCloseCents);
    expect(Number(totals[6])).toBe(fleet.statusCounts.short);
  });

  it("neutralises formula-like names", async () => {
    const { response } = await callRoute(varianceExportRoute, { user: finance, url: url("format=csv") });
    const row = (await csvRows(response)).find((r) => r[0] === "MH-012")!;
    // OWASP CSV Injection; OWASP ASVS 5.0 V1.2.10; CWE-1236
    expect(row[2]).toMatch(/^'=HYPERLINK\("http:\/\/x"\)/);
  });

  it("writes XLSX with numbers as numbers and reads back equal to the fleet variance", async () => {
    const { status, response } = await callRoute(varianceExportRoute, { user: finance, url: url("format=xlsx") });
    expect(status).toBe(200);
    const workbook = new ExcelJS.Workbook();
    await workbook.xlsx.load(await response.arrayBuffer());
    const sheet = workbook.worksheets[0]!;
    expect(sheet.name).toBe("Fleet variance");
    const fleet = await loadFleetVariance(database, finance, {}, new Date());
    const byVehicle = new Map(fleet.vehicles.map((v) => [v.vehicleId, v]));
    fleet.details.forEach((d, i) => {
      const row = sheet.getRow(i + 2);
      expect(row.getCell(1).value).toBe(d.fleetNumber);
      const cost = row.getCell(13);
      expect(cost.type).toBe(ExcelJS.ValueType.Number);
      expect(Math.round((cost.value as number) * 100)).toBe(byVehicle.get(d.vehicleId)!.costToCloseCents);
      if (d.variance) {
        expect(row.getCell(7).type).toBe(ExcelJS.ValueType.Number);
        expect(row.getCell(7).value).toBe(d.variance.summary.short);
      }
    });
  });

  it("follows the depot filter", async () => {
    const someDepot = (await database.select().from(vehicles).where(eq(vehicles.orgId, finance.orgId)))[0]!.depotId!;
    const { response } = await callRoute(varianceExportRoute, { user: finance, url: url(`format=csv&depotId=${someDepot}`) });
    const rows = await csvRows(response);
    const fleet = await loadFleetVariance(database, finance, { depotId: someDepot }, new Date());
    expect(rows).toHaveLength(fleet.details.length + 2);
    expect(fleet.details.length).toBeLessThan((await loadFleetVariance(database, finance, {}, new Date())).details.length);
  });

  it("is refused to drivers and contractors (403) and to nobody signed in (401); another organisation sees only its own", async () => {
    for (const email of ["driver@mirrabel-health.example", "contractor@tallowbark-fitout.example"]) {
      const { status } = await callRoute(varianceExportRoute, { user: await signedInAs(database, email), url: url("format=csv") });
      expect(status, email).toBe(403);
    }
    expect((await callRoute(varianceExportRoute, { user: null, url: url("format=csv") })).status).toBe(401);
    expect((await callRoute(varianceExportRoute, { user: finance, url: url("format=ods") })).status).toBe(422);
    const gidgee = await callRoute(varianceExportRoute, { user: await signedInAs(database, "manager@gidgee-trust.example"), url: url("format=csv") });
    const rows = await csvRows(gidgee.response);
    expect(rows.slice(1, -1).every((r) => r[0]!.startsWith("GT-"))).toBe(true);
  });
});

describe("daily fleet figures", () => {
  it("were seeded for months back, one row a day with consistent counts", async () => {
    const rows = await listFleetSnapshots(database, finance);
    expect(rows.length).toBeGreaterThanOrEqual(90);
    const active = (await database.select().from(vehicles).where(eq(vehicles.orgId, finance.orgId))).filter((v) => v.state !== "retired").length;
    for (const r of rows) {
      expect(r.ready + r.limited + r.notReady, r.day).toBe(active);
      expect(r.meetingStandard).toBeLessThanOrEqual(active);
    }
    expect(new Set(rows.map((r) => r.day)).size).toBe(rows.length);
  });

  it("records today's figures from live readiness and variance, once per day", async () => {
    const now = new Date();
    const figures = await recordTodaysSnapshot(database, finance.orgId, now);
    const readiness = await fleetReadinessCounts(database, finance, now);
    const variance = await loadFleetVariance(database, finance, {}, now);
    expect(figures).toEqual({
      day: now.toISOString().slice(0, 10),
      ready: readiness.ready,
      limited: readiness.limited,
      notReady: readiness.notReady,
      meetingStandard: variance.overall.fullyMeeting,
      openGaps: variance.statusCounts.short + variance.statusCounts.offSpec + variance.statusCounts.unproven + variance.statusCounts.prohibitedFitted,
    });
    await recordTodaysSnapshot(database, finance.orgId, now);
    const today = await database.select().from(fleetSnapshots).where(and(eq(fleetSnapshots.orgId, finance.orgId), eq(fleetSnapshots.day, figures.day)));
    expect(today).toHaveLength(1);
  });

  it("refuses impossible figures", async () => {
    await expect(recordFleetSnapshot(database, finance.orgId, { day: "2026-13-01", ready: 1, limited: 0, notReady: 0, meetingStandard: 0, openGaps: 0 })).rejects.toThrow();
    await expect(recordFleetSnapshot(database, finance.orgId, { day: "2026-01-01", ready: -1, limited: 0, notReady: 0, meetingStandard: 0, openGaps: 0 })).rejects.toThrow();
  });

  it("the trends read ends with today's figures, taking them if nobody has yet", async () => {
    const gidgee = await signedInAs(database, "finance@gidgee-trust.example");
    const today = new Date().toISOString().slice(0, 10);
    expect((await listFleetSnapshots(database, gidgee)).some((r) => r.day === today)).toBe(false);
    const { items } = await execute(fleetTrends, gidgee, {});
    expect(items[items.length - 1]?.day).toBe(today);
    expect(items.every((r) => r.day >= new Date(Date.now() - 366 * 86_400_000).toISOString().slice(0, 10))).toBe(true);
    await expect(execute(fleetTrends, await signedInAs(database, "contractor@quandong-road.example"), {})).rejects.toMatchObject({ code: "forbidden" });
  });
});
