import { describe, expect, it } from "vitest";
import { InputError } from "@/lib/errors";
import {
  fleetVariance,
  varianceStatus,
  vehicleVariance,
  type EditionLine,
  type Fitment,
  type VehicleVariance,
} from "@/lib/variance";
import { NOW, concession, daysFromNow, fitment, line } from "./fixtures";

// All expectations here are Rigline rules (our own variance and roll-up rules), hand-worked in
// the comments from the invented inputs.

describe("vehicleVariance", () => {
  const lines: EditionLine[] = [
    line({ id: "l1", code: "TY-01", category: "tyres", quantity: 4, criteria: [{ attribute: "loadIndex", op: "gte", value: 116 }] }),
    line({ id: "l2", code: "RC-01", category: "recovery", title: "Recovery kit" }),
    line({ id: "l3", code: "CM-01", category: "communications", criteria: [{ attribute: "powerW", unit: "W", op: "gte", value: 5 }] }),
    line({ id: "l4", code: "WD-01", category: "water_dust", evidenceNeeded: ["certificate"] }),
    line({ id: "l5", code: "PR-01", category: "protection", title: "Front protection bar" }),
    line({ id: "l6", code: "SA-02", category: "safety", title: "First-aid kit" }),
    line({ id: "l7", code: "LR-09", category: "lighting_roof", requirement: "must_not_fit" }),
    line({ id: "l8", code: "ST-04", category: "storage", requirement: "may_fit" }),
    line({ id: "l9", code: "SD-03", category: "steering_driveline", requirement: "must_not_fit" }),
  ];
  const fitments: Fitment[] = [
    fitment({ id: "f1", lineId: "l1", quantity: 4, attributes: { loadIndex: 121 } }),
    fitment({ id: "f3", lineId: "l3", attributes: { powerW: 1 } }),
    fitment({ id: "f4", lineId: "l4", evidence: [{ kind: "certificate", status: "lodged" }] }),
    fitment({ id: "f6", lineId: "l6", expiresAt: daysFromNow(-5) }),
    fitment({ id: "f7", lineId: "l7", label: "Roof-top tent" }),
    fitment({ id: "f10", lineId: null, label: "Camp fridge" }),
    fitment({ id: "f11", lineId: "l-of-another-edition", label: "Old-pattern rear bar" }),
    fitment({ id: "f12", lineId: null, label: "Removed cargo barrier", removedAt: daysFromNow(-2) }),
  ];
  const concessions = [concession({ lineId: "l5" }), concession({ lineId: "l-unknown" })];

  it("judges every line and counts the summary by hand", () => {
    const v = vehicleVariance({ lines, fitments, concessions, now: NOW });
    // Rigline rule, line by line:
    //   l1 4 tyres, LI 121 ≥ 116 → meets      l2 nothing fitted → short
    //   l3 1 W < 5 W → off_spec               l4 certificate only lodged → unproven
    //   l5 missing, concession current → concession
    //   l6 kit expired 5 days ago → short     l7 must-not-fit, fitted → prohibited_fitted
    //   l8 may-fit, absent → optional_absent (counted nowhere)
    //   l9 must-not-fit, absent → meets
    //   extras: f10 (no line), f11 (line of another edition); f12 removed → not listed.
    expect(v.lines.map((l) => [l.lineId, l.status])).toEqual([
      ["l1", "meets"],
      ["l2", "short"],
      ["l3", "off_spec"],
      ["l4", "unproven"],
      ["l5", "concession"],
      ["l6", "short"],
      ["l7", "prohibited_fitted"],
      ["l8", "optional_absent"],
      ["l9", "meets"],
    ]);
    // meets 2 + short 2 + offSpec 1 + unproven 1 + concession 1 + prohibited 1 = 8 = 9 lines − 1 optional.
    expect(v.summary).toEqual({ meets: 2, short: 2, offSpec: 1, unproven: 1, concession: 1, prohibitedFitted: 1, extra: 2 });
    expect(v.extras).toEqual([
      { fitmentId: "f10", label: "Camp fridge" },
      { fitmentId: "f11", label: "Old-pattern rear bar" },
    ]);
    expect(varianceStatus(v)).toBe("gaps");
  });

  it("names the field of a bad fitment by its index", () => {
    // Rigline rule.
    const bad = [...fitments, { ...fitments[0]!, fittedAt: new Date(Number.NaN) }];
    try {
      vehicleVariance({ lines, fitments: bad, concessions, now: NOW });
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(InputError);
      expect((e as InputError).field).toBe("fitments.8.fittedAt");
    }
  });
});

