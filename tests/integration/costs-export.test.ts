import ExcelJS from "exceljs";
import Papa from "papaparse";
import { and, eq } from "drizzle-orm";
import { beforeAll, describe, expect, it, vi } from "vitest";
import { GET as exportRoute } from "@/app/api/costs/export/route";
import { listCostEntries } from "@/db/costs";
import { costs, vehicles } from "@/db/schema";
import { createManualCost } from "@/lib/commands/costs";
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
const CENTRE = "CC-EXPORT-TEST";

beforeAll(async () => {
  finance = await signedInAs(database, "finance@mirrabel-health.example");
  const [vehicle] = await database.select().from(vehicles).where(and(eq(vehicles.orgId, finance.orgId), eq(vehicles.fleetNumber, "MH-009")));
  const base = { incurredOn: "2026-04-02", vehicleId: vehicle!.id, costCentre: CENTRE, category: "electrical", kind: "capital", amount: "100.00" };
  // Descriptions a careless or hostile supplier could put on an invoice.
  for (const description of ["=SUM(1+1)", "@cmd", 'a"b', "+61 8 5550 0000", "-2+3", "Plain, with a comma"]) {
    await execute(createManualCost, finance, { ...base, description, reference: description === "@cmd" ? "=HYPERLINK(\"x\")" : "INV-1" });
  }
  await execute(createManualCost, finance, { ...base, source: "adjustment", amount: "-25.50", description: "Credit note" });
  // Forms trim leading white space; a booking from elsewhere might still start with a tab or CR.
  for (const description of ["\tpadded", "\rline"]) {
    await database.insert(costs).values({
      orgId: finance.orgId,
      vehicleId: vehicle!.id,
      costCentre: CENTRE,
      depotId: vehicle!.depotId,
      category: "electrical",
      kind: "capital",
      source: "manual",
      amountExGstCents: 10_000,
      gstCents: 1_000,
      incurredOn: new Date("2026-04-02T00:00:00.000Z"),
      description,
    });
  }
});

function url(query: string) {
  return `http://localhost/api/costs/export?${query}`;
}

async function download(query: string, user: SignedIn | null = finance) {
  return callRoute(exportRoute, { user, url: url(query) });
}

/** The body as text with its byte order mark kept (Response.text() drops it). */
async function csvText(response: Response): Promise<string> {
  return new TextDecoder("utf-8", { ignoreBOM: true }).decode(await response.arrayBuffer());
}

function parseCsv(text: string): string[][] {
  expect(text.startsWith(UTF8_BOM)).toBe(true);
  const parsed = Papa.parse<string[]>(text.slice(UTF8_BOM.length), { newline: "\r\n" });
  expect(parsed.errors).toEqual([]);
  return parsed.data;
}

describe("GET /api/costs/export?format=csv", () => {
  it("downloads the filtered ledger as an attachment with a header, one row per entry and a totals row", async () => {
    const { status, response } = await download(`format=csv&costCentre=${CENTRE}`);
    expect(status).toBe(200);
    expect(response.headers.get("content-type")).toBe("text/csv; charset=utf-8");
    expect(response.headers.get("content-disposition")).toMatch(/^attachment; filename="rigline-costs-[\d-]+\.csv"$/);
    expect(response.headers.get("cache-control")).toBe("private, no-store");
    const rows = parseCsv(await csvText(response));
    expect(rows[0]).toEqual(["Date", "Fleet no.", "Cost centre", "Depot", "Category", "Capital or operating", "Description", "Reference", "Source", "Ex GST ($)", "GST ($)", "Total incl. GST ($)"]);
    expect(rows).toHaveLength(1 + 9 + 1);
    expect(rows.slice(1, 10).every((r) => r[2] === CENTRE && r[0] === "2026-04-02" && r[1] === "MH-009")).toBe(true);
    const totals = rows[10]!;
    expect(totals[6]).toBe("Total of 9 entries");
    // hand-worked: 8 × $100.00 − $25.50 = $774.50 ex GST; GST 8 × $10.00 − $2.55 = $77.45
    expect(totals.slice(9)).toEqual(["774.5", "77.45", "851.95"]);
  });

  it("neutralises every formula-like text cell and quotes embedded quotes", async () => {
    const { response } = await download(`format=csv&costCentre=${CENTRE}`);
    const text = await csvText(response);
    const descriptions = parseCsv(text)
      .slice(1, 10)
      .map((r) => r[6]);
    // OWASP CSV Injection; OWASP ASVS 5.0 V1.2.10; CWE-1236: =, +, -, @, tab, CR lead → prefixed with '
    expect(descriptions.sort()).toEqual(["'+61 8 5550 0000", "'-2+3", "'=SUM(1+1)", "'@cmd", "'\rline", "'\tpadded", "Credit note", "Plain, with a comma", 'a"b'].sort());
    // OWASP CSV Injection / RFC 4180: a"b is written as "a""b"
    expect(text).toContain('"a""b"');
    expect(text).toContain(`"'=HYPERLINK(""x"")"`);
    // No cell anywhere starts a formula.
    for (const row of parseCsv(text)) for (const cell of row) expect(cell).not.toMatch(/^[=+@\t\r]/);
  });

  it("keeps amounts numeric: a credit is a plain negative number", async () => {
    const { response } = await download(`format=csv&costCentre=${CENTRE}&source=adjustment`);
    const rows = parseCsv(await csvText(response));
    expect(rows[1]?.slice(9)).toEqual(["-25.5", "-2.55", "-28.05"]);
  });
});

