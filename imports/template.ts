import ExcelJS from "exceljs";
import { VEHICLE_FIELD_INFO, VEHICLE_FIELDS, type VehicleField } from "./fields";

/** Sheet names of the template; the vehicles sheet comes first so it is the one imported. */
export const TEMPLATE_SHEET = "Vehicles";
export const TEMPLATE_NOTES_SHEET = "Notes";

const COLUMN_WIDTHS: Partial<Record<VehicleField, number>> = {
  fleetNumber: 14,
  vin: 21,
  registration: 14,
  registrationExpiry: 20,
  variant: 20,
  buildYear: 11,
  depot: 16,
  costCentre: 13,
  state: 12,
  odometerKm: 15,
  kerbMassKg: 15,
  gvmKg: 11,
  frontAxleRatingKg: 22,
  rearAxleRatingKg: 21,
  notes: 48,
};

/** Cell formats that show each value as people expect to type it. */
const NUMBER_FORMATS: Partial<Record<VehicleField, string>> = {
  registrationExpiry: "dd/mm/yyyy",
  odometerKm: "#,##0",
  kerbMassKg: "#,##0",
  gvmKg: "#,##0",
  frontAxleRatingKg: "#,##0",
  rearAxleRatingKg: "#,##0",
  buildYear: "0",
};

function exampleValue(field: VehicleField): string | number | Date {
  const example = VEHICLE_FIELD_INFO[field].example;
  // The expiry goes in as a real date cell, the way a spreadsheet user would enter it.
  if (field === "registrationExpiry" && typeof example === "string") return new Date(`${example}T00:00:00Z`);
  return example;
}

/**
 * The vehicle register template: our column headings on a frozen first row, sensible widths,
 * one invented example row, and a notes sheet describing each column.
 */
export async function vehicleImportTemplate(): Promise<Buffer> {
  const workbook = new ExcelJS.Workbook();
  workbook.creator = "Rigline";
  // Fixed dates keep the file identical from one download to the next.
  workbook.created = new Date(Date.UTC(2025, 0, 1));
  workbook.modified = new Date(Date.UTC(2025, 0, 1));

  const sheet = workbook.addWorksheet(TEMPLATE_SHEET, { views: [{ state: "frozen", ySplit: 1, xSplit: 0 }] });
  sheet.columns = VEHICLE_FIELDS.map((field) => ({
    header: VEHICLE_FIELD_INFO[field].header,
    key: field,
    width: COLUMN_WIDTHS[field] ?? Math.max(12, VEHICLE_FIELD_INFO[field].header.length + 2),
  }));
  const header = sheet.getRow(1);
  header.font = { bold: true };
  header.alignment = { vertical: "middle" };
  header.eachCell((cell) => {
    cell.fill = { type: "pattern", pattern: "solid", fgColor: { argb: "FFE9E2D0" } };
    cell.border = { bottom: { style: "thin", color: { argb: "FF6B5B3E" } } };
  });

  const example: Record<string, string | number | Date> = {};
  for (const field of VEHICLE_FIELDS) example[field] = exampleValue(field);
  const exampleRow = sheet.addRow(example);
  exampleRow.font = { italic: true, color: { argb: "FF5A5A5A" } };
  VEHICLE_FIELDS.forEach((field, index) => {
    const format = NUMBER_FORMATS[field];
    if (format !== undefined) sheet.getColumn(index + 1).numFmt = format;
  });

  const notes = workbook.addWorksheet(TEMPLATE_NOTES_SHEET, { views: [{ state: "frozen", ySplit: 1, xSplit: 0 }] });
  notes.columns = [
    { header: "Column", key: "column", width: 24 },
    { header: "Required", key: "required", width: 10 },
    { header: "What it holds", key: "description", width: 90 },
    { header: "Example", key: "example", width: 26 },
  ];
  notes.getRow(1).font = { bold: true };
  for (const field of VEHICLE_FIELDS) {
    const info = VEHICLE_FIELD_INFO[field];
    const row = notes.addRow({
      column: info.header,
      required: info.required ? "yes" : "no",
      description: info.description,
      example: String(info.example),
    });
    row.alignment = { wrapText: true, vertical: "top" };
  }
  notes.addRow({});
  const general = [
    "One row per vehicle. The first row holds the column headings; keep them as they are or use your own, and match them on upload.",
    "Existing vehicles are found by VIN first, then by fleet number; a matching row updates the vehicle, others create one.",
    "An empty cell leaves the stored value as it is.",
    "Kerb mass, GVM and the axle ratings are only read when a make, model and variant are new to Rigline.",
    "Delete the example row before importing.",
  ];
  for (const line of general) notes.addRow({ column: line });

  const written = await workbook.xlsx.writeBuffer();
  return Buffer.from(written as unknown as Uint8Array);
}