describe("varianceStatus", () => {
  const summary = { meets: 3, short: 0, offSpec: 0, unproven: 0, concession: 0, prohibitedFitted: 0, extra: 0 };
  const v = (s: Partial<typeof summary>): VehicleVariance => ({ summary: { ...summary, ...s }, lines: [], extras: [] });
  it("meets_standard, gaps and no_edition", () => {
    // Rigline rule: concessions and extras do not stop a vehicle meeting; short, off_spec,
    // unproven or prohibited_fitted do.
    expect(varianceStatus(v({}))).toBe("meets_standard");
    expect(varianceStatus(v({ concession: 2, extra: 1 }))).toBe("meets_standard");
    expect(varianceStatus(v({ short: 1 }))).toBe("gaps");
    expect(varianceStatus(v({ offSpec: 1 }))).toBe("gaps");
    expect(varianceStatus(v({ unproven: 1 }))).toBe("gaps");
    expect(varianceStatus(v({ prohibitedFitted: 1 }))).toBe("gaps");
    expect(varianceStatus(null)).toBe("no_edition");
    expect(varianceStatus(undefined)).toBe("no_edition");
  });
});

describe("fleetVariance", () => {
  const lines: EditionLine[] = [
    line({ id: "LA", category: "recovery", quantity: 2, massKg: 12.5, standardCostCents: 40_000 }),
    line({ id: "LB", category: "communications", massKg: 3, standardCostCents: 15_000, criteria: [{ attribute: "powerW", op: "gte", value: 5 }] }),
    line({ id: "LC", category: "water_dust", massKg: 0, standardCostCents: 5_000, evidenceNeeded: ["photo"] }),
  ];
  const okA = fitment({ id: "a", lineId: "LA", quantity: 2 });
  const okB = fitment({ id: "b", lineId: "LB", attributes: { powerW: 5 } });
  const okC = fitment({ id: "c", lineId: "LC", evidence: [{ kind: "photo", status: "accepted" }] });
  const vv = (fitments: Fitment[], concessions = [] as ReturnType<typeof concession>[]) =>
    vehicleVariance({ lines, fitments, concessions, now: NOW });

  const fleet = fleetVariance([
    // V1: everything fitted and proven → meets_standard.
    { vehicleId: "V1", depotId: "D-North", platformId: "P-A", variance: vv([okA, okB, okC]) },
    // V2: LA missing (short 2 → 2 × 12.5 = 25 kg, 40 000 c), LB 1 W (off_spec, 15 000 c).
    { vehicleId: "V2", depotId: "D-North", platformId: "P-A", variance: vv([{ ...okB, attributes: { powerW: 1 } }, okC]) },
    // V3: LA 1 of 2 (short 1 → 12.5 kg, 40 000 c), LB missing under concession (0), LC lodged
    //     only (unproven, 0 c).
    {
      vehicleId: "V3",
      depotId: "D-South",
      platformId: "P-A",
      variance: vv([{ ...okA, quantity: 1 }, { ...okC, evidence: [{ kind: "photo", status: "lodged" }] }], [concession({ lineId: "LB" })]),
    },
    // V4: all fitted plus an extra → meets_standard.
    { vehicleId: "V4", depotId: "D-South", platformId: "P-B", variance: vv([okA, okB, okC, fitment({ id: "x", label: "Awning" })]) },
    // V5: no edition assigned.
    { vehicleId: "V5", depotId: "D-South", platformId: "P-B", variance: null },
  ]);

  it("shares fully meeting overall, leaving out vehicles with no edition", () => {
    // Rigline rule: 2 meeting (V1, V4) of 4 with an edition → 0.5; V5 counted as no_edition.
    expect(fleet.overall).toEqual({
      vehicles: 5,
      withEdition: 4,
      noEdition: 1,
      fullyMeeting: 2,
      shareFullyMeeting: 0.5,
      costToCloseCents: 95_000, // V2 55 000 + V3 40 000
      massToCloseKg: 37.5, // V2 25 + V3 12.5
    });
    expect(fleet.vehicleStatusCounts).toEqual({ meets_standard: 2, gaps: 2, no_edition: 1 });
  });

  it("splits by depot and by platform", () => {
    // Rigline rule, by hand: D-North V1 ✓ V2 ✗ → 1/2; D-South V3 ✗ V4 ✓ V5 none → 1/2.
    // P-A V1 ✓ V2 ✗ V3 ✗ → 1/3; P-B V4 ✓ V5 none → 1/1.
    const depot = Object.fromEntries(fleet.byDepot.map((d) => [d.depotId, d]));
    expect(depot["D-North"]).toMatchObject({ vehicles: 2, fullyMeeting: 1, shareFullyMeeting: 0.5, costToCloseCents: 55_000, massToCloseKg: 25 });
    expect(depot["D-South"]).toMatchObject({ vehicles: 3, withEdition: 2, noEdition: 1, fullyMeeting: 1, shareFullyMeeting: 0.5, costToCloseCents: 40_000, massToCloseKg: 12.5 });
    const platform = Object.fromEntries(fleet.byPlatform.map((p) => [p.platformId, p]));
    expect(platform["P-A"]?.shareFullyMeeting).toBeCloseTo(1 / 3, 12);
    expect(platform["P-A"]).toMatchObject({ vehicles: 3, fullyMeeting: 1, costToCloseCents: 95_000, massToCloseKg: 37.5 });
    expect(platform["P-B"]).toMatchObject({ vehicles: 2, withEdition: 1, fullyMeeting: 1, shareFullyMeeting: 1, costToCloseCents: 0 });
  });

  it("counts line statuses over the fleet and per vehicle", () => {
    // Rigline rule: V1 3 meets; V2 short, off_spec, meets; V3 short, concession, unproven;
    // V4 3 meets + 1 extra.
    expect(fleet.statusCounts).toEqual({ meets: 7, short: 2, offSpec: 1, unproven: 1, concession: 1, prohibitedFitted: 0, extra: 1 });
    expect(fleet.vehicles.map((v) => [v.vehicleId, v.status, v.costToCloseCents, v.massToCloseKg])).toEqual([
      ["V1", "meets_standard", 0, 0],
      ["V2", "gaps", 55_000, 25],
      ["V3", "gaps", 40_000, 12.5],
      ["V4", "meets_standard", 0, 0],
      ["V5", "no_edition", 0, 0],
    ]);
  });

  it("gives a null share, not NaN, when no vehicle has an edition", () => {
    // Rigline rule: nothing to meet → no share.
    const r = fleetVariance([{ vehicleId: "V9", depotId: null, platformId: null }]);
    expect(r.overall.shareFullyMeeting).toBeNull();
    expect(fleetVariance([]).overall.shareFullyMeeting).toBeNull();
  });

  it("refuses a vehicle listed twice", () => {
    // Rigline rule.
    const v = { vehicleId: "V1", depotId: "D", platformId: "P", variance: null };
    expect(() => fleetVariance([v, v])).toThrow(InputError);
  });
});

