import { describe, expect, it } from "vitest";
import ExcelJS from "exceljs";
import {
  makeVehicleRowSchema,
  parseSpreadsheet,
  validateRows,
  vehicleImportMappingSchema,
  type CellValue,
  type ParsedSpreadsheet,
} from "@/imports";
import { coerceDate, coerceQuantity, dateFromSerial, readNumberText } from "@/imports/coerce";
import { csv } from "./helpers";

const NOW = new Date(Date.UTC(2025, 5, 1));

/** A parsed sheet built by hand: headings and rows of cells, numbered from row 2. */
function sheet(headers: string[], rows: CellValue[][], date1904 = false): Pick<ParsedSpreadsheet, "headers" | "rows" | "date1904"> {
  return {
    headers,
    date1904,
    rows: rows.map((cells, index) => ({
      rowNumber: index + 2,
      cells: Object.fromEntries(headers.map((header, column) => [header, cells[column] ?? null])),
    })),
  };
}

function one(field: string, value: CellValue) {
  const schema = makeVehicleRowSchema({ now: NOW });
  return schema.safeParse({ fleetNumber: "RH-014", [field]: value });
}

function messageFor(field: string, value: CellValue): string | undefined {
  const result = one(field, value);
  return result.success ? undefined : result.error.issues[0]?.message;
}

function valueOf(field: string, value: CellValue): unknown {
  const result = one(field, value);
  if (!result.success) throw new Error(result.error.issues[0]?.message);
  return (result.data as Record<string, unknown>)[field];
}

describe("VIN in an import row", () => {
  it("accepts 17 letters and digits without I, O or Q, upper-cased", () => {
    // 17 characters, I, O and Q never used: ISO 3779 (S); sample VINs from 49 CFR 565 and the
    // NHTSA new-manufacturer guide (S)
    for (const vin of ["1G4AH59H45G118341", "1J9RP1A36A1644345", "1M8GDM9AXKP042788", "LJCPCBLCX11000237"]) {
      expect(valueOf("vin", vin)).toBe(vin);
    }
    // Capital letters and digits only, so case and spaces are set aside: ISO 3779 (S)
    expect(valueOf("vin", " 1g4ah59h45 g118341 ")).toBe("1G4AH59H45G118341");
  });

  it("says how many characters a wrong-length VIN has", () => {
    // Length 17: ISO 3779 (S)
    expect(messageFor("vin", "1G4AH59H45G11834")).toBe("A VIN has 17 characters; this one has 16.");
    expect(messageFor("vin", "1G4AH59H45G1183410")).toBe("A VIN has 17 characters; this one has 18.");
  });

  it("names the forbidden letter or character and its position", () => {
    // Letters I, O and Q never used: ISO 3779 (S)
    expect(messageFor("vin", "1G4AH59HO5G118341")).toBe(
      "Position 9 is the letter O, which a VIN never uses; it is probably the digit 0.",
    );
    expect(messageFor("vin", "IG4AH59H45G118341")).toMatch(/^Position 1 is the letter I/);
    expect(messageFor("vin", "1G4AH59H45G11834Q")).toMatch(/^Position 17 is the letter Q/);
    expect(messageFor("vin", "1G4AH-9H45G118341")).toBe('Position 6 is "-"; a VIN has only letters and digits.');
    // Every problem is told at once.
    expect(messageFor("vin", "1G4AH59HO5G11834")).toBe(
      "A VIN has 17 characters; this one has 16. Position 9 is the letter O, which a VIN never uses; it is probably the digit 0.",
    );
  });

  it("does not reject a VIN on its check digit", () => {
    // Position-9 check digit required only for North American vehicles: 49 CFR 565 (P), ISO 3779 (S).
    // 1G4AH59H45G118341 has check digit 4; with 9 in its place the structure is still sound.
    expect(valueOf("vin", "1G4AH59H95G118341")).toBe("1G4AH59H95G118341");
  });

  it("leaves an empty VIN empty", () => {
    expect(valueOf("vin", "   ")).toBeNull();
  });
});