describe("GET /api/costs/export?format=xlsx", () => {
  it("reads back with exceljs equal to the ledger it was made from", async () => {
    const { status, response } = await download("format=xlsx&from=2026-01-01&to=2026-06-30");
    expect(status).toBe(200);
    expect(response.headers.get("content-type")).toBe("application/vnd.openxmlformats-officedocument.spreadsheetml.sheet");
    expect(response.headers.get("content-disposition")).toBe('attachment; filename="rigline-costs-2026-01-01-to-2026-06-30.xlsx"');
    const workbook = new ExcelJS.Workbook();
    await workbook.xlsx.load(await response.arrayBuffer());
    const sheet = workbook.worksheets[0]!;
    const ledger = await listCostEntries(database, finance, { from: new Date("2026-01-01T00:00:00Z"), to: new Date("2026-06-30T00:00:00Z") });
    expect(ledger.length).toBeGreaterThan(50);
    expect(sheet.rowCount).toBe(ledger.length + 2);
    expect(sheet.views[0]).toMatchObject({ state: "frozen", ySplit: 1 });
    ledger.forEach((entry, i) => {
      const row = sheet.getRow(i + 2);
      expect((row.getCell(1).value as Date).toISOString()).toBe(entry.incurredOn.toISOString());
      expect(row.getCell(2).value ?? null).toBe(entry.fleetNumber);
      expect(row.getCell(3).value).toBe(entry.costCentre);
      expect(row.getCell(4).value ?? null).toBe(entry.depotName);
      for (const [column, cents] of [
        [10, entry.amountExGstCents],
        [11, entry.gstCents],
        [12, entry.amountExGstCents + entry.gstCents],
      ] as const) {
        expect(row.getCell(column).type).toBe(ExcelJS.ValueType.Number);
        expect(Math.round((row.getCell(column).value as number) * 100)).toBe(cents);
      }
    });
    const totals = sheet.getRow(ledger.length + 2);
    const exGst = ledger.reduce((s, e) => s + e.amountExGstCents, 0);
    expect(Math.round((totals.getCell(10).value as number) * 100)).toBe(exGst);
  });

  it("neutralises formula-like text in the workbook too and writes no formula cells", async () => {
    const { response } = await download(`format=xlsx&costCentre=${CENTRE}`);
    const workbook = new ExcelJS.Workbook();
    await workbook.xlsx.load(await response.arrayBuffer());
    const sheet = workbook.worksheets[0]!;
    const descriptions: unknown[] = [];
    sheet.eachRow((row, n) => {
      if (n > 1) descriptions.push(row.getCell(7).value);
      row.eachCell((cell) => expect(cell.type).not.toBe(ExcelJS.ValueType.Formula));
    });
    // OWASP CSV Injection; OWASP ASVS 5.0 V1.2.10; CWE-1236: applies to XLSX exports as well
    expect(descriptions).toEqual(expect.arrayContaining(["'=SUM(1+1)", "'@cmd", "'-2+3", 'a"b', "'\tpadded"]));
    // XML turns a bare CR into a line feed when the file is read; the apostrophe still leads.
    expect(descriptions.find((d) => String(d).endsWith("line"))).toMatch(/^'[\r\n]line$/);
  });
});

describe("who may export", () => {
  it("answers 422 for a missing or unknown format and 403 to drivers and contractors", async () => {
    expect((await download("")).status).toBe(422);
    const bad = await download("format=pdf");
    expect(bad.status).toBe(422);
    expect(bad.json).toMatchObject({ error: { details: [{ field: "format" }] } });
    for (const email of ["driver@mirrabel-health.example", "driver2@mirrabel-health.example", "contractor@tallowbark-fitout.example", "contractor@quandong-road.example"]) {
      const { status, json } = await download("format=csv", await signedInAs(database, email));
      expect(status, email).toBe(403);
      expect(json).toMatchObject({ error: { code: "forbidden" } });
    }
    expect((await download("format=csv", null)).status).toBe(401);
  });

  it("lets a manager and an admin export, each only their own organisation", async () => {
    const manager = await download("format=csv", await signedInAs(database, "manager@mirrabel-health.example"));
    expect(manager.status).toBe(200);
    const gidgee = await download("format=csv", await signedInAs(database, "admin@gidgee-trust.example"));
    const rows = parseCsv(await csvText(gidgee.response));
    const gidgeeOrg = (await signedInAs(database, "admin@gidgee-trust.example")).orgId;
    const count = (await database.select().from(costs).where(eq(costs.orgId, gidgeeOrg))).length;
    expect(rows).toHaveLength(count + 2);
    expect(rows.slice(1, -1).every((r) => r[1] === "" || r[1]!.startsWith("GT-"))).toBe(true);
  });
});
