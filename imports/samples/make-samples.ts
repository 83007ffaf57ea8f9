/**
 * Writes the messy sample files next to this script: vehicles-messy.csv (byte-exact: byte order
 * mark, semicolons, CRLF, quoted cells, blank rows) and vehicles-messy.xlsx (title rows, date
 * cells and date serials, formulas, rich text, numbers stored as text).
 * Run: npx tsx imports/samples/make-samples.ts
 * All organisations, depots, makes, models, VINs and registrations are invented.
 */
import { writeFileSync } from "node:fs";
import { dirname, join } from "node:path";
import { fileURLToPath } from "node:url";
import ExcelJS from "exceljs";

const here = dirname(fileURLToPath(import.meta.url));

// ---------------------------------------------------------------------------------------------
// CSV: each inner array is one record; strings are written exactly as given (quotes included).

const CSV_RECORDS: string[][] = [
  ["Fleet #", "Rego", "Rego expiry", "Chassis No.", "Make", "Model", "Variant", "Year", "Base", "Cost center", "Status", "Odo (km)", "Kerb weight", "GVM (kg)", "Front axle (kg)", "Rear axle (kg)", "Fuel card", "Comments"],
  ["MC-101", "1RL 402", "31/03/2026", "0kw7d70a1nh100101", "Korrawa", "Dunecrest 70", "Single cab chassis", "2022", "Mulga Creek", "CC-4102", "In service", "84 210", "2 265", "3,510 kg", "1480", "2300", "FC-88121", ""],
  ["MC-102", "1RL 403", "46142", "0KW7D70A3NH100102", "Korrawa", "Dunecrest 70", "Single cab chassis", "2022", '"Mulga Creek"', "CC-4102", "active", '"79,155"', "2265", "3510", "1480", "2300", "FC-88122", '"Bull bar, winch and dual battery;\r\nsnorkel fitted 2024"'],
  ["", "", "", "", "", "", "", "", "", "", "", "", "", "", "", "", "", ""],
  ["GF-201", "2GF 118", "2026-01-31", "0VT4B40D2MK200201", "Veltari", "Brolga 4", "Dual cab", "2021", '"Gibber Flat, North Yard"', "CC-5200", "In-Service", "141,300", "2110", "3200", "1350", "1950", "", ""],
  ["GF-202", "2GF 119", "28/02/2026", "0VT4B40D4MK20020", "Veltari", "Brolga 4", "Dual cab", "2021", "Gibber Flat", "CC-5200", "U/S", "152870", "2110", "3200", "1350", "1950", "", "Rear spring cracked"],
  ["SD-301", "3SD 007", "30/09/2025", "0KW7D70A5LH300301", "Korrawa", "Dunecrest 70", "Single cab chassis", "2020", "Saltbush Downs", "CC-6100", "in service", "-1250", "2265", "3510", "1480", "2300", "", "Odometer replaced"],
  ["RG-402", "4RG 221", "30/11/2026", "0SV6P60C3RT400402", "Ostrovan", "Pindan 6", "Crew cab", "2024", "Red Gully", "CC-7300", "in fit-out", "1 020", "2480 kg", "", "", "", "", "First of the trial vehicles"],
  ["GF-201", "2GF 118", "2026-01-31", "0VT4B40D2MK200201", "Veltari", "Brolga 4", "Dual cab", "2021", '"Gibber Flat, North Yard"', "CC-5200", "In-Service", "141,300", "2110", "3200", "1350", "1950", "", ""],
  ["GF-203", "2GF 131", "30.06.2026", "0VT4B40D6NK200203", "Veltari", "Brolga 4", "Dual cab", "2022", "Gibber Flat", "CC-5200", "operational", '"98 020"', "2,110 kg", "3.2 t", "1350", "1950", "FC-88130", ""],
  ["SD-303", "3SD 044", "31 Aug 2026", "0VT4B40D1PK300303", "Veltari", "Brolga 4", "Dual cab", "2023", "Saltbush Downs", "CC-6100", "Grounded", "35210,4", "2110", "3200", "1350", "1950", "", ""],
  ["", "", "", "", "", "", "", "", "", "", "", "", "", "", "", "", "", ""],
  [""],
];

function writeMessyCsv(): void {
  const body = CSV_RECORDS.map((record) => record.join(";")).join("\r\n") + "\r\n";
  writeFileSync(join(here, "vehicles-messy.csv"), Buffer.concat([Buffer.from([0xef, 0xbb, 0xbf]), Buffer.from(body, "utf8")]));
}

// ---------------------------------------------------------------------------------------------
// XLSX

