import { describe, expect, it } from "vitest";
import { InputError } from "@/lib/errors";
import { parseTyreSize } from "@/lib/tyres";

function fieldAndMessage(fn: () => unknown): { field: string; message: string } {
  try {
    fn();
  } catch (e) {
    if (e instanceof InputError) return { field: e.field, message: e.message };
    throw e;
  }
  throw new Error("expected an InputError");
}

describe("parseTyreSize — metric", () => {
  it("computes overall diameter by the ETRTO formula", () => {
    // ETRTO / ISO metric designation (S): 225/45R17 → 634.3 mm (a published calculator prints 634.4)
    expect(Math.abs(parseTyreSize("225/45R17").overallDiameterMm - 634.3)).toBeLessThanOrEqual(0.1);
    // ETRTO / ISO metric designation (S): 245/55R18 → 726.7 mm
    expect(parseTyreSize("245/55R18").overallDiameterMm).toBeCloseTo(726.7, 6);
    // ETRTO / ISO metric designation (C): 265/70R17 → 802.8 mm (31.61 in)
    const a = parseTyreSize("265/70R17");
    expect(a.overallDiameterMm).toBeCloseTo(802.8, 6);
    expect(a.overallDiameterIn).toBeCloseTo(31.61, 2);
    // ETRTO / ISO metric designation (C): LT285/75R16 → 833.9 mm (32.83 in)
    const b = parseTyreSize("LT285/75R16");
    expect(b.overallDiameterMm).toBeCloseTo(833.9, 6);
    expect(b.overallDiameterIn).toBeCloseTo(32.83, 2);
    // ETRTO / ISO metric designation (C): 285/70R17 → 830.8 mm
    expect(parseTyreSize("285/70R17").overallDiameterMm).toBeCloseTo(830.8, 6);
  });

  it("reads the parts, with or without a space before R", () => {
    for (const text of ["265/70R17", "265/70 R17", " 265/70r17 "]) {
      const s = parseTyreSize(text);
      expect(s).toMatchObject({ kind: "metric", sectionWidthMm: 265, aspectRatio: 70, rimIn: 17 });
      expect(s.service).toBeUndefined();
      expect(s.loadIndexSingle).toBeUndefined();
    }
  });

  it("reads LT and P prefixes and an LT suffix", () => {
    expect(parseTyreSize("LT285/75R16").service).toBe("LT");
    expect(parseTyreSize("P225/45R17").service).toBe("P");
    expect(parseTyreSize("265/75R16LT").service).toBe("LT");
  });

  it("reads single and dual load indexes and the speed symbol", () => {
    const dual = parseTyreSize("LT265/70R17 121/118S");
    expect(dual).toMatchObject({ loadIndexSingle: 121, loadIndexDual: 118, speedSymbol: "S", service: "LT" });
    expect(dual.designation).toBe("LT265/70R17 121/118S");
    const single = parseTyreSize("265/70R17 112T");
    expect(single).toMatchObject({ loadIndexSingle: 112, speedSymbol: "T" });
    expect(single.loadIndexDual).toBeUndefined();
  });
});

describe("parseTyreSize — flotation", () => {
  it("takes the nominal diameter in inches, not a calculation", () => {
    // ETRTO / ISO metric designation (S, nominal): 35x12.50R17 → 35 in = 889.0 mm, width 12.50 in, rim 17 in
    const s = parseTyreSize("35x12.50R17");
    expect(s.kind).toBe("flotation");
    expect(s.overallDiameterMm).toBeCloseTo(889.0, 6);
    expect(s.sectionWidthMm).toBeCloseTo(12.5 * 25.4, 6);
    expect(s.rimIn).toBe(17);
    expect(s.aspectRatio).toBeUndefined();
  });

  it("reads an LT suffix and a service description", () => {
    const s = parseTyreSize("33x12.50R15LT 108Q");
    expect(s).toMatchObject({ kind: "flotation", service: "LT", rimIn: 15, loadIndexSingle: 108, speedSymbol: "Q" });
    expect(s.overallDiameterMm).toBeCloseTo(33 * 25.4, 6);
    expect(s.designation).toBe("33x12.50R15LT 108Q");
    expect(parseTyreSize("33X12.5R15LT").designation).toBe("33x12.50R15LT");
  });
});

describe("parseTyreSize — bad text", () => {
  it("names the field and the expected form", () => {
    const empty = fieldAndMessage(() => parseTyreSize("", "to"));
    expect(empty.field).toBe("to");
    expect(empty.message).toMatch(/265\/70R17/);

    const junk = fieldAndMessage(() => parseTyreSize("big ones", "from"));
    expect(junk.field).toBe("from");
    expect(junk.message).toMatch(/expected/);

    const flot = fieldAndMessage(() => parseTyreSize("35x12.50-17", "to"));
    expect(flot.message).toMatch(/35x12\.50R17/);
  });

  it("says which part is wrong", () => {
    expect(fieldAndMessage(() => parseTyreSize("265/70R17 12", "to")).message).toMatch(/service description/);
    expect(fieldAndMessage(() => parseTyreSize("265/70R17 121Z", "to")).message).toMatch(/speed symbol "Z"/);
    expect(fieldAndMessage(() => parseTyreSize("265/70R40", "to")).message).toMatch(/rim diameter/);
    expect(fieldAndMessage(() => parseTyreSize("265/5R17", "to")).message).toMatch(/expected/);
    expect(fieldAndMessage(() => parseTyreSize("265/70R17 118/121S", "to")).message).toMatch(/dual load index/);
    expect(fieldAndMessage(() => parseTyreSize("15x12.50R17", "to")).message).toMatch(/overall diameter|rim/);
  });

  it("throws InputError rather than returning NaN for non-text", () => {
    expect(() => parseTyreSize(undefined as unknown as string)).toThrow(InputError);
  });
});