describe("numbers stored as text", () => {
  it("reads thousands separators, spaces and unambiguous decimal commas", () => {
    // Thousands grouped by threes with comma or space; "," before three digits is thousands,
    // before any other count a decimal comma: common practice
    expect(readNumberText("12345")).toBe(12345);
    expect(readNumberText("12,345")).toBe(12345);
    expect(readNumberText("12 345")).toBe(12345);
    expect(readNumberText("1 234 567")).toBe(1234567);
    expect(readNumberText("1,234,567")).toBe(1234567);
    expect(readNumberText("2150.5")).toBe(2150.5);
    expect(readNumberText("1,234.5")).toBe(1234.5);
    expect(readNumberText("1.234,5")).toBe(1234.5);
    expect(readNumberText("12,5")).toBe(12.5);
    expect(readNumberText("0,345")).toBe(0.345);
    expect(readNumberText("1.234.567")).toBe(1234567);
    expect(readNumberText("12,34,567")).toBeNull();
    expect(readNumberText("1 23")).toBeNull();
    expect(readNumberText("1,2,3")).toBeNull();
  });

  it("takes units in cells, converting tonnes to kilograms", () => {
    // 1 t = 1000 kg (SI Brochure, from memory)
    const mass = { unit: "kg", sign: "positive", max: 100_000 } as const;
    expect(coerceQuantity("2,150 kg", "Kerb mass", mass)).toEqual({ ok: true, value: 2150 });
    expect(coerceQuantity("2150kg", "Kerb mass", mass)).toEqual({ ok: true, value: 2150 });
    expect(coerceQuantity("3.2 t", "GVM", mass)).toEqual({ ok: true, value: 3200 });
    expect(coerceQuantity("3,2 t", "GVM", mass)).toEqual({ ok: true, value: 3200 });
    // 1.005 × 1000 is 1004.9999999999999 in binary floating point; the result is cleaned to 1005.
    expect(coerceQuantity("1.005 t", "GVM", mass)).toEqual({ ok: true, value: 1005 });
    expect(coerceQuantity("2150 lb", "Kerb mass", mass)).toEqual({ ok: false, message: 'Kerb mass is given in "lb"; it needs kg' });
    expect(coerceQuantity(2.15, "Kerb mass", { ...mass, plainFactor: 1000 })).toEqual({ ok: true, value: 2150 });
    expect(coerceQuantity("2,150,000", "Kerb mass", mass)).toEqual({ ok: false, message: "Kerb mass 2,150,000 kg is more than 100,000 kg; check the value and its unit" });
  });

  it("coerces the odometer to whole kilometres and refuses negatives and miles", () => {
    expect(valueOf("odometerKm", "84 210")).toBe(84210);
    expect(valueOf("odometerKm", "84,210.6 km")).toBe(84211);
    expect(valueOf("odometerKm", 0)).toBe(0);
    expect(messageFor("odometerKm", "-1,250")).toBe("Odometer is -1,250 km; it cannot be negative");
    expect(messageFor("odometerKm", -1250)).toBe("Odometer is -1,250 km; it cannot be negative");
    expect(messageFor("odometerKm", "52,000 mi")).toBe('Odometer is given in "mi"; it needs km; convert it to kilometres');
    expect(messageFor("odometerKm", "lots")).toBe('Odometer "lots" is not a number');
  });

  it("needs the mass ratings above zero", () => {
    expect(valueOf("gvmKg", "3,510")).toBe(3510);
    expect(messageFor("gvmKg", "0")).toBe("GVM is 0 kg; it must be more than zero");
    expect(messageFor("frontAxleRatingKg", "-5")).toBe("Front axle rating is -5 kg; it cannot be negative");
  });

  it("refuses a kerb mass at or above GVM", () => {
    // Payload = GVM − kerb mass, so kerb ≥ GVM leaves none (ADR Definitions and Vehicle Categories (S))
    const result = makeVehicleRowSchema({ now: NOW }).safeParse({ fleetNumber: "RH-014", kerbMassKg: "3,600", gvmKg: 3510 });
    expect(result.success).toBe(false);
    expect(result.error?.issues).toMatchObject([{ path: ["kerbMassKg"], message: "Kerb mass 3,600 kg is not below GVM 3,510 kg" }]);
  });

  it("treats empty cells and placeholders as not given", () => {
    expect(valueOf("odometerKm", "  ")).toBeNull();
    expect(valueOf("odometerKm", "n/a")).toBeNull();
    expect(valueOf("registration", "-")).toBeNull();
    expect(valueOf("notes", "none")).toBe("none");
  });
});

