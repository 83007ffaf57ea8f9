import { createHash } from "node:crypto";
import { mkdtempSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { and, eq, inArray } from "drizzle-orm";
import { afterAll, describe, expect, it, vi } from "vitest";
import { GET as downloadFile } from "@/app/api/imports/[id]/file/route";
import { GET as listHistory } from "@/app/api/imports/route";
import { GET as downloadTemplate } from "@/app/api/imports/template/route";
import { POST as importRoute } from "@/app/api/vehicles/import/route";
import { auditEntries, depots, importMappings, imports, platforms, vehicles } from "@/db/schema";
import { matchHeaders, parseSpreadsheet, validateRows } from "@/imports";
import type { ImportResult } from "@/lib/commands/imports";
import { diskStorage, setStorageForTests } from "@/lib/server/storage";
import { useTestDatabase } from "../helpers/db";
import { callRoute, requestUser } from "../helpers/route";
import { signedInAs } from "../helpers/users";

vi.mock("@/lib/server/session", async (original) => ({
  ...(await original<typeof import("@/lib/server/session")>()),
  currentUser: async () => requestUser.current,
}));

const database = await useTestDatabase();
const filesDir = mkdtempSync(join(tmpdir(), "rigline-import-files-"));
setStorageForTests(diskStorage(filesDir));
afterAll(() => {
  setStorageForTests(undefined);
  rmSync(filesDir, { recursive: true, force: true });
});

const manager = await signedInAs(database, "manager@mirrabel-health.example");
const sample = (name: string) => readFileSync(join(process.cwd(), "imports/samples", name));
const messyCsv = sample("vehicles-messy.csv");
const messyXlsx = sample("vehicles-messy.xlsx");

// The depots the messy register names (invented); "Gibber Flat, North Yard" is left out on purpose.
const orgId = manager.orgId;
await database.insert(depots).values([
  { orgId, code: "MLC", name: "Mulga Creek" },
  { orgId, code: "GBF", name: "Gibber Flat" },
  { orgId, code: "SBD", name: "Saltbush Downs" },
  { orgId, code: "RDG", name: "Red Gully" },
]);

function form(bytes: Buffer, filename: string, fields: Record<string, string> = {}): FormData {
  const body = new FormData();
  body.set("file", new File([new Uint8Array(bytes)], filename));
  for (const [name, value] of Object.entries(fields)) body.set(name, value);
  return body;
}

async function upload(bytes: Buffer, filename: string, fields: Record<string, string> = {}, user = manager) {
  const { status, json } = await callRoute(importRoute, { user, body: form(bytes, filename, fields), url: "http://localhost/api/vehicles/import" });
  return { status, result: json as ImportResult };
}

describe("vehicle import: the messy CSV sample", () => {
  it("dry run: reads the byte order mark, semicolons and quoted line breaks, and lists every bad row exactly", async () => {
    const { status, result } = await upload(messyCsv, "vehicles-messy.csv", { dryRun: "1" });
    expect(status).toBe(200);
    expect(result.dryRun).toBe(true);
    expect(result.format).toBe("csv");
    // UTF-8 byte order mark dropped: the first heading is the plain text (Unicode BOM, U+FEFF; common practice).
    expect(result.headers[0]).toBe("Fleet #");
    expect(result.headers).toHaveLength(18);
    expect(result.mapping["Fleet #"]).toBe("fleetNumber");
    expect(result.mapping["Chassis No."]).toBe("vin");
    expect(result.mapping["Base"]).toBe("depot");
    expect(result.unknownColumns).toEqual(["Fuel card"]);
    expect(result.unknownDepots).toEqual(["Gibber Flat, North Yard"]);
    expect(result.depotColumn).toBe("Base");
    // 9 data rows: the blank rows are not counted; the quoted line break stays inside row 3.
    expect(result.totalRows).toBe(9);
    expect(result.errors).toEqual([
      { row: 5, column: "Base", message: 'Depot "Gibber Flat, North Yard" is not a depot of this organisation (by name or code); correct the cell or have the depot added under Depots' },
      // ISO 3779 (S): a VIN has 17 characters.
      { row: 6, column: "Chassis No.", message: "A VIN has 17 characters; this one has 16." },
      { row: 7, column: "Odo (km)", message: "Odometer is -1,250 km; it cannot be negative" },
      { row: 9, column: "Fleet #", message: "Row 9 repeats row 5 exactly; only row 5 is imported" },
    ]);
    expect(result.valid).toBe(5);
    expect([result.created, result.updated, result.unchanged]).toEqual([5, 0, 0]);
    expect(result.rows.map((r) => [r.row, r.fleetNumber, r.action])).toEqual([
      [2, "MC-101", "create"],
      [3, "MC-102", "create"],
      [8, "RG-402", "create"],
      [10, "GF-203", "create"],
      [11, "SD-303", "create"],
    ]);
    expect(result.newPlatforms.map((p) => [p.make, p.model, p.variant, p.rowNumbers])).toEqual([
      ["Korrawa", "Dunecrest 70", "Single cab chassis", [2, 3]],
      ["Ostrovan", "Pindan 6", "Crew cab", [8]],
      ["Veltari", "Brolga 4", "Dual cab", [10, 11]],
    ]);
    const pindan = result.newPlatforms.find((p) => p.model === "Pindan 6")!;
    expect(pindan.missingRatings).toEqual(["gvmKg", "frontAxleRatingKg", "rearAxleRatingKg"]);
    expect(result.preview[1]!.cells["Comments"]).toBe("Bull bar, winch and dual battery;\nsnorkel fitted 2024");
    expect(result.summary).toBe("Would create 5, update 0, 0 unchanged; 4 rows have errors and would be left out.");
  });

  it("dry run writes no vehicle, but is recorded with its file, SHA-256 and an audit entry", async () => {
    const before = await database.$count(vehicles);
    const { result } = await upload(messyCsv, "vehicles-messy.csv", { dryRun: "1" });
    expect(await database.$count(vehicles)).toBe(before);
    const [record] = await database.select().from(imports).where(eq(imports.id, result.importId));
    expect(record).toMatchObject({ dryRun: true, totalRows: 9, created: 5, errorCount: 4, filename: "vehicles-messy.csv", format: "csv", sizeBytes: messyCsv.byteLength });
    // SHA-256 (FIPS 180-4) of the bytes as sent, computed independently by Node's crypto.
    expect(record!.sha256).toBe(createHash("sha256").update(messyCsv).digest("hex"));
    expect(record!.storageKey).toMatch(new RegExp(`^imports/${orgId}/\\d{4}/\\d{2}/[0-9a-f-]{36}\\.csv$`));
    const audit = await database.select().from(auditEntries).where(and(eq(auditEntries.entityType, "import"), eq(auditEntries.entityId, result.importId)));
    expect(audit.map((a) => a.action)).toEqual(["vehicle.import.dry_run"]);
  });

  it("all or nothing: refuses the whole file with 422 listing the bad rows, and writes nothing", async () => {
    const counts = { vehicles: await database.$count(vehicles), platforms: await database.$count(platforms), imports: await database.$count(imports) };
    const { status, result } = await upload(messyCsv, "vehicles-messy.csv", { mode: "all_or_nothing" });
    expect(status).toBe(422);
    const body = result as unknown as { error: { code: string; message: string; details: { row: number; column: string; message: string }[] } };
    expect(body.error.code).toBe("validation_failed");
    expect(body.error.message).toBe("4 rows have errors, so nothing was imported (all or nothing)");
    expect(body.error.details.map((d) => [d.row, d.column])).toEqual([
      [5, "Base"],
      [6, "Chassis No."],
      [7, "Odo (km)"],
      [9, "Fleet #"],
    ]);
    expect({ vehicles: await database.$count(vehicles), platforms: await database.$count(platforms), imports: await database.$count(imports) }).toEqual(counts);
  });

  it("good rows: writes the five good rows in one go, with platforms marked ratings missing", async () => {
    const { status, result } = await upload(messyCsv, "vehicles-messy.csv", { mode: "good_rows" });
    expect(status).toBe(200);
    expect([result.dryRun, result.created, result.updated, result.unchanged, result.errors.length]).toEqual([false, 5, 0, 0, 4]);
    const rows = await database
      .select({ vehicle: vehicles, platform: platforms, depotCode: depots.code })
      .from(vehicles)
      .innerJoin(platforms, eq(platforms.id, vehicles.platformId))
      .leftJoin(depots, eq(depots.id, vehicles.depotId))
      .where(and(eq(vehicles.orgId, orgId), inArray(vehicles.fleetNumber, ["MC-101", "MC-102", "RG-402", "GF-203", "SD-303", "GF-201", "GF-202", "SD-301"])));
    const byFleet = new Map(rows.map((r) => [r.vehicle.fleetNumber, r]));
    expect([...byFleet.keys()].sort()).toEqual(["GF-203", "MC-101", "MC-102", "RG-402", "SD-303"]);

    const mc101 = byFleet.get("MC-101")!;
    // VIN upper-cased for ISO 3779 (S); "84 210" with a space as thousands separator (common practice).
    expect(mc101.vehicle).toMatchObject({ vin: "0KW7D70A1NH100101", registration: "1RL 402", odometerKm: 84210, buildYear: 2022, costCentre: "CC-4102", state: "in_service" });
    expect(mc101.vehicle.registrationExpiry?.toISOString()).toBe("2026-03-31T00:00:00.000Z"); // 31/03/2026 read day first
    expect(mc101.depotCode).toBe("MLC");
    const mc102 = byFleet.get("MC-102")!;
    // Excel 1900 date system, hand-worked: serial 25569 is 1970-01-01 (from memory); 46142 − 25569 = 20573 days → 2026-04-30.
    expect(mc102.vehicle.registrationExpiry?.toISOString()).toBe("2026-04-30T00:00:00.000Z");
    expect(mc102.vehicle.odometerKm).toBe(79155); // "79,155": comma before three digits is a thousands separator (common practice)
    expect(mc102.vehicle.notes).toBe("Bull bar, winch and dual battery;\nsnorkel fitted 2024");
    expect(byFleet.get("GF-203")!.vehicle.odometerKm).toBe(98020);
    expect(byFleet.get("SD-303")!.vehicle).toMatchObject({ state: "grounded", odometerKm: 35210 }); // "35210,4": decimal comma, rounded
    expect(byFleet.get("SD-303")!.vehicle.groundedReason).toContain("imported register");
    expect(byFleet.get("RG-402")!.vehicle.state).toBe("in_fitout");

    const pindan = byFleet.get("RG-402")!.platform;
    expect(pindan).toMatchObject({ make: "Ostrovan", model: "Pindan 6", variant: "Crew cab", kerbMassKg: 2480, gvmKg: null, ratingsMissing: true });
    const korrawa = mc101.platform;
    expect(korrawa).toMatchObject({ make: "Korrawa", model: "Dunecrest 70", kerbMassKg: 2265, gvmKg: 3510, frontAxleRatingKg: 1480, rearAxleRatingKg: 2300, ratingsMissing: true });
    expect(mc102.platform.id).toBe(korrawa.id);

    const audits = await database.select().from(auditEntries).where(eq(auditEntries.orgId, orgId));
    expect(audits.filter((a) => a.action === "vehicle.import" && a.entityId === result.importId)).toHaveLength(1);
    const created = audits.filter((a) => a.action === "vehicle.create" && a.reason === "Imported from vehicles-messy.csv");
    expect(created.map((a) => a.entityId).sort()).toEqual([...byFleet.values()].map((r) => r.vehicle.id).sort());
    expect(audits.filter((a) => a.action === "platform.create" && a.reason === "Imported from vehicles-messy.csv")).toHaveLength(3);
    // Links to the register: each written row knows its vehicle.
    expect(result.rows.every((r) => r.vehicleId && byFleet.get(r.fleetNumber)?.vehicle.id === r.vehicleId)).toBe(true);
  });

  it("re-importing the same file changes nothing and says so", async () => {
    const before = await database.select().from(vehicles).where(eq(vehicles.orgId, orgId));
    const { status, result } = await upload(messyCsv, "vehicles-messy.csv", { mode: "good_rows" });
    expect(status).toBe(200);
    expect([result.created, result.updated, result.unchanged]).toEqual([0, 0, 5]);
    expect(result.summary).toBe("Nothing changed: 5 rows match the register already; 4 rows have errors and were left out.");
    const after = await database.select().from(vehicles).where(eq(vehicles.orgId, orgId));
    expect(after).toEqual(before);
  });

  it("offers the mapping saved from the last import of the same header row", async () => {
    const [saved] = await database.select().from(importMappings).where(eq(importMappings.orgId, orgId));
    expect(saved!.mapping["Fuel card"]).toBeNull();
    const { result } = await upload(messyCsv, "vehicles-messy.csv", { dryRun: "1" });
    expect(result.savedMappingUsed).toBe(true);
    expect(result.mappingSources["Fleet #"]).toBe("saved");
  });

  it("uses the user's corrected mapping: an ignored column is not read, and the correction is saved", async () => {
    const mapping = { ...(await upload(messyCsv, "vehicles-messy.csv", { dryRun: "1" })).result.mapping, Base: null };
    const { result } = await upload(messyCsv, "vehicles-messy.csv", { dryRun: "1", mapping: JSON.stringify(mapping) });
    expect(result.mapping["Base"]).toBeNull();
    expect(result.mappingSources["Fleet #"]).toBe("chosen");
    // Without the depot column the North Yard row is good again (and GF-201 would be created).
    expect(result.errors.map((e) => e.row)).toEqual([6, 7, 9]);
    expect(result.rows.find((r) => r.fleetNumber === "GF-201")?.action).toBe("create");
    const next = await upload(messyCsv, "vehicles-messy.csv", { dryRun: "1" });
    expect(next.result.mapping["Base"]).toBeNull();
    expect(next.result.savedMappingUsed).toBe(true);
  });

  it("refuses a mapping to a field we do not have, naming the field", async () => {
    const { status, result } = await upload(messyCsv, "vehicles-messy.csv", { dryRun: "1", mapping: JSON.stringify({ "Fleet #": "colour" }) });
    expect(status).toBe(422);
    expect((result as unknown as { error: { details: { field: string }[] } }).error.details[0]!.field).toMatch(/^mapping/);
  });
});

describe("vehicle import: the messy XLSX sample", () => {
  it("skips the title rows, reads date cells, serials, formulas and numbers as text", async () => {
    const { status, result } = await upload(messyXlsx, "vehicles-messy.xlsx", { dryRun: "1", mapping: JSON.stringify({ Depot: null }) });
    expect(status).toBe(200);
    expect(result.format).toBe("xlsx");
    expect(result.headerRowNumber).toBe(4);
    expect(result.unknownColumns).toEqual(["Fuel card"]);
    expect(result.errors).toEqual([
      { row: 9, column: "VIN", message: "A VIN has 17 characters; this one has 16." }, // ISO 3779 (S)
      { row: 10, column: "Odometer", message: "Odometer is -1,250 km; it cannot be negative" },
      { row: 12, column: "Fleet No", message: "Row 12 repeats row 8 exactly; only row 8 is imported" },
    ]);
    // The same register as the CSV, already imported above: only GF-201 (left out there for its depot) is new.
    // Every value read from the workbook (date cells, serials, formulas, numbers as text) equals what the CSV gave.
    expect(result.rows.map((r) => [r.row, r.fleetNumber, r.action])).toEqual([
      [5, "MC-101", "unchanged"],
      [6, "MC-102", "unchanged"],
      [8, "GF-201", "create"],
      [11, "RG-402", "unchanged"],
      [13, "GF-203", "unchanged"],
    ]);
  });

  it("reads the same values as the pure pipeline (date serials and thousands separators included)", async () => {
    const parsed = await parseSpreadsheet(messyXlsx);
    const match = matchHeaders(parsed.headers);
    const { valid } = validateRows(parsed, match.mapping);
    const mc102 = valid.find((row) => row.values.fleetNumber === "MC-102")!;
    // Hand-worked, Excel 1900 date system: 46142 − 25569 (1970-01-01, from memory) = 20573 days → 2026-04-30.
    expect(mc102.values.registrationExpiry).toBe("2026-04-30");
    const gf203 = valid.find((row) => row.values.fleetNumber === "GF-203")!;
    expect(gf203.values.gvmKg).toBe(3200); // "3.2 t" = 3,200 kg (1 t = 1,000 kg, SI)
    expect(gf203.values.kerbMassKg).toBe(2110); // "2,110 kg": thousands separator (common practice)
  });
});

describe("history, original files and the template", () => {
  it("lists every recorded import, newest first, with who and the counts", async () => {
    const { status, json } = await callRoute(listHistory, { user: manager });
    expect(status).toBe(200);
    const items = (json as { items: { filename: string; createdByName: string; dryRun: boolean; created: number; hasFile: boolean }[] }).items;
    const stored = await database.$count(imports, eq(imports.orgId, orgId));
    expect(items).toHaveLength(stored);
    expect(items.every((i) => i.createdByName === "Tomas Reyburn" && i.hasFile)).toBe(true);
    expect(items.some((i) => !i.dryRun && i.created === 5)).toBe(true);
  });

  it("gives back the original file byte for byte, stored once for the same bytes", async () => {
    const records = await database.select().from(imports).where(and(eq(imports.orgId, orgId), eq(imports.format, "csv")));
    expect(new Set(records.map((r) => r.storageKey)).size).toBe(1);
    const { status, response } = await callRoute(downloadFile, { user: manager, params: { id: records[0]!.id } });
    expect(status).toBe(200);
    expect(response.headers.get("content-type")).toBe("text/csv; charset=utf-8");
    expect(response.headers.get("content-disposition")).toBe('attachment; filename="vehicles-messy.csv"');
    const bytes = Buffer.from(await response.arrayBuffer());
    expect(Buffer.compare(bytes, messyCsv)).toBe(0);
  });

  it("answers 404 for another organisation's import and for an unknown id", async () => {
    const [record] = await database.select().from(imports).where(eq(imports.orgId, orgId)).limit(1);
    const other = await signedInAs(database, "manager@gidgee-trust.example");
    expect((await callRoute(downloadFile, { user: other, params: { id: record!.id } })).status).toBe(404);
    expect((await callRoute(downloadFile, { user: manager, params: { id: "no-such-import" } })).status).toBe(404);
    const history = await callRoute(listHistory, { user: other });
    expect((history.json as { items: unknown[] }).items).toEqual([]);
  });

  it("downloads the template as an XLSX our own import reads back", async () => {
    const { status, response } = await callRoute(downloadTemplate, { user: manager });
    expect(status).toBe(200);
    expect(response.headers.get("content-type")).toBe("application/vnd.openxmlformats-officedocument.spreadsheetml.sheet");
    expect(response.headers.get("content-disposition")).toContain("rigline-vehicle-import-template.xlsx");
    const bytes = Buffer.from(await response.arrayBuffer());
    const { result } = await upload(bytes, "template.xlsx", { dryRun: "1" });
    expect(result.format).toBe("xlsx");
    expect(result.headers[0]).toBe("Fleet number");
    expect(result.unknownColumns).toEqual([]);
    expect(result.rows.map((r) => [r.fleetNumber, r.action])).toEqual([["EX-001", "create"]]);
    // The example row names the invented depot "Mulga Creek", which this organisation has.
    expect(result.errors).toEqual([]);
  });
});
