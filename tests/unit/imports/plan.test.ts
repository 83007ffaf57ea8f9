import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { matchHeaders, parseSpreadsheet, planUpsert, validateRows, type ExistingVehicle, type ValidRow } from "@/imports";
import { sample } from "./helpers";
import { applyPlan, row } from "./plan-helpers";

const NOW = new Date(Date.UTC(2025, 5, 1));
const VIN_A = "0KW7D70A1NH100101";
const VIN_B = "0KW7D70A3NH100102";
const VIN_C = "0VT4B40D2MK200201";

const register: ExistingVehicle[] = [
  { id: "v1", fleetNumber: "MC-101", vin: VIN_A, depot: "Mulga Creek", odometerKm: 80000, registrationExpiry: new Date(Date.UTC(2026, 2, 31)), make: "Korrawa", model: "Dunecrest 70", variant: "Single cab chassis" },
  { id: "v2", fleetNumber: "MC-102", vin: null, depot: "Mulga Creek", odometerKm: 79000, state: "in_service" },
  { id: "v3", fleetNumber: "GF-201", vin: VIN_C, depot: "Gibber Flat" },
];

describe("planUpsert", () => {
  it("creates unknown vehicles, updates changed ones with before and after, and leaves the rest", () => {
    const plan = planUpsert(
      [
        row(2, { fleetNumber: "MC-101", vin: VIN_A, depot: "Mulga Creek", odometerKm: 80000, registrationExpiry: "2026-03-31" }),
        row(3, { fleetNumber: "MC-102", odometerKm: 81250, state: "grounded" }),
        row(4, { fleetNumber: "RG-401", vin: VIN_B, depot: "Red Gully" }),
      ],
      register,
    );
    expect(plan.rows).toEqual([
      { action: "unchanged", rowNumber: 2, vehicleId: "v1", matchedBy: "vin" },
      {
        action: "update", rowNumber: 3, vehicleId: "v2", matchedBy: "fleetNumber", warnings: [],
        changes: [
          { field: "state", before: "in_service", after: "grounded" },
          { field: "odometerKm", before: 79000, after: 81250 },
        ],
      },
      { action: "create", rowNumber: 4, values: expect.objectContaining({ fleetNumber: "RG-401", vin: VIN_B }) },
    ]);
    expect(plan.counts).toEqual({ create: 1, update: 1, unchanged: 1, error: 0 });
  });

  it("matches by VIN before fleet number, so a renumbered vehicle is updated, not duplicated", () => {
    const plan = planUpsert([row(2, { fleetNumber: "MC-150", vin: VIN_A })], register);
    expect(plan.rows).toEqual([
      {
        action: "update", rowNumber: 2, vehicleId: "v1", matchedBy: "vin",
        changes: [{ field: "fleetNumber", before: "MC-101", after: "MC-150" }],
        warnings: ["Fleet number changes from MC-101 to MC-150"],
      },
    ]);
  });

  it("refuses a row whose VIN is one vehicle and whose fleet number is another", () => {
    const plan = planUpsert([row(7, { fleetNumber: "GF-201", vin: VIN_A })], register);
    expect(plan.rows).toEqual([
      { action: "error", rowNumber: 7, field: "fleetNumber", message: `VIN ${VIN_A} is vehicle MC-101, but fleet number GF-201 is another vehicle; correct one of them` },
    ]);
  });

  it("warns when a row found by fleet number replaces a stored VIN", () => {
    const plan = planUpsert([row(2, { fleetNumber: "GF-201", vin: VIN_B })], register);
    expect(plan.rows[0]).toMatchObject({
      action: "update", matchedBy: "fleetNumber",
      changes: [{ field: "vin", before: VIN_C, after: VIN_B }],
      warnings: [`VIN changes from ${VIN_C} to ${VIN_B}; check this is the same vehicle`],
    });
  });

  it("refuses a second row that reaches a vehicle already updated", () => {
    const plan = planUpsert([row(2, { fleetNumber: "MC-150", vin: VIN_A }), row(3, { fleetNumber: "MC-101" })], register);
    expect(plan.rows[1]).toEqual({ action: "error", rowNumber: 3, field: "fleetNumber", message: "Row 2 already updates vehicle MC-101; one row per vehicle" });
  });

  it("never clears a stored value from an empty cell and compares fleet numbers without case", () => {
    const plan = planUpsert([row(2, { fleetNumber: "mc-102" })], register);
    expect(plan.rows[0]).toMatchObject({ action: "update", changes: [{ field: "fleetNumber", before: "MC-102", after: "mc-102" }] });
    const same = planUpsert([row(2, { fleetNumber: "MC-102", depot: null, odometerKm: null })], register);
    expect(same.rows[0]?.action).toBe("unchanged");
  });

  it("refuses a register with a repeated id", () => {
    expect(() => planUpsert([], [register[0]!, register[0]!])).toThrow(/appears twice/);
  });

  it("lists make/model/variant combinations that would need a new platform, marking missing ratings", () => {
    const plan = planUpsert(
      [
        row(2, { fleetNumber: "RG-402", make: "Ostrovan", model: "Pindan 6", variant: "Crew cab", kerbMassKg: 2480 }),
        row(3, { fleetNumber: "RG-403", make: "ostrovan ", model: "Pindan 6", variant: "crew cab", gvmKg: 3600 }),
        row(4, { fleetNumber: "RG-404", make: "Veltari", model: "Brolga 4", variant: "Dual cab", kerbMassKg: 2110, gvmKg: 3200, frontAxleRatingKg: 1350, rearAxleRatingKg: 1950 }),
        row(5, { fleetNumber: "RG-405", make: "Korrawa", model: "Dunecrest 70", variant: "Single cab chassis" }),
        row(6, { fleetNumber: "RG-406", make: "Korrawa", model: "Dunecrest 70", variant: "Wagon" }),
      ],
      register,
      { platforms: [{ make: "Korrawa", model: "Dunecrest 70", variant: "Wagon" }] },
    );
    expect(plan.newPlatforms).toEqual([
      {
        make: "Ostrovan", model: "Pindan 6", variant: "Crew cab", rowNumbers: [2, 3],
        ratings: { kerbMassKg: 2480, gvmKg: 3600, frontAxleRatingKg: null, rearAxleRatingKg: null },
        missingRatings: ["frontAxleRatingKg", "rearAxleRatingKg"], ratingsMissing: true,
      },
      {
        make: "Veltari", model: "Brolga 4", variant: "Dual cab", rowNumbers: [4],
        ratings: { kerbMassKg: 2110, gvmKg: 3200, frontAxleRatingKg: 1350, rearAxleRatingKg: 1950 },
        missingRatings: [], ratingsMissing: false,
      },
    ]);
  });

  it("judges the platform a vehicle is left with, keeping a stored variant the row leaves empty", () => {
    const stored: ExistingVehicle[] = [{ id: 9, fleetNumber: "RG-410", vin: null, variant: "Crew cab" }];
    const plan = planUpsert([row(2, { fleetNumber: "RG-410", make: "Ostrovan", model: "Pindan 6" })], stored);
    expect(plan.newPlatforms.map(({ make, model, variant }) => [make, model, variant])).toEqual([["Ostrovan", "Pindan 6", "Crew cab"]]);
  });
});

