import { describe, expect, it } from "vitest";
import { InputError } from "@/lib/errors";
import { exampleRuleSet } from "@/lib/rules";
import { tyreChange, tyreChangeInputSchema } from "@/lib/tyres";

type Result = ReturnType<typeof tyreChange>;
function finding(r: Result, code: string) {
  const f = r.findings.find((x) => x.code === code);
  if (!f) throw new Error(`no finding ${code}`);
  return f;
}

describe("tyreChange — diameters and clearance", () => {
  it("265/70R17 → 285/70R17", () => {
    // ETRTO / ISO metric designation (C): 802.8 mm → 830.8 mm
    const r = tyreChange({ from: "265/70R17", to: "285/70R17" });
    expect(r.oldDiameterMm).toBeCloseTo(802.8, 6);
    expect(r.newDiameterMm).toBeCloseTo(830.8, 6);
    expect(r.diameterChangeMm).toBeCloseTo(28, 6);
    // UN Regulation 39 ¶5.3, ADR 18/03 (C): diameter ratio 1.03488
    expect(r.diameterRatio).toBeCloseTo(1.03488, 5);
    expect(r.diameterChangePct).toBeCloseTo(3.488, 3);
    // Queensland guidance (S): tyre lift = ½ × diameter increase → 14 mm more clearance
    expect(r.clearanceGainedMm).toBeCloseTo(14, 6);
  });
});

describe("tyreChange — speedometer", () => {
  it("exact on the old tyres: reads low on the new ones → exceeds", () => {
    // UN Regulation 39 ¶5.3, ADR 18/03 (C): indicated 100 → true 103.49 → fails
    const r = tyreChange({ from: "265/70R17", to: "285/70R17" });
    const row100 = r.speedometer.find((x) => x.indicatedKmh === 100);
    expect(row100?.trueNewKmh).toBeCloseTo(103.49, 2);
    expect(row100?.compliant).toBe(false);
    expect(r.speedometer.map((x) => x.indicatedKmh)).toEqual([40, 60, 80, 100, 110, 130]);
    expect(finding(r, "speedometer").severity).toBe("exceeds");
    expect(finding(r, "speedometer").message).toMatch(/reads low/);
    expect(r.worst).toBe("exceeds");
  });

  it("read 100 at a true 95 on the old tyres: passes on the new ones", () => {
    // UN Regulation 39 ¶5.3, ADR 18/03 (C): true 98.31, V1 − V2 = 1.69 ≤ 13.83
    const r = tyreChange({ from: "265/70R17", to: "285/70R17", speedoReadsHighPct: 5 });
    const row100 = r.speedometer.find((x) => x.indicatedKmh === 100);
    expect(row100?.trueNewKmh).toBeCloseTo(98.31, 2);
    expect(row100?.compliant).toBe(true);
    expect(r.speedometer.every((x) => x.compliant)).toBe(true);
    expect(finding(r, "speedometer").severity).toBe("ok");
  });

  it("a much smaller tyre makes it read too high", () => {
    // UN Regulation 39 ¶5.3, ADR 18/03 (P): V1 − V2 ≤ 0.1 × V2 + 4.
    // Hand-worked: 285/70R17 → 225/45R17 ratio 634.3 / 830.8 = 0.76348; 100 indicated → true 76.35,
    // 23.65 over against 11.63 allowed.
    const r = tyreChange({ from: "285/70R17", to: "225/45R17", speedsKmh: [100] });
    expect(r.speedometer[0]?.trueNewKmh).toBeCloseTo(76.35, 2);
    expect(r.speedometer[0]?.allowedHighKmh).toBeCloseTo(11.63, 2);
    expect(finding(r, "speedometer").message).toMatch(/too high/);
  });
});

describe("tyreChange — load index and speed symbol", () => {
  it("LI 120 on an axle of two carries 2800 kg", () => {
    // ISO 4000-1 / ETRTO load index table (S): LI 120 single → 1400 kg per tyre, 2800 kg per axle of two
    const r = tyreChange({ from: "265/70R17 112T", to: "LT285/70R17 120/116S", axleRatings: { frontKg: 1450, rearKg: 2900 } });
    const front = r.axleCapacity.find((a) => a.axle === "front");
    const rear = r.axleCapacity.find((a) => a.axle === "rear");
    expect(front).toMatchObject({ perTyreKg: 1400, capacityKg: 2800, ok: true, headroomKg: 1350 });
    expect(rear).toMatchObject({ capacityKg: 2800, ok: false, headroomKg: -100 });
    expect(finding(r, "load-front").severity).toBe("ok");
    expect(finding(r, "load-rear").severity).toBe("exceeds");
    expect(finding(r, "load-construction").severity).toBe("check"); // metric → LT
  });

  it("dual rear wheels use the dual index", () => {
    // ISO 4000-1 / ETRTO load index table (S): LI 116 dual → 1250 kg per tyre
    const r = tyreChange({
      from: "LT265/70R17 120/116S",
      to: "LT265/70R17 120/116S",
      axleRatings: { frontKg: 1800, rearKg: 4000 },
      rearTyreCount: 4,
    });
    expect(r.axleCapacity.find((a) => a.axle === "rear")).toMatchObject({ loadIndex: 116, perTyreKg: 1250, capacityKg: 5000, ok: true });
  });

  it("flags a missing or unknown load index as something to check", () => {
    const none = tyreChange({ from: "265/70R17", to: "285/70R17", axleRatings: { frontKg: 1300, rearKg: 1800 } });
    expect(finding(none, "load-front").severity).toBe("check");
    const low = tyreChange({ from: "265/70R17", to: "225/45R17 94W", axleRatings: { frontKg: 1000, rearKg: 1000 } });
    expect(finding(low, "load-rear").severity).toBe("check");
    expect(low.axleCapacity).toHaveLength(0);
    const lower = tyreChange({ from: "265/70R17 116S", to: "265/70R17 112S" });
    expect(finding(lower, "load-index-lower").severity).toBe("check");
  });

  it("checks the speed symbol against the top speed", () => {
    // ISO 4000-1 / ETRTO speed symbols (S): S = 180 km/h
    const ok = tyreChange({ from: "265/70R17 112T", to: "285/70R17 121S", topSpeedKmh: 175 });
    expect(finding(ok, "speed-symbol").severity).toBe("ok");
    const slow = tyreChange({ from: "265/70R17 112T", to: "285/70R17 121S", topSpeedKmh: 185 });
    expect(finding(slow, "speed-symbol").severity).toBe("exceeds");
    // ISO 4000-1 / ETRTO speed symbols (S): S 180 < T 190
    const lower = tyreChange({ from: "265/70R17 112T", to: "285/70R17 121S" });
    expect(finding(lower, "speed-symbol").severity).toBe("check");
    const missing = tyreChange({ from: "265/70R17 112T", to: "285/70R17" });
    expect(finding(missing, "speed-symbol").severity).toBe("check");
  });
});

