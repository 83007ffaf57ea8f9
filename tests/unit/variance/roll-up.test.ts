import { describe, expect, it } from "vitest";
import { InputError } from "@/lib/errors";
import { fleetVariance, rollUpFleet, statusOfSummary, vehicleFigures, vehicleVariance, type EditionLine, type Fitment } from "@/lib/variance";
import { NOW, fitment, line } from "./fixtures";

// Rigline rules (our own roll-up): the fleet figures rolled up from each vehicle's stored
// figures must be those rolled up from its full variance. Inputs invented, worked by hand.

describe("rollUpFleet from stored figures", () => {
  const lines: EditionLine[] = [
    line({ id: "LA", category: "recovery", quantity: 2, massKg: 12.5, standardCostCents: 40_000 }),
    line({ id: "LB", category: "communications", massKg: 0.1, standardCostCents: 15_000 }),
  ];
  const vv = (fitments: Fitment[]) => vehicleVariance({ lines, fitments, concessions: [], now: NOW });
  const inputs = [
    // V1: both lines fitted → meets_standard, nothing to close.
    { vehicleId: "V1", depotId: "D1", platformId: "P1", variance: vv([fitment({ id: "a", lineId: "LA", quantity: 2 }), fitment({ id: "b", lineId: "LB" })]) },
    // V2: LA 1 of 2 and LB missing → short twice: 40 000 + 15 000 c, 12.5 + 0.1 kg.
    { vehicleId: "V2", depotId: "D1", platformId: "P2", variance: vv([fitment({ id: "c", lineId: "LA", quantity: 1 })]) },
    // V3: no edition.
    { vehicleId: "V3", depotId: null, platformId: "P2", variance: null },
  ];

  it("gives the same fleet as fleetVariance", () => {
    const figures = inputs.map((v) => {
      const { summary, costToCloseCents, massToCloseKg } = vehicleFigures(v.variance);
      return { vehicleId: v.vehicleId, depotId: v.depotId, platformId: v.platformId, summary, costToCloseCents, massToCloseKg };
    });
    expect(rollUpFleet(figures)).toEqual(fleetVariance(inputs));
    expect(figures[1]).toMatchObject({ costToCloseCents: 55_000, massToCloseKg: 12.6 });
  });

  it("reads the status from the counts alone", () => {
    expect(statusOfSummary(null)).toBe("no_edition");
    expect(statusOfSummary({ meets: 3, short: 0, offSpec: 0, unproven: 0, concession: 1, prohibitedFitted: 0, extra: 2 })).toBe("meets_standard");
    expect(statusOfSummary({ meets: 3, short: 0, offSpec: 0, unproven: 1, concession: 0, prohibitedFitted: 0, extra: 0 })).toBe("gaps");
  });

  it("refuses a vehicle listed twice and a negative cost", () => {
    const one = { vehicleId: "V1", depotId: null, platformId: null, summary: null, costToCloseCents: 0, massToCloseKg: 0 };
    expect(() => rollUpFleet([one, one])).toThrow(InputError);
    expect(() => rollUpFleet([{ ...one, costToCloseCents: -1 }])).toThrow(InputError);
  });
});