const XLSX_HEADERS = [
  "Fleet No", "Registration", "Registration expiry", "VIN", "Make", "Model", "Variant", "Build year", "Depot",
  "Cost centre", "Status", "Odometer", "Kerb mass (kg)", "GVM", "Front axle rating", "Rear axle rating", "Fuel card", "Notes",
];

const day = (iso: string) => new Date(`${iso}T00:00:00Z`);

/** Rows keyed by their sheet row number; the gaps are blank rows. */
const XLSX_ROWS: Record<number, ExcelJS.CellValue[]> = {
  5: ["MC-101", "1RL 402", day("2026-03-31"), "0KW7D70A1NH100101", "Korrawa", "Dunecrest 70", "Single cab chassis", 2022, "Mulga Creek", "CC-4102", "In service", { formula: "84000+210", result: 84210 }, 2265, 3510, 1480, 2300, "FC-88121", null],
  6: ["MC-102", "1RL 403", 46142, "0KW7D70A3NH100102", "Korrawa", "Dunecrest 70", "Single cab chassis", 2022, "Mulga Creek", "CC-4102", "active", "79,155", 2265, 3510, 1480, 2300, "FC-88122",
    { richText: [{ text: "Bull bar, winch and dual battery;", font: { bold: true } }, { text: "\nsnorkel fitted 2024" }] }],
  8: ["GF-201", "2GF 118", day("2026-01-31"), "0VT4B40D2MK200201", "Veltari", "Brolga 4", "Dual cab", 2021, "Gibber Flat, North Yard", "CC-5200", "In-Service", "141 300", 2110, 3200, 1350, 1950, null, null],
  9: ["GF-202", "2GF 119", day("2026-02-28"), "0VT4B40D4MK20020", "Veltari", "Brolga 4", "Dual cab", 2021, "Gibber Flat", "CC-5200", "U/S", 152870, 2110, 3200, 1350, 1950, null, "Rear spring cracked"],
  10: ["SD-301", "3SD 007", day("2025-09-30"), "0KW7D70A5LH300301", "Korrawa", "Dunecrest 70", "Single cab chassis", 2020, "Saltbush Downs", "CC-6100", "in service", -1250, 2265, 3510, 1480, 2300, null, "Odometer replaced"],
  11: ["RG-402", "4RG 221", day("2026-11-30"), "0SV6P60C3RT400402", "Ostrovan", "Pindan 6", "Crew cab", 2024, "Red Gully", "CC-7300", "in fit-out", "1 020", "2480 kg", null, null, null, null, "First of the trial vehicles"],
  12: ["GF-201", "2GF 118", day("2026-01-31"), "0VT4B40D2MK200201", "Veltari", "Brolga 4", "Dual cab", 2021, "Gibber Flat, North Yard", "CC-5200", "In-Service", "141 300", 2110, 3200, 1350, 1950, null, null],
  13: ["GF-203", "2GF 131", day("2026-06-30"), "0VT4B40D6NK200203", "Veltari", "Brolga 4", "Dual cab", 2022, "Gibber Flat", "CC-5200", "operational", 98020, "2,110 kg", { formula: "3.2*1000", result: 3200 }, 1350, 1950, "FC-88130", null],
};

async function writeMessyXlsx(): Promise<void> {
  const workbook = new ExcelJS.Workbook();
  workbook.creator = "Gibber Plains Health Service";
  workbook.created = new Date(Date.UTC(2025, 1, 14));
  workbook.modified = new Date(Date.UTC(2025, 1, 14));
  const sheet = workbook.addWorksheet("Register");
  sheet.getCell("A1").value = "Gibber Plains Health Service: vehicle register";
  sheet.getCell("A1").font = { bold: true, size: 14 };
  sheet.mergeCells("A1:R1");
  sheet.getCell("A2").value = "Prepared by the fleet office, 14/02/2025";
  sheet.getRow(4).values = XLSX_HEADERS;
  sheet.getRow(4).font = { bold: true };
  for (const [rowNumber, values] of Object.entries(XLSX_ROWS)) {
    const row = sheet.getRow(Number(rowNumber));
    values.forEach((value, index) => {
      if (value !== null) row.getCell(index + 1).value = value;
    });
  }
  sheet.getColumn(3).numFmt = "dd/mm/yyyy";
  // The serial in row 6 is a plain number, as when a date column lost its format.
  sheet.getCell("C6").numFmt = "General";
  // A second sheet the import must ignore.
  workbook.addWorksheet("Depots").addRows([["Depot", "Code"], ["Mulga Creek", "MC"], ["Gibber Flat", "GF"]]);
  await workbook.xlsx.writeFile(join(here, "vehicles-messy.xlsx"));
}

async function main(): Promise<void> {
  writeMessyCsv();
  await writeMessyXlsx();
}

main().catch((error: unknown) => {
  console.error(error);
  process.exitCode = 1;
});
