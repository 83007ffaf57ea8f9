import { describe, expect, it } from "vitest";
import { InputError } from "@/lib/errors";
import { LOAD_INDEX_KG, SPEED_SYMBOLS, loadIndexKg, speedSymbolKmh } from "@/lib/tyres";

describe("load index table", () => {
  it("gives the published kg per tyre across the table", () => {
    // ISO 4000-1 / ETRTO load index table (S) — a spread, since free tables carry typos
    const cases: Array<[number, number]> = [
      [95, 690], [96, 710], [99, 775], [100, 800], [103, 875], [104, 900], [108, 1000],
      [109, 1030], [110, 1060], [112, 1120], [113, 1150], [115, 1215], [116, 1250],
      [117, 1285], [118, 1320], [119, 1360], [120, 1400], [121, 1450], [122, 1500], [124, 1600],
    ];
    for (const [li, kg] of cases) expect(loadIndexKg(li)).toBe(kg);
  });

  it("carries 125–130 (from memory, unverified)", () => {
    // ISO 4000-1 / ETRTO load index table, 125–130 from memory (M)
    expect(loadIndexKg(125)).toBe(1650);
    expect(loadIndexKg(128)).toBe(1800);
    expect(loadIndexKg(130)).toBe(1900);
  });

  it("covers every index 95–130 with loads that rise with the index", () => {
    for (let li = 95; li < 130; li++) {
      expect(LOAD_INDEX_KG[li + 1]).toBeGreaterThan(LOAD_INDEX_KG[li] ?? Infinity);
    }
  });

  it("LI 120 single → 1400 kg per tyre, 2800 kg per axle of two", () => {
    // ISO 4000-1 / ETRTO load index table (S), dual service description case
    expect(loadIndexKg(120)).toBe(1400);
    expect(loadIndexKg(120) * 2).toBe(2800);
  });

  it("throws InputError for an index outside the table", () => {
    for (const bad of [94, 131, 100.5, Number.NaN]) {
      expect(() => loadIndexKg(bad, "to.loadIndex")).toThrow(InputError);
    }
    try {
      loadIndexKg(94, "to.loadIndex");
    } catch (e) {
      expect((e as InputError).field).toBe("to.loadIndex");
      expect((e as InputError).message).toMatch(/95 to 130/);
    }
  });
});

describe("speed symbols", () => {
  it("map L..Y to the published km/h", () => {
    // ISO 4000-1 / ETRTO speed symbols (S)
    const expected = { L: 120, M: 130, N: 140, P: 150, Q: 160, R: 170, S: 180, T: 190, U: 200, H: 210, V: 240, W: 270, Y: 300 };
    for (const [sym, kmh] of Object.entries(expected)) expect(speedSymbolKmh(sym)).toBe(kmh);
    expect(SPEED_SYMBOLS).toHaveLength(13);
    expect(speedSymbolKmh("t")).toBe(190);
  });

  it("throws InputError for an unknown symbol", () => {
    for (const bad of ["Z", "A", "", "TT"]) expect(() => speedSymbolKmh(bad)).toThrow(InputError);
  });
});
