import { describe, expect, it } from "vitest";
import { InputError } from "@/lib/errors";
import { EXAMPLE_RULE_SETS, exampleRuleSet, liftCheck, ruleSetSchema, tyreLiftMm, worstSeverity } from "@/lib/rules";

const setA = exampleRuleSet("example-a-50mm-tyre");
const setB = exampleRuleSet("example-b-7pct-tyre");
const setC = exampleRuleSet("example-c-150mm-ceiling");

function finding(result: ReturnType<typeof liftCheck>, code: string) {
  const f = result.findings.find((x) => x.code === code);
  if (!f) throw new Error(`no finding ${code}`);
  return f;
}

describe("tyre lift", () => {
  it("is half the diameter increase", () => {
    // Queensland guidance (S): tyre lift = ½ × diameter increase
    expect(tyreLiftMm(50)).toBe(25);
    expect(tyreLiftMm(60)).toBe(30);
    expect(tyreLiftMm(-20)).toBe(-10);
  });
});

describe("liftCheck — combined lift cases", () => {
  it("50 mm suspension + 50 mm tyre diameter → 75 mm lift, within the combined limit", () => {
    // Queensland guidance (S): combined lift ≤ 75 mm = ≤ 50 mm suspension + ≤ 25 mm from tyres
    const r = liftCheck({ suspensionLiftMm: 50, tyreDiameterIncreaseMm: 50 }, setA);
    expect(r.tyreLiftMm).toBe(25);
    expect(r.combinedLiftMm).toBe(75);
    expect(finding(r, "combined-lift").severity).toBe("ok");
    expect(finding(r, "tyre-lift").severity).toBe("ok");
    // VSB 14 section LS as quoted by the Victorian VSI 8 (S): ≤ 50 mm suspension, ≤ +50 mm tyre diameter
    expect(finding(r, "suspension-lift").severity).toBe("ok");
    expect(finding(r, "tyre-diameter-mm").severity).toBe("ok");
    expect(r.needsCertification).toBe(false);
  });

  it("50 mm suspension + 60 mm tyre diameter → 80 mm lift, needs certification", () => {
    // Queensland guidance (S): 80 mm is above the 75 mm combined limit
    const r = liftCheck({ suspensionLiftMm: 50, tyreDiameterIncreaseMm: 60 }, setA);
    expect(r.tyreLiftMm).toBe(30);
    expect(r.combinedLiftMm).toBe(80);
    expect(finding(r, "combined-lift").severity).toBe("exceeds");
    expect(finding(r, "combined-lift").message).toMatch(/certification/);
    expect(finding(r, "tyre-lift").severity).toBe("exceeds");
    // VSB 14 section LS as quoted by the Victorian VSI 8 (S): +60 mm is over the +50 mm tyre rule
    expect(finding(r, "tyre-diameter-mm").severity).toBe("exceeds");
    expect(r.needsCertification).toBe(true);
    expect(r.certifiable).toBe(true);
  });

  it("suspension lift limited to 50 mm and to a third of the original travel", () => {
    // VSB 14 section LS as quoted by the Victorian VSI 8 (S): ≤ 50 mm and ≤ ⅓ of original travel
    const within = liftCheck({ suspensionLiftMm: 50, tyreDiameterIncreaseMm: 0, originalTravelMm: 180 }, setA);
    expect(finding(within, "suspension-travel").severity).toBe("ok"); // ⅓ × 180 = 60 mm ≥ 50
    const tooMuchTravel = liftCheck({ suspensionLiftMm: 45, tyreDiameterIncreaseMm: 0, originalTravelMm: 120 }, setA);
    expect(finding(tooMuchTravel, "suspension-travel").severity).toBe("exceeds"); // ⅓ × 120 = 40 mm < 45
    expect(finding(tooMuchTravel, "suspension-lift").severity).toBe("ok");
    const over = liftCheck({ suspensionLiftMm: 55, tyreDiameterIncreaseMm: 0 }, setA);
    expect(finding(over, "suspension-lift").severity).toBe("exceeds");
    expect(finding(over, "suspension-travel").severity).toBe("check"); // travel unknown
  });

  it("percentage tyre rule: ≤ 7 % of the largest specified diameter", () => {
    // NSW light vehicle modifications manual, suspension and ride height, 2016 (S): ≤ +7 %
    // Hand-worked: 7 % of 802.8 mm = 56.196 mm.
    const ok = liftCheck({ suspensionLiftMm: 0, tyreDiameterIncreaseMm: 56, baseTyreDiameterMm: 802.8 }, setB);
    expect(finding(ok, "tyre-diameter-pct").severity).toBe("ok");
    const over = liftCheck({ suspensionLiftMm: 0, tyreDiameterIncreaseMm: 57, baseTyreDiameterMm: 802.8 }, setB);
    expect(finding(over, "tyre-diameter-pct").severity).toBe("exceeds");
    const unknown = liftCheck({ suspensionLiftMm: 0, tyreDiameterIncreaseMm: 30 }, setB);
    expect(finding(unknown, "tyre-diameter-pct").severity).toBe("check");
  });

  it("maximum certified lift of 150 mm", () => {
    // Queensland government notice (P): maximum certified lift 150 mm (since 2018; was 125 mm)
    const certifiable = liftCheck({ suspensionLiftMm: 100, tyreDiameterIncreaseMm: 100 }, setC); // 150 mm
    expect(certifiable.combinedLiftMm).toBe(150);
    expect(certifiable.needsCertification).toBe(true);
    expect(certifiable.certifiable).toBe(true);
    const beyond = liftCheck({ suspensionLiftMm: 110, tyreDiameterIncreaseMm: 100 }, setC); // 160 mm
    expect(beyond.certifiable).toBe(false);
    expect(finding(beyond, "certified-lift").severity).toBe("exceeds");
  });

  it("wheel track wider than 25 mm beyond the maker's maximum, or spacers, need approval", () => {
    // WA Road Traffic (Vehicles) Regulations 2014 r 235 (P)
    const at = liftCheck({ suspensionLiftMm: 0, tyreDiameterIncreaseMm: 0, wheelTrackIncreaseMm: 25 }, setA);
    expect(finding(at, "wheel-track").severity).toBe("ok");
    const over = liftCheck({ suspensionLiftMm: 0, tyreDiameterIncreaseMm: 0, wheelTrackIncreaseMm: 26 }, setA);
    expect(finding(over, "wheel-track").severity).toBe("exceeds");
    const spacers = liftCheck({ suspensionLiftMm: 0, tyreDiameterIncreaseMm: 0, wheelSpacersFitted: true }, setA);
    expect(finding(spacers, "wheel-spacers").severity).toBe("exceeds");
    expect(worstSeverity(spacers.findings)).toBe("exceeds");
  });

  it("rejects bad input with the field named", () => {
    expect(() => liftCheck({ suspensionLiftMm: -5, tyreDiameterIncreaseMm: 0 }, setA)).toThrow(InputError);
    try {
      liftCheck({ suspensionLiftMm: 10, tyreDiameterIncreaseMm: Number.NaN }, setA);
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(InputError);
      expect((e as InputError).field).toBe("tyreDiameterIncreaseMm");
    }
    expect(() => exampleRuleSet("nowhere")).toThrow(InputError);
  });
});