describe("re-importing the same file changes nothing", () => {
  it("plans only 'unchanged' the second time for each sample file", async () => {
    for (const name of ["vehicles-clean.csv", "vehicles-messy.csv", "vehicles-messy.xlsx"]) {
      const parsed = await parseSpreadsheet(sample(name));
      const { valid } = validateRows(parsed, matchHeaders(parsed.headers).mapping, { now: NOW });
      const first = planUpsert(valid, register);
      expect(first.counts.error).toBe(0);
      const after = applyPlan(register, first);
      const second = planUpsert(valid, after);
      expect([name, second.counts]).toEqual([name, { create: 0, update: 0, unchanged: valid.length, error: 0 }]);
      expect(second.newPlatforms).toEqual([]);
    }
  });

  it("holds for any rows and register (property)", () => {
    const fleets = ["RH-1", "RH-2", "RH-3", "RH-4", "rh-4", "RH-5"];
    const vins = [VIN_A, VIN_B, VIN_C, "0SV6P60C3RT400402", "0VT4B40D6NK200203"];
    const maybe = <T>(arb: fc.Arbitrary<T>) => fc.option(arb, { nil: null });
    const values = {
      vin: maybe(fc.constantFrom(...vins)),
      depot: maybe(fc.constantFrom("Mulga Creek", "Red Gully")),
      odometerKm: maybe(fc.integer({ min: 0, max: 300_000 })),
      state: maybe(fc.constantFrom("in_service" as const, "grounded" as const)),
      registrationExpiry: maybe(fc.constantFrom("2026-03-31", "2025-12-31")),
      make: maybe(fc.constantFrom("Korrawa", "Veltari")),
      model: maybe(fc.constantFrom("Dunecrest 70", "Brolga 4")),
      variant: maybe(fc.constantFrom("Dual cab", "Wagon")),
    };
    const rowsArb = fc
      .array(fc.record({ fleetNumber: fc.constantFrom(...fleets), ...values }), { maxLength: 6 })
      .map((list) => {
        // validateRows lets through at most one row per fleet number and per VIN.
        const seenFleet = new Set<string>();
        const seenVin = new Set<string>();
        const kept: ValidRow[] = [];
        for (const candidate of list) {
          const fleetKey = candidate.fleetNumber.toUpperCase();
          if (seenFleet.has(fleetKey) || (candidate.vin !== null && seenVin.has(candidate.vin))) continue;
          seenFleet.add(fleetKey);
          if (candidate.vin !== null) seenVin.add(candidate.vin);
          kept.push(row(kept.length + 2, candidate));
        }
        return kept;
      });
    const registerArb = fc
      .array(fc.record({ fleetNumber: fc.constantFrom(...fleets), ...values }), { maxLength: 5 })
      .map((list) => list.map((vehicle, index): ExistingVehicle => ({ id: index + 1, ...vehicle })));
    fc.assert(
      fc.property(rowsArb, registerArb, (rows, existing) => {
        fc.pre(planUpsert(rows, existing).counts.error === 0);
        const first = planUpsert(rows, existing);
        const second = planUpsert(rows, applyPlan(existing, first));
        // Rows the first plan refused may read differently once the others are applied, so the
        // promise is for a file the first plan accepted whole.
        if (first.counts.error === 0) {
          expect(second.rows.map((planned) => planned.action)).toEqual(rows.map(() => "unchanged"));
          expect(second.newPlatforms).toEqual([]);
        }
      }),
      { numRuns: 500 },
    );
  });
});