describe("tyreChange — rule set limits", () => {
  it("+28 mm with a 50 mm lift stays inside example set A", () => {
    // VSB 14 section LS as quoted by the Victorian VSI 8 (S): ≤ +50 mm diameter, ≤ 50 mm suspension.
    // Queensland guidance (S): combined 50 + 28/2 = 64 mm ≤ 75 mm.
    const r = tyreChange({ from: "265/70R17", to: "285/70R17", speedoReadsHighPct: 5, rules: exampleRuleSet("example-a-50mm-tyre"), suspensionLiftMm: 50 });
    expect(r.lift?.combinedLiftMm).toBeCloseTo(64, 6);
    expect(finding(r, "combined-lift").severity).toBe("ok");
    expect(finding(r, "tyre-diameter-mm").severity).toBe("ok");
    expect(finding(r, "diameter-base").severity).toBe("check");
  });

  it("a 35 in flotation tyre from 265/70R17 exceeds the 50 mm rule", () => {
    // VSB 14 section LS as quoted by the Victorian VSI 8 (S): +86.2 mm (889.0 − 802.8) > +50 mm
    // Queensland guidance (S): 50 + 86.2/2 = 93.1 mm > 75 mm → needs certification
    const r = tyreChange({ from: "265/70R17", to: "35x12.50R17", rules: exampleRuleSet("example-a-50mm-tyre"), suspensionLiftMm: 50 });
    expect(r.diameterChangeMm).toBeCloseTo(86.2, 6);
    expect(finding(r, "tyre-diameter-mm").severity).toBe("exceeds");
    expect(r.lift?.combinedLiftMm).toBeCloseTo(93.1, 6);
    expect(r.lift?.needsCertification).toBe(true);
  });

  it("measures the percentage rule from the maker's largest tyre", () => {
    // NSW light vehicle modifications manual, suspension and ride height, 2016 (S): ≤ +7 %.
    // Hand-worked: LT285/75R16 833.9 mm vs largest specified 265/70R17 802.8 mm → +3.87 % (ok);
    // 35x12.50R17 889.0 vs 802.8 → +10.74 % (exceeds).
    const rules = exampleRuleSet("example-b-7pct-tyre");
    const ok = tyreChange({ from: "245/70R17", to: "LT285/75R16", makerLargestSize: "265/70R17", rules });
    expect(finding(ok, "tyre-diameter-pct").severity).toBe("ok");
    expect(ok.findings.some((f) => f.code === "diameter-base")).toBe(false);
    const over = tyreChange({ from: "245/70R17", to: "35x12.50R17", makerLargestSize: "265/70R17", rules });
    expect(finding(over, "tyre-diameter-pct").severity).toBe("exceeds");
    expect(finding(over, "tyre-diameter-pct").message).toMatch(/10\.74 %/);
  });
});

describe("tyreChange — bad input", () => {
  it("throws InputError naming the size field", () => {
    try {
      tyreChange({ from: "265/70R17", to: "thirty-three" });
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(InputError);
      expect((e as InputError).field).toBe("to");
    }
    expect(() => tyreChange({ from: "265/70R17", to: "285/70R17", topSpeedKmh: -1 })).toThrow(InputError);
  });
});

describe("tyreChangeInputSchema", () => {
  it("accepts the API input and rejects a bad size with the parser's message", () => {
    const good = tyreChangeInputSchema.safeParse({ from: "265/70R17", to: "35x12.50R17LT", speedoReadsHighPct: 5 });
    expect(good.success).toBe(true);
    const bad = tyreChangeInputSchema.safeParse({ from: "265/70R17", to: "265/70-17" });
    expect(bad.success).toBe(false);
    expect(bad.error?.issues[0]?.path).toEqual(["to"]);
    expect(bad.error?.issues[0]?.message).toMatch(/expected/);
    const pct = tyreChangeInputSchema.safeParse({ from: "265/70R17", to: "285/70R17", speedoReadsHighPct: "5" });
    expect(pct.error?.issues[0]?.path).toEqual(["speedoReadsHighPct"]);
  });
});
