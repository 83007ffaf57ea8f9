import { describe, expect, it } from "vitest";
import { matchHeaders, parseSpreadsheet, planUpsert, validateRows, type KnownPlatform } from "@/imports";
import { sample } from "./helpers";

// The sample files in imports/samples are what a manager's own register tends to look like.
const NOW = new Date(Date.UTC(2025, 5, 1));
const KNOWN: KnownPlatform[] = [
  { make: "Korrawa", model: "Dunecrest 70", variant: "Single cab chassis" },
  { make: "Korrawa", model: "Dunecrest 70", variant: "Troop carrier" },
  { make: "Veltari", model: "Brolga 4", variant: "Dual cab" },
  { make: "Veltari", model: "Brolga 4", variant: "Wagon" },
];

async function load(name: string) {
  const parsed = await parseSpreadsheet(sample(name), { filename: name });
  const match = matchHeaders(parsed.headers);
  const result = validateRows(parsed, match.mapping, { now: NOW });
  return { parsed, match, result, plan: planUpsert(result.valid, [], { platforms: KNOWN }) };
}

describe("vehicles-clean.csv", () => {
  it("imports all twelve rows with every column matched", async () => {
    const { parsed, match, result, plan } = await load("vehicles-clean.csv");
    expect(parsed.rows).toHaveLength(12);
    expect(match.unknown).toEqual([]);
    expect(result.errors).toEqual([]);
    expect(result.valid).toHaveLength(12);
    expect(plan.counts).toEqual({ create: 12, update: 0, unchanged: 0, error: 0 });
    expect(plan.newPlatforms).toEqual([]);
  });
});

describe("vehicles-messy.csv", () => {
  it("is messy on purpose: byte order mark, semicolons, CRLF, quoted line break", () => {
    const bytes = sample("vehicles-messy.csv");
    expect([...bytes.subarray(0, 3)]).toEqual([0xef, 0xbb, 0xbf]);
    const text = bytes.toString("utf8");
    expect(text).toContain(";");
    expect(text).toContain("\r\n");
    expect(text).toContain('"Bull bar, winch and dual battery;\r\nsnorkel fitted 2024"');
  });

  it("matches its own spellings, lists the unknown column, and reports the bad rows", async () => {
    const { parsed, match, result } = await load("vehicles-messy.csv");
    expect(parsed.delimiter).toBe(";");
    expect(match.mapping).toMatchObject({
      "Fleet #": "fleetNumber", Rego: "registration", "Rego expiry": "registrationExpiry", "Chassis No.": "vin",
      Year: "buildYear", Base: "depot", "Cost center": "costCentre", Status: "state", "Odo (km)": "odometerKm",
      "Kerb weight": "kerbMassKg", "GVM (kg)": "gvmKg", "Front axle (kg)": "frontAxleRatingKg",
      "Rear axle (kg)": "rearAxleRatingKg", Comments: "notes",
    });
    expect(match.unknown).toEqual(["Fuel card"]);
    expect(result.errors).toEqual([
      // 17 characters: ISO 3779 (S)
      { row: 6, column: "Chassis No.", field: "vin", message: "A VIN has 17 characters; this one has 16." },
      { row: 7, column: "Odo (km)", field: "odometerKm", message: "Odometer is -1,250 km; it cannot be negative" },
      { row: 9, column: "Fleet #", field: "fleetNumber", message: "Row 9 repeats row 5 exactly; only row 5 is imported" },
    ]);
    expect(result.valid.map((row) => row.rowNumber)).toEqual([2, 3, 5, 8, 10, 11]);
  });

  it("cleans the messy cells", async () => {
    const { result } = await load("vehicles-messy.csv");
    const byFleet = new Map(result.valid.map((row) => [row.values.fleetNumber, row.values]));
    expect(byFleet.get("MC-101")).toMatchObject({ vin: "0KW7D70A1NH100101", odometerKm: 84210, kerbMassKg: 2265, gvmKg: 3510, registrationExpiry: "2026-03-31", state: "in_service" });
    // Serial 46142 = 46112 + 30 → 2026-04-30 (46112 hand-worked as 2026-03-31; ECMA-376 Part 1 §18.17.4, from memory)
    expect(byFleet.get("MC-102")).toMatchObject({ registrationExpiry: "2026-04-30", odometerKm: 79155, notes: "Bull bar, winch and dual battery;\nsnorkel fitted 2024" });
    expect(byFleet.get("GF-201")).toMatchObject({ depot: "Gibber Flat, North Yard", odometerKm: 141300 });
    // 3.2 t = 3,200 kg (SI Brochure, from memory)
    expect(byFleet.get("GF-203")).toMatchObject({ registrationExpiry: "2026-06-30", odometerKm: 98020, kerbMassKg: 2110, gvmKg: 3200 });
    // Decimal comma "35210,4" read as 35,210.4 km and rounded to whole kilometres (common practice)
    expect(byFleet.get("SD-303")).toMatchObject({ registrationExpiry: "2026-08-31", odometerKm: 35210, state: "grounded" });
  });

  it("names the make and model not yet known, marked ratings missing", async () => {
    const { plan } = await load("vehicles-messy.csv");
    expect(plan.newPlatforms).toEqual([
      {
        make: "Ostrovan", model: "Pindan 6", variant: "Crew cab", rowNumbers: [8],
        ratings: { kerbMassKg: 2480, gvmKg: null, frontAxleRatingKg: null, rearAxleRatingKg: null },
        missingRatings: ["gvmKg", "frontAxleRatingKg", "rearAxleRatingKg"], ratingsMissing: true,
      },
    ]);
  });
});