describe("dates", () => {
  it("reads a spreadsheet date serial number as its calendar day", () => {
    // 1900 date system: serial 25569 is 1970-01-01 (ECMA-376 Part 1 §18.17.4, from memory).
    // Hand-worked: 1970-01-01 to 2026-01-01 is 56 × 365 + 14 leap days = 20,454 days; to 31 March
    // add 31 + 28 + 30 = 89 → 20,543; 25,569 + 20,543 = 46,112.
    expect(dateFromSerial(46112).toISOString().slice(0, 10)).toBe("2026-03-31");
    expect(dateFromSerial(46112.75).toISOString().slice(0, 10)).toBe("2026-03-31");
    // 1904 date system starts 1,462 days later (ECMA-376 Part 1 §18.17.4, from memory)
    expect(dateFromSerial(46112 - 1462, true).toISOString().slice(0, 10)).toBe("2026-03-31");
  });

  it("agrees with exceljs, an independent reader, on serials written as date cells", async () => {
    const workbook = new ExcelJS.Workbook();
    const worksheet = workbook.addWorksheet("Dates");
    const serials = [18264, 36526, 45292, 46112, 60000, 73050];
    worksheet.addRow(["Fleet number", ...serials.map((serial) => `D${serial}`)]);
    worksheet.addRow(["RH-014", ...serials]);
    serials.forEach((_, index) => (worksheet.getRow(2).getCell(index + 2).numFmt = "yyyy-mm-dd"));
    const parsed = await parseSpreadsheet(Buffer.from((await workbook.xlsx.writeBuffer()) as unknown as Uint8Array));
    for (const serial of serials) {
      const cell = parsed.rows[0]!.cells[`D${serial}`];
      expect(cell).toBeInstanceOf(Date);
      expect((cell as Date).toISOString().slice(0, 10)).toBe(dateFromSerial(serial).toISOString().slice(0, 10));
    }
  });

  it("reads ISO text, day-first text (Australian order), month names and serials sent as text", () => {
    // Day/month/year is the Australian order: common practice
    const cases: [CellValue, string][] = [
      ["2026-03-31", "2026-03-31"],
      ["2026-03-31T00:00:00", "2026-03-31"],
      ["2026/3/31", "2026-03-31"],
      ["31/03/2026", "2026-03-31"],
      ["1/4/2026", "2026-04-01"],
      ["31-03-2026", "2026-03-31"],
      ["31.03.2026", "2026-03-31"],
      ["31/03/26", "2026-03-31"],
      ["31/03/2026 0:00", "2026-03-31"],
      ["31 Mar 2026", "2026-03-31"],
      ["31-Mar-26", "2026-03-31"],
      ["March 31, 2026", "2026-03-31"],
      ["46112", "2026-03-31"],
      [46112, "2026-03-31"],
      [new Date(Date.UTC(2026, 2, 31)), "2026-03-31"],
    ];
    for (const [input, expected] of cases) expect([input, coerceDate(input, "Registration expiry")]).toEqual([input, { ok: true, value: expected }]);
  });

  it("explains dates it cannot take", () => {
    expect(messageFor("registrationExpiry", "03/31/2026")).toBe('Registration expiry "03/31/2026" has month 31; dates are read day first, as in 31/03/2026');
    expect(messageFor("registrationExpiry", "31/02/2026")).toBe('Registration expiry "31/02/2026" is not a real date');
    expect(messageFor("registrationExpiry", "soon")).toBe(
      'Registration expiry "soon" is not a date we can read; write it as 31/03/2026 (day first) or 2026-03-31',
    );
    expect(messageFor("registrationExpiry", "1/1/1900")).toBe("Registration expiry falls in 1900; it must be between 1950 and 2100");
  });
});

