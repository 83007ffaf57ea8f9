import { describe, expect, it } from "vitest";
import { VEHICLE_FIELDS, VEHICLE_FIELD_INFO, matchHeaders, normaliseHeader, suggestField } from "@/imports";

describe("normaliseHeader", () => {
  it("sets aside case, punctuation, accents, units and the ways of writing 'number'", () => {
    expect(normaliseHeader("Fleet #")).toBe("fleet number");
    expect(normaliseHeader("FLEET NO.")).toBe("fleet number");
    expect(normaliseHeader("fleet_number")).toBe("fleet number");
    expect(normaliseHeader("fleetNumber")).toBe("fleet number");
    expect(normaliseHeader("Kerb mass (kg)")).toBe("kerb mass");
    expect(normaliseHeader("Odo [km]")).toBe("odo");
    expect(normaliseHeader("GVM kg")).toBe("gvm");
    expect(normaliseHeader("  Coût  centre ")).toBe("cout centre");
    // A heading that is only a unit keeps it.
    expect(normaliseHeader("(km)")).toBe("km");
  });
});

describe("matchHeaders: automatic matching", () => {
  it("matches the common spellings of every field", () => {
    const cases: [string, string][] = [
      ["Fleet No", "fleetNumber"],
      ["Fleet number", "fleetNumber"],
      ["Fleet #", "fleetNumber"],
      ["Unit", "fleetNumber"],
      ["Asset No.", "fleetNumber"],
      ["Rego", "registration"],
      ["Registration", "registration"],
      ["Plate", "registration"],
      ["Number plate", "registration"],
      ["Rego expiry", "registrationExpiry"],
      ["Registration due", "registrationExpiry"],
      ["VIN", "vin"],
      ["VIN No.", "vin"],
      ["Chassis number", "vin"],
      ["Make", "make"],
      ["Manufacturer", "make"],
      ["Model", "model"],
      ["Variant", "variant"],
      ["Year", "buildYear"],
      ["Year of manufacture", "buildYear"],
      ["Depot", "depot"],
      ["Base", "depot"],
      ["Cost centre", "costCentre"],
      ["Cost center", "costCentre"],
      ["Status", "state"],
      ["Odometer", "odometerKm"],
      ["Odo (km)", "odometerKm"],
      ["KMs", "odometerKm"],
      ["Kerb mass (kg)", "kerbMassKg"],
      ["Kerb weight", "kerbMassKg"],
      ["Curb weight", "kerbMassKg"],
      ["GVM (kg)", "gvmKg"],
      ["Gross vehicle mass", "gvmKg"],
      ["Front axle rating (kg)", "frontAxleRatingKg"],
      ["Front axle (kg)", "frontAxleRatingKg"],
      ["Rear axle capacity", "rearAxleRatingKg"],
      ["Comments", "notes"],
    ];
    for (const [header, field] of cases) expect([header, suggestField(header)]).toEqual([header, field]);
  });

  it("does not treat tare as kerb mass", () => {
    // Tare has 10 L of fuel; kerb mass a full tank (ADR Definitions and Vehicle Categories (S))
    expect(suggestField("Tare (kg)")).toBeNull();
  });

  it("matches our own headings and field names", () => {
    for (const field of VEHICLE_FIELDS) {
      expect(suggestField(VEHICLE_FIELD_INFO[field].header)).toBe(field);
      expect(suggestField(field)).toBe(field);
    }
  });

  it("lists unknown columns and reports nothing missing when the fleet number is there", () => {
    const match = matchHeaders(["Fleet #", "Fuel card", "Rego", "Driver"]);
    expect(match.mapping).toEqual({ "Fleet #": "fleetNumber", "Fuel card": null, Rego: "registration", Driver: null });
    expect(match.unknown).toEqual(["Fuel card", "Driver"]);
    expect(match.missingRequired).toEqual([]);
    expect(match.duplicates).toEqual([]);
    expect(match.ready).toBe(true);
  });

  it("reports a missing required field", () => {
    const match = matchHeaders(["Rego", "VIN"]);
    expect(match.missingRequired).toEqual(["fleetNumber"]);
    expect(match.ready).toBe(false);
  });

  it("reports a field claimed twice and keeps the leftmost heading", () => {
    const match = matchHeaders(["Fleet number", "Rego", "Plate"]);
    expect(match.duplicates).toEqual([{ field: "registration", headers: ["Rego", "Plate"], kept: "Rego" }]);
    expect(match.mapping["Plate"]).toBeNull();
    expect(match.mapping["Rego"]).toBe("registration");
    expect(match.unknown).toEqual([]);
  });
});

describe("matchHeaders: a saved or corrected mapping", () => {
  it("overrides automatic matching for the headings it names", () => {
    const match = matchHeaders(["Unit", "Plate", "Base", "Driver"], { Base: null, Driver: "notes", Plate: "registration" });
    expect(match.mapping).toEqual({ Unit: "fleetNumber", Plate: "registration", Base: null, Driver: "notes" });
    expect(match.sources).toEqual({ Unit: "automatic", Plate: "saved", Driver: "saved" });
    // A column the user chose to leave out is not "unknown".
    expect(match.unknown).toEqual([]);
  });

  it("lets the user's choice win a clash with an automatic match", () => {
    const match = matchHeaders(["Fleet number", "Rego", "Plate"], { Plate: "registration" });
    expect(match.duplicates).toEqual([{ field: "registration", headers: ["Rego", "Plate"], kept: "Plate" }]);
    expect(match.mapping["Rego"]).toBeNull();
  });

  it("ignores headings the file does not have and refuses unknown field names", () => {
    expect(matchHeaders(["Unit"], { "Old column": "notes" }).mapping).toEqual({ Unit: "fleetNumber" });
    expect(() => matchHeaders(["Unit"], { Unit: "fleetNo" })).toThrow(/not a vehicle field/);
  });

  it("can map the fleet number by hand when no heading matches", () => {
    const match = matchHeaders(["Call sign", "Rego"], { "Call sign": "fleetNumber" });
    expect(match.missingRequired).toEqual([]);
    expect(match.ready).toBe(true);
  });
});
