import ExcelJS from "exceljs";
import { describe, expect, it } from "vitest";
import { InputError } from "@/lib/errors";
import { checkTable, ledgerTable, tableToXlsx, type LedgerEntry } from "@/lib/exports";
import { entry } from "./fixtures";

async function read(buffer: Buffer): Promise<ExcelJS.Worksheet> {
  const workbook = new ExcelJS.Workbook();
  await workbook.xlsx.load(buffer as unknown as ArrayBuffer);
  const sheet = workbook.worksheets[0];
  if (!sheet) throw new Error("no sheet");
  return sheet;
}

const entries: LedgerEntry[] = [
  entry(),
  entry({ id: "c-2", incurredOn: new Date(Date.UTC(2025, 6, 1)), fleetNumber: null, depotName: null, reference: null, category: "electrical", kind: "operating", source: "job", description: "Dual battery service", amountExGstCents: 38_000, gstCents: 3_800 }),
  entry({ id: "c-3", source: "adjustment", description: "Credit note for returned bar", amountExGstCents: -45_000, gstCents: -4_500 }),
];

describe("tableToXlsx", () => {
  it("reads back equal to the ledger: dates as dates, amounts as numbers, text as text", async () => {
    const sheet = await read(await tableToXlsx(ledgerTable(entries)));
    expect(sheet.name).toBe("Cost ledger");
    expect(sheet.rowCount).toBe(1 + entries.length + 1);
    entries.forEach((e, i) => {
      const row = sheet.getRow(i + 2);
      const date = row.getCell(1);
      expect(date.type).toBe(ExcelJS.ValueType.Date);
      expect((date.value as Date).toISOString()).toBe(e.incurredOn.toISOString());
      expect(row.getCell(2).value ?? null).toBe(e.fleetNumber);
      expect(row.getCell(3).value).toBe(e.costCentre);
      expect(row.getCell(7).value).toBe(e.description);
      expect(row.getCell(8).value ?? null).toBe(e.reference);
      for (const [column, cents] of [
        [10, e.amountExGstCents],
        [11, e.gstCents],
        [12, e.amountExGstCents + e.gstCents],
      ] as const) {
        const cell = row.getCell(column);
        expect(cell.type).toBe(ExcelJS.ValueType.Number);
        expect(Math.round((cell.value as number) * 100)).toBe(cents);
        expect(cell.numFmt).toBe("#,##0.00");
      }
    });
  });

  it("has a bold header row frozen at the top, set widths and a bold totals row of values", async () => {
    const sheet = await read(await tableToXlsx(ledgerTable(entries)));
    const header = sheet.getRow(1);
    expect(header.getCell(1).value).toBe("Date");
    expect(header.getCell(12).value).toBe("Total incl. GST ($)");
    expect(header.font?.bold ?? header.getCell(1).font?.bold).toBe(true);
    expect(sheet.views[0]).toMatchObject({ state: "frozen", ySplit: 1 });
    expect(sheet.getColumn(7).width).toBe(44);
    const totals = sheet.getRow(5);
    expect(totals.getCell(7).value).toBe("Total of 3 entries");
    // hand-worked: 123,450 + 38,000 − 45,000 = 116,450 c; GST 12,345 + 3,800 − 4,500 = 11,645 c
    expect(totals.getCell(10).value).toBe(1164.5);
    expect(totals.getCell(11).value).toBe(116.45);
    expect(totals.getCell(12).value).toBe(1280.95);
    expect(totals.getCell(10).font?.bold).toBe(true);
    sheet.eachRow((row) => row.eachCell((cell) => expect(cell.type).not.toBe(ExcelJS.ValueType.Formula)));
  });

  it("neutralises formula-like text and keeps a negative amount a number", async () => {
    const sheet = await read(
      await tableToXlsx(ledgerTable([entry({ description: "=SUM(1+1)", reference: "@cmd" }), entry({ description: "-2+3", amountExGstCents: -100, gstCents: -10 })])),
    );
    // OWASP CSV Injection; OWASP ASVS 5.0 V1.2.10; CWE-1236: applies to XLSX exports too
    expect(sheet.getRow(2).getCell(7).value).toBe("'=SUM(1+1)");
    expect(sheet.getRow(2).getCell(8).value).toBe("'@cmd");
    expect(sheet.getRow(3).getCell(7).value).toBe("'-2+3");
    expect(sheet.getRow(3).getCell(10).value).toBe(-1);
    expect(sheet.getRow(3).getCell(10).type).toBe(ExcelJS.ValueType.Number);
  });
});

describe("checkTable", () => {
  it("refuses a cell of the wrong kind, naming it", () => {
    const table = ledgerTable([entry()]);
    table.rows[0]![9] = 12.5;
    expect(() => checkTable(table)).toThrow(InputError);
    try {
      checkTable(table);
    } catch (error) {
      expect((error as InputError).field).toBe("rows.0.9");
    }
  });

  it("refuses a sheet name a spreadsheet program cannot hold", () => {
    expect(() => checkTable({ ...ledgerTable([]), sheetName: "Costs/2026" })).toThrow(InputError);
  });
});