describe("other fields", () => {
  it("accepts common spellings of the status", () => {
    // Rigline's states: in service, in fit-out, grounded, retired (product vocabulary)
    const cases: [string, string][] = [
      ["In service", "in_service"],
      ["in-service", "in_service"],
      ["IN_SERVICE", "in_service"],
      ["Active", "in_service"],
      ["in fit-out", "in_fitout"],
      ["Fitout", "in_fitout"],
      ["Grounded", "grounded"],
      ["U/S", "grounded"],
      ["Off road", "grounded"],
      ["Retired", "retired"],
      ["Disposed", "retired"],
    ];
    for (const [input, state] of cases) expect([input, valueOf("state", input)]).toEqual([input, state]);
    expect(messageFor("state", "QLD")).toBe('Status "QLD" is not one we know; use in service, in fit-out, grounded or retired');
  });

  it("limits the build year to 1950 through next year", () => {
    expect(valueOf("buildYear", "2019")).toBe(2019);
    expect(valueOf("buildYear", 2026)).toBe(2026);
    expect(messageFor("buildYear", 2027)).toBe("Build year 2027 is after next year (2026)");
    expect(messageFor("buildYear", "1949")).toBe("Build year 1949 is before 1950");
    expect(messageFor("buildYear", "MY19")).toBe('Build year "MY19" is not a year; give four digits, such as 2021');
  });

  it("needs a fleet number of at most 32 characters, trimmed", () => {
    expect(valueOf("fleetNumber", "  RH-014 ")).toBe("RH-014");
    expect(valueOf("fleetNumber", 14)).toBe("14");
    expect(messageFor("fleetNumber", null)).toBe("Fleet number is empty; every row needs one");
    expect(messageFor("fleetNumber", "X".repeat(33))).toBe("Fleet number has 33 characters; the most allowed is 32");
  });

  it("keeps line breaks in notes and collapses white space elsewhere", () => {
    expect(valueOf("notes", "Bull bar,\r\n  winch to follow ")).toBe("Bull bar,\nwinch to follow");
    expect(valueOf("depot", " Mulga   Creek ")).toBe("Mulga Creek");
  });
});

