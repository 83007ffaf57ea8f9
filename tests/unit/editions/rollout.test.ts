import { describe, expect, it } from "vitest";
import { InputError } from "@/lib/errors";
import { copyEditionLines, rolloutPreview } from "@/lib/editions";
import type { EditionLine, Fitment } from "@/lib/variance";
import { NOW, concession, daysFromNow, fitment, line } from "../variance/fixtures";

// Rigline rules (our roll-out preview): short lines under the new edition are costed at their
// standard cost; short must-fit lines add massKg × missing quantity; off-spec lines are costed
// apart. Every total below is worked by hand in the comments.

// Current edition E1.
const e1: EditionLine[] = [
  line({ id: "e1-tyres", key: "k-tyres", code: "TY-01", category: "tyres", quantity: 4, massKg: 6, standardCostCents: 120_000, criteria: [{ attribute: "loadIndex", op: "gte", value: 116 }] }),
  line({ id: "e1-kit", key: "k-kit", code: "SA-01", category: "safety", massKg: 4, standardCostCents: 9_000 }),
  line({ id: "e1-radio", key: "k-radio", code: "CM-01", category: "communications", massKg: 1.5, standardCostCents: 45_000 }),
];

// New edition E2: a copy of E1 with the tyre load index raised to 121, plus three lines.
let n = 0;
const e2: EditionLine[] = copyEditionLines(e1, () => `e2-${++n}`).map((l) =>
  l.key === "k-tyres" ? { ...l, criteria: [{ attribute: "loadIndex", op: "gte" as const, value: 121 }] } : l,
);
e2.push(
  line({ id: "e2-tracks", key: "k-tracks", code: "RC-01", category: "recovery", quantity: 2, massKg: 7.5, standardCostCents: 35_000 }),
  line({ id: "e2-ext", key: "k-ext", code: "SA-02", category: "safety", massKg: 2.5, standardCostCents: 12_000 }),
  line({ id: "e2-jerry", key: "k-jerry", code: "ST-05", category: "storage", requirement: "may_fit", massKg: 20, standardCostCents: 15_000 }),
);

const tyres = (loadIndex: number): Fitment => fitment({ id: `t${loadIndex}`, lineId: "e1-tyres", quantity: 4, attributes: { loadIndex } });
const kit = fitment({ id: "kit", lineId: "e1-kit" });
const radio = fitment({ id: "radio", lineId: "e1-radio" });

const preview = rolloutPreview({
  lines: e2,
  now: NOW,
  vehicles: [
    // V1: LI 121 tyres, kit, radio, plus a fridge (extra). Under E2: tracks short 2 → 2 × 7.5 =
    //     15 kg, 35 000 c; extinguisher short 1 → 2.5 kg, 12 000 c. Cost 47 000, mass 17.5.
    { vehicleId: "V1", currentLines: e1, fitments: [tyres(121), kit, radio, fitment({ id: "fridge", label: "Camp fridge" })], concessions: [] },
    // V2: LI 116 tyres (met E1, fails E2: off-spec, 120 000 c apart), radio, kit missing under a
    //     current concession (carried by key → concession), one track already fitted against E2's
    //     line. Under E2: tracks short 1 → 7.5 kg, 35 000 c; extinguisher → 2.5 kg, 12 000 c.
    //     Cost 47 000, mass 10, off-spec 120 000.
    {
      vehicleId: "V2",
      currentLines: e1,
      fitments: [tyres(116), radio, fitment({ id: "track", lineId: "e2-tracks", quantity: 1 })],
      concessions: [concession({ lineId: "e1-kit" })],
    },
    // V3: no current edition, nothing fitted. Every must-fit line short:
    //     tyres 4 × 6 = 24 kg, 120 000 c; kit 4 kg, 9 000; radio 1.5 kg, 45 000;
    //     tracks 15 kg, 35 000; extinguisher 2.5 kg, 12 000 → cost 221 000, mass 47.
    //     The may-fit jerry can is optional_absent: no cost, no mass.
    { vehicleId: "V3", fitments: [], concessions: [] },
    // V4: LI 121 tyres, radio, kit expired (short under E1 already). Under E2: kit 4 kg, 9 000;
    //     tracks 15 kg, 35 000; extinguisher 2.5 kg, 12 000 → cost 56 000, mass 21.5.
    { vehicleId: "V4", currentLines: e1, fitments: [tyres(121), radio, { ...kit, expiresAt: daysFromNow(-1) }], concessions: [] },
  ],
});