describe("vehicles-messy.xlsx", () => {
  it("skips the title rows, reads the second sheet not at all, and reports the same bad rows", async () => {
    const { parsed, match, result } = await load("vehicles-messy.xlsx");
    expect(parsed.format).toBe("xlsx");
    expect(parsed.sheetName).toBe("Register");
    expect(parsed.headerRowNumber).toBe(4);
    expect(match.unknown).toEqual(["Fuel card"]);
    expect(match.missingRequired).toEqual([]);
    expect(result.errors).toEqual([
      // 17 characters: ISO 3779 (S)
      { row: 9, column: "VIN", field: "vin", message: "A VIN has 17 characters; this one has 16." },
      { row: 10, column: "Odometer", field: "odometerKm", message: "Odometer is -1,250 km; it cannot be negative" },
      { row: 12, column: "Fleet No", field: "fleetNumber", message: "Row 12 repeats row 8 exactly; only row 8 is imported" },
    ]);
    expect(result.valid.map((row) => row.rowNumber)).toEqual([5, 6, 8, 11, 13]);
  });

  it("takes date cells, a raw date serial, formula results, rich text and numbers stored as text", async () => {
    const { parsed, result } = await load("vehicles-messy.xlsx");
    const raw = new Map(parsed.rows.map((row) => [row.rowNumber, row.cells]));
    expect(raw.get(5)?.["Registration expiry"]).toBeInstanceOf(Date);
    expect(raw.get(6)?.["Registration expiry"]).toBe(46142);
    expect(raw.get(5)?.["Odometer"]).toBe(84210);
    expect(raw.get(6)?.["Odometer"]).toBe("79,155");

    const byFleet = new Map(result.valid.map((row) => [row.values.fleetNumber, row.values]));
    expect(byFleet.get("MC-101")).toMatchObject({ registrationExpiry: "2026-03-31", odometerKm: 84210 });
    // Serial 46142 = 2026-04-30 (hand-worked from 46112 = 2026-03-31; ECMA-376 Part 1 §18.17.4, from memory)
    expect(byFleet.get("MC-102")).toMatchObject({ registrationExpiry: "2026-04-30", odometerKm: 79155, notes: "Bull bar, winch and dual battery;\nsnorkel fitted 2024" });
    expect(byFleet.get("GF-201")).toMatchObject({ odometerKm: 141300 });
    expect(byFleet.get("GF-203")).toMatchObject({ kerbMassKg: 2110, gvmKg: 3200 });
    expect(byFleet.get("RG-402")).toMatchObject({ make: "Ostrovan", odometerKm: 1020, kerbMassKg: 2480, state: "in_fitout" });
  });
});