describe("validateRows", () => {
  const headers = ["Unit", "Chassis No.", "Odo (km)", "GVM (t)", "Base"];
  const mapping = { Unit: "fleetNumber", "Chassis No.": "vin", "Odo (km)": "odometerKm", "GVM (t)": "gvmKg", Base: null } as const;

  it("reports each bad cell with the row, the file's own heading and the reason", () => {
    const result = validateRows(
      sheet(headers, [
        ["RH-014", "0KW7D70A1NH100101", "84 210", 3.51, "Mulga Creek"],
        ["RH-015", "0KW7D70A1NH10010", "-1250", 3.51, "Mulga Creek"],
        [null, null, "12", null, "Red Gully"],
      ]),
      mapping,
      { now: NOW },
    );
    expect(result.errors).toEqual([
      { row: 3, column: "Chassis No.", field: "vin", message: "A VIN has 17 characters; this one has 16." },
      { row: 3, column: "Odo (km)", field: "odometerKm", message: "Odometer is -1,250 km; it cannot be negative" },
      { row: 4, column: "Unit", field: "fleetNumber", message: "Fleet number is empty; every row needs one" },
    ]);
    expect(result.rejectedRows).toEqual([3, 4]);
    expect(result.valid).toHaveLength(1);
    // A heading in tonnes scales plain numbers: 3.51 t = 3,510 kg (SI Brochure, from memory)
    expect(result.valid[0]).toMatchObject({ rowNumber: 2, values: { fleetNumber: "RH-014", odometerKm: 84210, gvmKg: 3510, depot: null } });
  });

  it("gives every field, null where the file is silent", () => {
    const { valid } = validateRows(sheet(["Fleet number"], [["RH-014"]]), { "Fleet number": "fleetNumber" }, { now: NOW });
    expect(valid[0]?.values).toEqual({
      fleetNumber: "RH-014", vin: null, registration: null, registrationExpiry: null, make: null, model: null, variant: null,
      buildYear: null, depot: null, costCentre: null, state: null, odometerKm: null, kerbMassKg: null, gvmKg: null,
      frontAxleRatingKg: null, rearAxleRatingKg: null, notes: null,
    });
  });

  it("keeps the first of two identical rows and names both row numbers", () => {
    const result = validateRows(
      sheet(headers, [
        ["RH-014", "0KW7D70A1NH100101", "84 210", 3.51, null],
        ["RH-015", null, "100", null, null],
        ["RH-014", "0KW7D70A1NH100101", "84 210", 3.51, null],
      ]),
      mapping,
      { now: NOW },
    );
    expect(result.errors).toEqual([{ row: 4, column: "Unit", field: "fleetNumber", message: "Row 4 repeats row 2 exactly; only row 2 is imported" }]);
    expect(result.valid.map((row) => row.rowNumber)).toEqual([2, 3]);
  });

  it("holds back both rows when two different rows share a fleet number or a VIN", () => {
    const result = validateRows(
      sheet(headers, [
        ["RH-014", "0KW7D70A1NH100101", "84 210", null, null],
        ["rh-014 ", "0KW7D70A3NH100102", "90 000", null, null],
        ["RH-020", "0kw7d70a3nh100102", "5", null, null],
        ["RH-021", null, "5", null, null],
      ]),
      mapping,
      { now: NOW },
    );
    expect(result.errors).toEqual([
      { row: 2, column: "Unit", field: "fleetNumber", message: "Fleet number RH-014 is on rows 2 and 3; keep one of them" },
      { row: 3, column: "Unit", field: "fleetNumber", message: "Fleet number RH-014 is on rows 2 and 3; keep one of them" },
      { row: 3, column: "Chassis No.", field: "vin", message: "VIN 0KW7D70A3NH100102 is on rows 3 and 4; keep one of them" },
      { row: 4, column: "Chassis No.", field: "vin", message: "VIN 0KW7D70A3NH100102 is on rows 3 and 4; keep one of them" },
    ]);
    expect(result.valid.map((row) => row.rowNumber)).toEqual([5]);
  });

  it("reads date serials of a 1904 workbook", () => {
    const { valid } = validateRows(
      sheet(["Fleet number", "Rego expiry"], [["RH-014", 46112 - 1462]], true),
      { "Fleet number": "fleetNumber", "Rego expiry": "registrationExpiry" },
      { now: NOW },
    );
    // 1904 date system offset 1,462 days (ECMA-376 Part 1 §18.17.4, from memory)
    expect(valid[0]?.values.registrationExpiry).toBe("2026-03-31");
  });

  it("refuses a mapping that cannot be used", () => {
    const parsed = sheet(["Unit", "Rego", "Plate"], [["RH-014", "A", "B"]]);
    expect(() => validateRows(parsed, { Rego: "registration" })).toThrow(/No column is mapped to Fleet number/);
    expect(() => validateRows(parsed, { Unit: "fleetNumber", Rego: "registration", Plate: "registration" })).toThrow(/Both "Rego" and "Plate"/);
    expect(() => validateRows(parsed, { Unit: "fleetNo" })).toThrow(/not a vehicle field/);
  });

  it("works end to end from a CSV", async () => {
    const parsed = await parseSpreadsheet(csv("Fleet #;Rego expiry;Kerb weight;GVM (kg)\r\nRH-014;31/03/2026;2 265 kg;\"3,510\"\r\n"));
    const result = validateRows(parsed, { "Fleet #": "fleetNumber", "Rego expiry": "registrationExpiry", "Kerb weight": "kerbMassKg", "GVM (kg)": "gvmKg" }, { now: NOW });
    expect(result.errors).toEqual([]);
    expect(result.valid[0]?.values).toMatchObject({ registrationExpiry: "2026-03-31", kerbMassKg: 2265, gvmKg: 3510 });
  });
});

describe("vehicleImportMappingSchema", () => {
  it("accepts field names or null and refuses anything else", () => {
    expect(vehicleImportMappingSchema.safeParse({ Unit: "fleetNumber", Driver: null }).success).toBe(true);
    const bad = vehicleImportMappingSchema.safeParse({ Unit: "fleet" });
    expect(bad.success).toBe(false);
    expect(bad.error?.issues[0]?.message).toBe("Not a vehicle field");
  });
});