describe("rolloutPreview", () => {
  it("per vehicle: short lines, cost and added mass", () => {
    // Rigline rule.
    const byId = Object.fromEntries(preview.vehicles.map((v) => [v.vehicleId, v]));
    expect(byId.V1?.shortLines.map((g) => [g.key, g.missingQuantity, g.costCents, g.addedMassKg, g.already])).toEqual([
      ["k-tracks", 2, 35_000, 15, false],
      ["k-ext", 1, 12_000, 2.5, false],
    ]);
    expect(byId.V1).toMatchObject({ costCents: 47_000, addedMassKg: 17.5, offSpecCostCents: 0 });

    expect(byId.V2?.shortLines.map((g) => [g.key, g.missingQuantity, g.addedMassKg])).toEqual([
      ["k-tracks", 1, 7.5],
      ["k-ext", 1, 2.5],
    ]);
    expect(byId.V2?.offSpecLines.map((g) => [g.key, g.costCents, g.already])).toEqual([["k-tyres", 120_000, false]]);
    expect(byId.V2).toMatchObject({ costCents: 47_000, addedMassKg: 10, offSpecCostCents: 120_000 });

    expect(byId.V3?.shortLines.map((g) => g.key)).toEqual(["k-tyres", "k-kit", "k-radio", "k-tracks", "k-ext"]);
    expect(byId.V3).toMatchObject({ costCents: 221_000, addedMassKg: 47 });

    expect(byId.V4?.shortLines.map((g) => [g.key, g.already])).toEqual([
      ["k-kit", true],
      ["k-tracks", false],
      ["k-ext", false],
    ]);
    expect(byId.V4).toMatchObject({ costCents: 56_000, addedMassKg: 21.5 });
  });

  it("totals", () => {
    // Rigline rule.
    // Short lines 2 + 2 + 5 + 3 = 12, of which 1 (V4's kit) is short today too.
    // Cost 47 000 + 47 000 + 221 000 + 56 000 = 371 000 c ($3,710.00).
    // Mass 17.5 + 10 + 47 + 21.5 = 96 kg. Off-spec: 1 line, 120 000 c.
    expect(preview.totals).toEqual({
      vehicles: 4,
      vehiclesWithShortLines: 4,
      shortLines: 12,
      alreadyShortLines: 1,
      offSpecLines: 1,
      costCents: 371_000,
      offSpecCostCents: 120_000,
      addedMassKg: 96,
    });
  });

  it("a short may-fit line costs its standard cost but adds no mass", () => {
    // Rigline rule.
    // A jerry can carried past its expiry: may-fit short → 15 000 c, 0 kg.
    const r = rolloutPreview({
      lines: e2.filter((l) => l.key === "k-jerry"),
      now: NOW,
      vehicles: [{ vehicleId: "V9", fitments: [fitment({ id: "j", lineId: "e2-jerry", expiresAt: daysFromNow(-3) })], concessions: [] }],
    });
    expect(r.totals).toMatchObject({ shortLines: 1, costCents: 15_000, addedMassKg: 0 });
  });

  it("points a bad fitment error at the vehicle it belongs to", () => {
    // Rigline rule.
    const bad = { ...kit, quantity: -2 };
    try {
      rolloutPreview({ lines: e2, now: NOW, vehicles: [{ vehicleId: "V1", currentLines: e1, fitments: [bad], concessions: [] }] });
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(InputError);
      expect((e as InputError).field).toBe("vehicles.0.fitments.0.quantity");
    }
    expect(() => rolloutPreview({ lines: e2, now: new Date("bad"), vehicles: [] })).toThrow(InputError);
    const twice = { vehicleId: "V1", fitments: [], concessions: [] };
    expect(() => rolloutPreview({ lines: e2, now: NOW, vehicles: [twice, twice] })).toThrow(/appears twice/);
  });
});
