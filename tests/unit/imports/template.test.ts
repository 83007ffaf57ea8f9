import { describe, expect, it } from "vitest";
import ExcelJS from "exceljs";
import {
  TEMPLATE_NOTES_SHEET,
  TEMPLATE_SHEET,
  VEHICLE_FIELDS,
  VEHICLE_FIELD_INFO,
  matchHeaders,
  parseSpreadsheet,
  validateRows,
  vehicleImportTemplate,
} from "@/imports";

const NOW = new Date(Date.UTC(2025, 5, 1));

describe("vehicleImportTemplate", () => {
  it("round-trips: parsed and matched, every field maps and the example row is valid", async () => {
    const buffer = await vehicleImportTemplate();
    const parsed = await parseSpreadsheet(buffer, { filename: "vehicle-template.xlsx" });
    expect(parsed.format).toBe("xlsx");
    expect(parsed.sheetName).toBe(TEMPLATE_SHEET);
    expect(parsed.headerRowNumber).toBe(1);
    expect(parsed.headers).toEqual(VEHICLE_FIELDS.map((field) => VEHICLE_FIELD_INFO[field].header));

    const match = matchHeaders(parsed.headers);
    expect(match.unknown).toEqual([]);
    expect(match.duplicates).toEqual([]);
    expect(match.ready).toBe(true);
    expect(new Set(Object.values(match.mapping))).toEqual(new Set(VEHICLE_FIELDS));

    const result = validateRows(parsed, match.mapping, { now: NOW });
    expect(result.errors).toEqual([]);
    expect(result.valid).toHaveLength(1);
    expect(result.valid[0]).toEqual({
      rowNumber: 2,
      values: {
        fleetNumber: "EX-001",
        vin: "0RLTD70K5PX100214",
        registration: "XQ 40 MC",
        registrationExpiry: "2026-03-31",
        make: "Korrawa",
        model: "Dunecrest 70",
        variant: "Single cab chassis",
        buildYear: 2023,
        depot: "Mulga Creek",
        costCentre: "CC-4102",
        state: "in_service",
        odometerKm: 18420,
        kerbMassKg: 2265,
        gvmKg: 3510,
        frontAxleRatingKg: 1480,
        rearAxleRatingKg: 2300,
        notes: "Example row: replace or delete it before importing.",
      },
    });
  });

  it("freezes the header row, sets widths, and explains each column on a notes sheet", async () => {
    const workbook = new ExcelJS.Workbook();
    await workbook.xlsx.load((await vehicleImportTemplate()) as unknown as ArrayBuffer);
    const sheet = workbook.getWorksheet(TEMPLATE_SHEET)!;
    expect(sheet.views[0]).toMatchObject({ state: "frozen", ySplit: 1 });
    expect(sheet.getRow(1).font?.bold).toBe(true);
    for (let column = 1; column <= VEHICLE_FIELDS.length; column++) expect(sheet.getColumn(column).width).toBeGreaterThanOrEqual(10);
    // The expiry is a real date cell, as a spreadsheet user enters it.
    expect(sheet.getRow(2).getCell(4).value).toBeInstanceOf(Date);

    const notes = workbook.getWorksheet(TEMPLATE_NOTES_SHEET)!;
    const described = new Map<string, string>();
    notes.eachRow((row, number) => {
      if (number > 1) described.set(String(row.getCell(1).value), String(row.getCell(3).value ?? ""));
    });
    for (const field of VEHICLE_FIELDS) {
      expect(described.get(VEHICLE_FIELD_INFO[field].header)?.length ?? 0).toBeGreaterThan(10);
    }
    expect(String(notes.getRow(2).getCell(2).value)).toBe("yes");
  });
});