describe("scale sanity (5,000 vehicles × 60 lines)", () => {
  it("gives the right counts", () => {
    // Rigline rule. 60 lines, every third with a criterion the fitments pass. Vehicle i lacks
    // line j when (i + j) % 10 === 0: exactly 6 of 60 lines per vehicle → 6 short, 54 meets.
    // Each line 2 kg × 1 and 1 000 c → per vehicle 12 kg and 6 000 c; fleet 60 000 kg and
    // 30 000 000 c. (Timing belongs in the benchmark, not here.)
    const editionLines = Array.from({ length: 60 }, (_, j) =>
      line({
        id: `L${j}`,
        massKg: 2,
        standardCostCents: 1_000,
        criteria: j % 3 === 0 ? [{ attribute: "rating", op: "gte", value: 100 }] : [],
      }),
    );
    const vehicles = Array.from({ length: 5_000 }, (_, i) => {
      const fitments: Fitment[] = [];
      for (let j = 0; j < 60; j++) {
        if ((i + j) % 10 !== 0) fitments.push(fitment({ id: `F${i}-${j}`, lineId: `L${j}`, attributes: { rating: 120 } }));
      }
      const variance = vehicleVariance({ lines: editionLines, fitments, concessions: [], now: NOW });
      return { vehicleId: `V${i}`, depotId: `D${i % 7}`, platformId: `P${i % 3}`, variance };
    });
    expect(vehicles[0]?.variance.summary).toEqual({ meets: 54, short: 6, offSpec: 0, unproven: 0, concession: 0, prohibitedFitted: 0, extra: 0 });
    const fleet = fleetVariance(vehicles);
    expect(fleet.statusCounts.short).toBe(30_000);
    expect(fleet.statusCounts.meets).toBe(270_000);
    expect(fleet.vehicleStatusCounts.gaps).toBe(5_000);
    expect(fleet.overall.costToCloseCents).toBe(30_000_000);
    expect(fleet.overall.massToCloseKg).toBe(60_000);
    expect(fleet.byDepot).toHaveLength(7);
  });
});
