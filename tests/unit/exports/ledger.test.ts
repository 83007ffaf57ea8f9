import { describe, expect, it } from "vitest";
import { InputError } from "@/lib/errors";
import { LEDGER_COLUMNS, ledgerTable, ledgerTotals } from "@/lib/exports";
import { entry } from "./fixtures";

describe("ledgerTotals", () => {
  it("adds ex-GST, GST and totals in whole cents and splits capital from operating", () => {
    const totals = ledgerTotals([
      entry({ amountExGstCents: 10_000, gstCents: 1_000, kind: "capital" }),
      entry({ amountExGstCents: 1_235, gstCents: 124, kind: "operating" }),
      entry({ amountExGstCents: -2_000, gstCents: -200, kind: "operating", source: "adjustment" }),
    ]);
    // hand-worked: 10,000 + 1,235 − 2,000 = 9,235; 1,000 + 124 − 200 = 924
    expect(totals).toEqual({
      entries: 3,
      exGstCents: 9_235,
      gstCents: 924,
      totalCents: 10_159,
      capitalExGstCents: 10_000,
      operatingExGstCents: -765,
    });
  });

  it("refuses amounts that are not whole cents, naming the entry", () => {
    expect(() => ledgerTotals([entry(), entry({ gstCents: 1.5 })])).toThrow(InputError);
    try {
      ledgerTotals([entry(), entry({ gstCents: 1.5 })]);
    } catch (error) {
      expect((error as InputError).field).toBe("entries.1.gstCents");
    }
  });

  it("is zero for no entries", () => {
    expect(ledgerTotals([]).totalCents).toBe(0);
  });
});

describe("ledgerTable", () => {
  it("has one row per entry in column order, amounts in cents, and a totals row", () => {
    const table = ledgerTable([entry(), entry({ id: "c-2", amountExGstCents: 50, gstCents: 5, category: "steering_driveline" })]);
    expect(table.columns).toBe(LEDGER_COLUMNS);
    expect(table.rows).toHaveLength(2);
    expect(table.rows[0]).toEqual([
      new Date(Date.UTC(2026, 2, 14)),
      "RL-014",
      "CC-OCW-COR",
      "Ochre Well",
      "Recovery",
      "Capital",
      "Recovery kit and winch rope",
      "INV-2201",
      "Invoice entered",
      123_450,
      12_345,
      135_795,
    ]);
    expect(table.rows[1]?.[4]).toBe("Steering and driveline");
    expect(table.totals?.slice(9)).toEqual([123_500, 12_350, 135_850]);
    expect(table.totals?.[6]).toBe("Total of 2 entries");
  });
});