describe("example rule sets", () => {
  it("ships at least three, each labelled as example values and valid by the schema", () => {
    expect(EXAMPLE_RULE_SETS.length).toBeGreaterThanOrEqual(3);
    const ids = new Set(EXAMPLE_RULE_SETS.map((r) => r.id));
    expect(ids.size).toBe(EXAMPLE_RULE_SETS.length);
    for (const r of EXAMPLE_RULE_SETS) {
      expect(r.exampleOnly).toBe(true);
      expect(r.note).toMatch(/example values — check your local rules/i);
      expect(ruleSetSchema.safeParse(r).success).toBe(true);
    }
  });

  it("carries the limits of the published rules", () => {
    // VSB 14 section LS as quoted by the Victorian VSI 8 (S): 50 mm suspension, ⅓ travel, +50 mm tyres
    expect(setA.suspensionLiftMaxMm).toBe(50);
    expect(setA.suspensionLiftMaxTravelFraction).toBeCloseTo(1 / 3, 12);
    expect(setA.tyreDiameterIncreaseMaxMm).toBe(50);
    // NSW light vehicle modifications manual, suspension and ride height, 2016 (S): +7 %
    expect(setB.tyreDiameterIncreaseMaxPct).toBe(7);
    // Queensland guidance (S): 75 mm combined, 25 mm from tyres
    expect(setA.combinedLiftMaxMm).toBe(75);
    expect(setA.tyreLiftShareMaxMm).toBe(25);
    // Queensland government notice (P): 150 mm certified ceiling
    expect(setC.maxCertifiedLiftMm).toBe(150);
    // WA Road Traffic (Vehicles) Regulations 2014 r 235 (P): 25 mm
    expect(setA.wheelTrackIncreaseMaxMm).toBe(25);
  });

  it("cannot be changed in place", () => {
    expect(Object.isFrozen(EXAMPLE_RULE_SETS)).toBe(true);
    expect(Object.isFrozen(setA)).toBe(true);
  });
});

describe("ruleSetSchema", () => {
  const valid = { ...setA };

  it("rejects a rule set not marked as example values", () => {
    const r = ruleSetSchema.safeParse({ ...valid, exampleOnly: false });
    expect(r.success).toBe(false);
    expect(r.error?.issues[0]?.path).toEqual(["exampleOnly"]);
  });

  it("rejects negative and inconsistent limits, naming the field", () => {
    const neg = ruleSetSchema.safeParse({ ...valid, suspensionLiftMaxMm: -1 });
    expect(neg.error?.issues.map((i) => i.path.join("."))).toContain("suspensionLiftMaxMm");
    const share = ruleSetSchema.safeParse({ ...valid, tyreLiftShareMaxMm: 100 });
    expect(share.error?.issues.map((i) => i.path.join("."))).toContain("tyreLiftShareMaxMm");
    const noTyre = ruleSetSchema.safeParse({ ...valid, tyreDiameterIncreaseMaxMm: undefined });
    expect(noTyre.error?.issues.map((i) => i.path.join("."))).toContain("tyreDiameterIncreaseMaxMm");
    const frac = ruleSetSchema.safeParse({ ...valid, suspensionLiftMaxTravelFraction: 1.5 });
    expect(frac.success).toBe(false);
    const ceiling = ruleSetSchema.safeParse({ ...valid, maxCertifiedLiftMm: 60 });
    expect(ceiling.error?.issues.map((i) => i.path.join("."))).toContain("maxCertifiedLiftMm");
  });

  it("accepts an edited set", () => {
    const edited = { ...valid, id: "depot-north-edit", name: "Edited set", combinedLiftMaxMm: 70 };
    const r = ruleSetSchema.safeParse(edited);
    expect(r.success).toBe(true);
    if (r.success) expect(r.data.combinedLiftMaxMm).toBe(70);
  });
});
