import { describe, expect, it } from "vitest";
import ExcelJS from "exceljs";
import { parseSpreadsheet } from "@/imports";
import { workbookOf } from "./helpers";

describe("parseSpreadsheet: XLSX", () => {
  it("finds the header under title rows and keeps the sheet's row numbers", async () => {
    const buffer = await workbookOf(
      [
        ["Mulga Creek depot: vehicle list"],
        ["Printed for the fleet office"],
        [],
        ["Fleet No", "Rego", "Odo (km)", "Base"],
        ["RH-014", "QX 11 RL", 12345, "Mulga Creek"],
        [],
        ["RH-015", "QX 12 RL", 8020, "Gibber Flat"],
      ],
      (_workbook, sheet) => sheet.mergeCells("A1:D1"),
    );
    const parsed = await parseSpreadsheet(buffer);
    expect(parsed.format).toBe("xlsx");
    expect(parsed.sheetName).toBe("Sheet1");
    expect(parsed.headerRowIndex).toBe(3);
    expect(parsed.headerRowNumber).toBe(4);
    expect(parsed.headers).toEqual(["Fleet No", "Rego", "Odo (km)", "Base"]);
    expect(parsed.rows.map((row) => row.rowNumber)).toEqual([5, 7]);
    expect(parsed.rows[0]?.cells).toEqual({ "Fleet No": "RH-014", Rego: "QX 11 RL", "Odo (km)": 12345, Base: "Mulga Creek" });
  });

  it("gives date cells as Dates and leaves plain serial numbers as numbers", async () => {
    const buffer = await workbookOf(
      [
        ["Fleet number", "Registration expiry", "Rego due"],
        ["RH-014", new Date(Date.UTC(2026, 2, 31)), 46112],
      ],
      (_workbook, sheet) => {
        sheet.getCell("B2").numFmt = "dd/mm/yyyy";
      },
    );
    const parsed = await parseSpreadsheet(buffer);
    const cells = parsed.rows[0]!.cells;
    expect(cells["Registration expiry"]).toBeInstanceOf(Date);
    expect((cells["Registration expiry"] as Date).toISOString()).toBe("2026-03-31T00:00:00.000Z");
    expect(cells["Rego due"]).toBe(46112);
    expect(parsed.date1904).toBe(false);
  });

  it("uses a formula's cached result, flattens rich text and hyperlinks, and writes booleans and errors as text", async () => {
    const buffer = await workbookOf([
      ["Fleet number", "Odometer", "Notes", "Depot", "Active", "Kerb mass"],
      [
        "RH-014",
        { formula: "12000+345", result: 12345 },
        { richText: [{ text: "Bull bar ", font: { bold: true } }, { text: "and winch" }] },
        { text: "Mulga Creek", hyperlink: "https://example.invalid/depots/mc" },
        true,
        { formula: "1/0", result: { error: "#DIV/0!" } },
      ],
    ]);
    const cells = (await parseSpreadsheet(buffer)).rows[0]!.cells;
    expect(cells).toEqual({
      "Fleet number": "RH-014",
      Odometer: 12345,
      Notes: "Bull bar and winch",
      Depot: "Mulga Creek",
      Active: "TRUE",
      "Kerb mass": "#DIV/0!",
    });
  });

  it("reads the first visible worksheet and ignores the rest", async () => {
    const workbook = new ExcelJS.Workbook();
    const hidden = workbook.addWorksheet("Lookups", { state: "hidden" });
    hidden.addRow(["Depot", "Code"]);
    workbook.addWorksheet("Register").addRows([["Fleet number", "Depot"], ["RH-014", "Red Gully"]]);
    workbook.addWorksheet("Other").addRows([["Fleet number"], ["ZZ-999"]]);
    const buffer = Buffer.from((await workbook.xlsx.writeBuffer()) as unknown as Uint8Array);
    const parsed = await parseSpreadsheet(buffer);
    expect(parsed.sheetName).toBe("Register");
    expect(parsed.rows).toEqual([{ rowNumber: 2, cells: { "Fleet number": "RH-014", Depot: "Red Gully" } }]);
  });

  it("gives every cell of a merged range the top-left value", async () => {
    const buffer = await workbookOf([["Fleet number", "Depot"], ["RH-014", "Mulga Creek"], ["RH-015", null]], (_workbook, sheet) => {
      sheet.mergeCells("B2:B3");
    });
    const parsed = await parseSpreadsheet(buffer);
    expect(parsed.rows.map((row) => row.cells["Depot"])).toEqual(["Mulga Creek", "Mulga Creek"]);
  });

  it("reports the 1904 date system so raw serials can be read right", async () => {
    const buffer = await workbookOf([["Fleet number"], ["RH-014"]], (workbook) => {
      workbook.properties.date1904 = true;
    });
    expect((await parseSpreadsheet(buffer)).date1904).toBe(true);
  });
});
