import { describe, expect, it } from "vitest";
import { InputError } from "@/lib/errors";
import { constantLoadByAxle, springAdvice, variableLoadByAxle, type SuspensionItem } from "@/lib/suspension";

// Invented touring build on an invented 3000 mm wheelbase; the axle shares are hand-worked by the
// lever rule (statics of a simply supported beam, C): front = W·(WB − x)/WB, rear = W·x/WB.
const wheelbaseMm = 3000;
const build: SuspensionItem[] = [
  { label: "Bar and winch", massKg: 120, xMm: -500 }, // front 140, rear −20
  { label: "Second battery", massKg: 30, xMm: 1000 }, // front 20, rear 10
  { label: "Drawers", massKg: 100, xMm: 3000 }, // rear 100
  { label: "Rear bar and spare", massKg: 80, xMm: 3750 }, // front −20, rear 100
  { label: "Canopy", massKg: 170, xMm: 2700 }, // front 17, rear 153
  { label: "Water", massKg: 60, zone: "tub", variable: true },
  { label: "Touring gear", massKg: 150, xMm: 2400, variable: true }, // front 30, rear 120
];

describe("constantLoadByAxle", () => {
  it("takes the lever rule over the constant items only", () => {
    // Lever rule, statics of a simply supported beam (C), hand-worked above: 157 front / 343 rear
    const c = constantLoadByAxle(build, wheelbaseMm);
    expect(c.frontKg).toBeCloseTo(157, 9);
    expect(c.rearKg).toBeCloseTo(343, 9);
    expect(c.totalKg).toBe(500);
    // Common practice: a loaded touring fit-out is commonly 500–600 kg above standard; in one
    // typical build about 350 kg of accessories sat over the rear and about 150 kg over the front
    expect(Math.abs(c.rearKg - 350)).toBeLessThan(10);
    expect(Math.abs(c.frontKg - 150)).toBeLessThan(10);
  });

  it("leaves the variable items for the airbags", () => {
    // Lever rule (C): water 60 kg in the tub (over the rear axle, common-practice zone) → 60 rear;
    // touring gear 150 kg at 2.4 m → 30 front / 120 rear
    const v = variableLoadByAxle(build, wheelbaseMm);
    expect(v.frontKg).toBeCloseTo(30, 9);
    expect(v.rearKg).toBeCloseTo(180, 9);
  });

  it("rejects an item without a position", () => {
    try {
      constantLoadByAxle([{ massKg: 10 }, { massKg: 20 }], wheelbaseMm);
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(InputError);
      expect((e as InputError).field).toBe("items.0.xMm");
    }
  });
});

describe("springAdvice — the trade case (common practice)", () => {
  const rear = constantLoadByAxle(build, wheelbaseMm).rearKg; // 343 kg

  it("a rear spring rated for about 400 kg of constant load suits", () => {
    // Common practice: a rear spring rated for about 400 kg of constant load was chosen for ~350 kg
    const a = springAdvice({ axle: "rear", constantLoadKg: rear, variableLoadKg: 180, springRatedKg: 400, airbagAssistKg: 200 });
    expect(a.verdict).toBe("suits");
    expect(a.spareKg).toBeCloseTo(57, 9);
    expect(a.worst).toBe("ok"); // airbags take the 180 kg variable load
    expect(a.airbag?.usedForVariableKg).toBe(180);
    expect(a.airbag?.wouldCarryConstantKg).toBe(0);
  });

  it("one rated about 500 kg above the load rides harshly", () => {
    // Common practice: a spring rated ~500 kg above the load actually carried rides harshly
    const a = springAdvice({ axle: "rear", constantLoadKg: rear, variableLoadKg: 0, springRatedKg: 850 });
    expect(a.verdict).toBe("too stiff");
    expect(a.findings[0]?.message).toMatch(/harsh/);
  });

  it("one rated below the load is overloaded and loses clearance", () => {
    // Common practice: a spring rated below the load is overloaded and loses clearance
    const a = springAdvice({ axle: "rear", constantLoadKg: rear, variableLoadKg: 0, springRatedKg: 300 });
    expect(a.verdict).toBe("too soft");
    expect(a.findings[0]).toMatchObject({ code: "spring-soft", severity: "exceeds" });
    expect(a.findings[0]?.message).toMatch(/clearance/);
  });

  it("flags airbags used to carry the constant load", () => {
    // Common practice: springs for the constant load; airbags help with the variable load and must
    // not carry the load on their own
    const a = springAdvice({ axle: "rear", constantLoadKg: rear, variableLoadKg: 100, springRatedKg: 300, airbagAssistKg: 200 });
    expect(a.verdict).toBe("too soft");
    expect(a.findings.map((f) => f.code)).toContain("airbag-constant");
    expect(a.airbag?.wouldCarryConstantKg).toBeCloseTo(43, 9);
  });

  it("suggests a spring from the constant load up to the stiff margin above it", () => {
    // Common practice: rate for the constant load; ~500 kg above it is harsh
    const a = springAdvice({ axle: "front", constantLoadKg: 157, variableLoadKg: 30, springRatedKg: 200 });
    expect(a.suggestedRatingKg).toEqual({ minKg: 157, maxKg: 657 });
    expect(a.verdict).toBe("suits");
    const margins = springAdvice({ axle: "front", constantLoadKg: 157, variableLoadKg: 0, springRatedKg: 140, margins: { softKg: 20, stiffKg: 300 } });
    expect(margins.verdict).toBe("suits"); // 17 kg under, within the 20 kg allowance
    expect(margins.suggestedRatingKg).toEqual({ minKg: 137, maxKg: 457 });
  });

  it("says when the laden axle needs help with the variable load", () => {
    // Common practice: airbags help with the variable load (touring gear)
    const a = springAdvice({ axle: "rear", constantLoadKg: rear, variableLoadKg: 180, springRatedKg: 400 });
    expect(a.laden).toEqual({ loadKg: 523, supportKg: 400, overKg: 123 });
    expect(a.findings.find((f) => f.code === "laden")?.message).toMatch(/airbags can help/);
    const withBags = springAdvice({ axle: "rear", constantLoadKg: rear, variableLoadKg: 180, springRatedKg: 400, airbagAssistKg: 100 });
    expect(withBags.laden.overKg).toBeCloseTo(23, 9);
  });

  it("rejects bad input naming the field", () => {
    expect(() => springAdvice({ axle: "middle" as never, constantLoadKg: 1, variableLoadKg: 0, springRatedKg: 1 })).toThrow(InputError);
    try {
      springAdvice({ axle: "rear", constantLoadKg: 100, variableLoadKg: -1, springRatedKg: 200 });
      expect.unreachable();
    } catch (e) {
      expect((e as InputError).field).toBe("variableLoadKg");
    }
    expect(() => springAdvice({ axle: "rear", constantLoadKg: 100, variableLoadKg: 0, springRatedKg: 200, margins: { softKg: 100, stiffKg: 50 } })).toThrow(InputError);
  });
});
