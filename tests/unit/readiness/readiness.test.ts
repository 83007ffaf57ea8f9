import { describe, expect, it } from "vitest";
import { InputError } from "@/lib/errors";
import { describeCriterion, tripReadiness, type TripReadinessInput } from "@/lib/readiness";
import { vehicleVariance, type EditionLine, type Fitment } from "@/lib/variance";
import { NOW, concession, daysFromNow, fitment, line } from "../variance/fixtures";

// All expectations here are Rigline rules (our own readiness rules, set out in the module
// comment of lib/readiness); no external source.

const ROADS = /town and graded roads only/i;

const lines: EditionLine[] = [
  line({ id: "s1", code: "SA-01", category: "safety", title: "Fire extinguisher" }),
  line({ id: "r1", code: "RC-01", category: "recovery", title: "Recovery tracks", quantity: 2 }),
  line({
    id: "c1",
    code: "CM-01",
    category: "communications",
    title: "UHF radio",
    criteria: [{ attribute: "powerW", label: "Transmit power", unit: "W", op: "gte", value: 5 }],
    evidenceNeeded: ["photo"],
  }),
  line({ id: "t1", code: "ST-01", category: "storage", title: "Cargo drawers" }),
  line({ id: "n1", code: "LR-09", category: "lighting_roof", title: "Roof-top tent", requirement: "must_not_fit" }),
];
const good: Fitment[] = [
  fitment({ id: "fs1", lineId: "s1" }),
  fitment({ id: "fr1", lineId: "r1", quantity: 2 }),
  fitment({ id: "fc1", lineId: "c1", attributes: { powerW: 5 }, evidence: [{ kind: "photo", status: "accepted" }] }),
  fitment({ id: "ft1", lineId: "t1" }),
];
const without = (id: string) => good.filter((f) => f.lineId !== id);
const varianceOf = (fitments: Fitment[], concessions = [] as ReturnType<typeof concession>[]) =>
  vehicleVariance({ lines, fitments, concessions, now: NOW });

const base: TripReadinessInput = {
  vehicleState: "in_service",
  variance: varianceOf(good),
  openDefects: [],
  expiringItems: [],
  now: NOW,
};

describe("tripReadiness: ready", () => {
  it("is ready with everything met, no defects and nothing expiring soon", () => {
    // Rigline rule: expiry 31 days out is beyond the default 30 → no reason.
    const r = tripReadiness({ ...base, expiringItems: [{ label: "First-aid kit", expiresAt: daysFromNow(31) }] });
    expect(r.state).toBe("ready");
    expect(r.reasons).toEqual([]);
    expect(r.headline).toMatch(/ready/i);
  });

  it("a concession and a watch defect leave it ready; the watch defect is noted", () => {
    // Rigline rule: concession = approved exception; watch = note only.
    const r = tripReadiness({
      ...base,
      variance: varianceOf(without("t1"), [concession({ lineId: "t1" })]),
      openDefects: [{ id: "d1", severity: "watch", title: "Stone chip in windscreen" }],
    });
    expect(r.state).toBe("ready");
    expect(r.reasons).toEqual([
      {
        code: "watch_defect",
        severity: "note",
        ref: "d1",
        message: 'Defect "Stone chip in windscreen" is on watch: check it on the pre-trip walk-round.',
      },
    ]);
  });

  it("no edition is noted and does not limit", () => {
    // Rigline rule.
    const r = tripReadiness({ ...base, variance: undefined });
    expect(r.state).toBe("ready");
    expect(r.reasons.map((x) => x.code)).toEqual(["no_edition"]);
  });
});

describe("tripReadiness: not_ready, each reason", () => {
  it("grounded", () => {
    // Rigline rule.
    const r = tripReadiness({ ...base, vehicleState: "grounded" });
    expect(r.state).toBe("not_ready");
    expect(r.reasons).toHaveLength(1);
    expect(r.reasons[0]).toMatchObject({ code: "vehicle_grounded", severity: "not_ready" });
    expect(r.reasons[0]?.message).toMatch(/grounded/);
  });

  it("retired", () => {
    // Rigline rule.
    const r = tripReadiness({ ...base, vehicleState: "retired" });
    expect(r.state).toBe("not_ready");
    expect(r.reasons.map((x) => x.code)).toEqual(["vehicle_retired"]);
    expect(r.reasons[0]?.message).toMatch(/retired/);
  });

  it("a stop defect, named", () => {
    // Rigline rule.
    const r = tripReadiness({ ...base, openDefects: [{ id: "d9", severity: "stop", title: "Brake line leaking" }] });
    expect(r.state).toBe("not_ready");
    expect(r.reasons).toEqual([
      { code: "stop_defect", severity: "not_ready", ref: "d9", message: 'Defect "Brake line leaking" is a stop defect: fix it before the vehicle moves.' },
    ]);
  });

  it("a short safety line, naming code, title and how many are missing", () => {
    // Rigline rule.
    const r = tripReadiness({ ...base, variance: varianceOf(without("s1")) });
    expect(r.state).toBe("not_ready");
    expect(r.reasons).toEqual([
      { code: "critical_line_short", severity: "not_ready", ref: "s1", message: 'Safety line SA-01 "Fire extinguisher" is short: 1 item missing.' },
    ]);
  });

  it("a short recovery line (1 of 2 fitted)", () => {
    // Rigline rule.
    const fitments = [...without("r1"), fitment({ id: "fr1", lineId: "r1", quantity: 1 })];
    const r = tripReadiness({ ...base, variance: varianceOf(fitments) });
    expect(r.state).toBe("not_ready");
    expect(r.reasons[0]?.message).toBe('Recovery line RC-01 "Recovery tracks" is short: 1 item missing.');
  });

  it("a safety line short because its item expired says so", () => {
    // Rigline rule.
    const fitments = [...without("s1"), fitment({ id: "fs1", lineId: "s1", expiresAt: daysFromNow(-1) })];
    const r = tripReadiness({ ...base, variance: varianceOf(fitments) });
    expect(r.state).toBe("not_ready");
    expect(r.reasons[0]?.message).toMatch(/SA-01.*expired/);
  });

  it("an off-spec communications line, naming the criterion and the value found", () => {
    // Rigline rule.
    const fitments = [...without("c1"), { ...good[2]!, attributes: { powerW: 1 } }];
    const r = tripReadiness({ ...base, variance: varianceOf(fitments) });
    expect(r.state).toBe("not_ready");
    expect(r.reasons).toEqual([
      {
        code: "critical_line_off_spec",
        severity: "not_ready",
        ref: "c1",
        message: 'Communications line CM-01 "UHF radio" is off-spec: Transmit power is 1 W, needs at least 5 W.',
      },
    ]);
  });

  it("an off-spec line with the attribute missing says 'not recorded'", () => {
    // Rigline rule.
    const fitments = [...without("c1"), { ...good[2]!, attributes: {} }];
    const r = tripReadiness({ ...base, variance: varianceOf(fitments) });
    expect(r.reasons[0]?.message).toBe('Communications line CM-01 "UHF radio" is off-spec: Transmit power is not recorded, needs at least 5 W.');
  });

  it("an expired item (expiry on or before now)", () => {
    // Rigline rule.
    const r = tripReadiness({ ...base, expiringItems: [{ label: "First-aid kit", expiresAt: NOW }] });
    expect(r.state).toBe("not_ready");
    expect(r.reasons).toEqual([
      { code: "item_expired", severity: "not_ready", message: "First-aid kit expired on 2026-03-01: replace it before the trip." },
    ]);
  });
});

describe("tripReadiness: limited, each reason says town and graded roads only", () => {
  it("in fit-out", () => {
    // Rigline rule.
    const r = tripReadiness({ ...base, vehicleState: "in_fitout" });
    expect(r.state).toBe("limited");
    expect(r.reasons.map((x) => x.code)).toEqual(["vehicle_in_fitout"]);
    expect(r.reasons[0]?.message).toMatch(ROADS);
    expect(r.headline).toMatch(ROADS);
  });

  it("a before-next-trip defect, named", () => {
    // Rigline rule.
    const r = tripReadiness({ ...base, openDefects: [{ id: "d2", severity: "before_next_trip", title: "Rear door seal letting dust in" }] });
    expect(r.state).toBe("limited");
    expect(r.reasons).toEqual([
      {
        code: "before_next_trip_defect",
        severity: "limited",
        ref: "d2",
        message: 'Defect "Rear door seal letting dust in" must be fixed before the next trip; until then, town and graded roads only.',
      },
    ]);
  });

  it("a short line outside the critical categories", () => {
    // Rigline rule.
    const r = tripReadiness({ ...base, variance: varianceOf(without("t1")) });
    expect(r.state).toBe("limited");
    expect(r.reasons).toEqual([
      {
        code: "line_short",
        severity: "limited",
        ref: "t1",
        message: 'Storage line ST-01 "Cargo drawers" is short: 1 item missing. Town and graded roads only until it is fitted.',
      },
    ]);
  });

  it("an off-spec line outside the critical categories", () => {
    // Rigline rule.
    const drawers: EditionLine[] = lines.map((l) =>
      l.id === "t1" ? { ...l, criteria: [{ attribute: "loadKg", label: "Rated load", unit: "kg", op: "gte", value: 100 }] } : l,
    );
    const fitments = [...without("t1"), fitment({ id: "ft1", lineId: "t1", attributes: { loadKg: 80 } })];
    const variance = vehicleVariance({ lines: drawers, fitments, concessions: [], now: NOW });
    const r = tripReadiness({ ...base, variance });
    expect(r.state).toBe("limited");
    expect(r.reasons[0]).toMatchObject({ code: "line_off_spec", severity: "limited", ref: "t1" });
    expect(r.reasons[0]?.message).toBe(
      'Storage line ST-01 "Cargo drawers" is off-spec: Rated load is 80 kg, needs at least 100 kg. Town and graded roads only until it is put right.',
    );
  });

  it("an unproven line, even in a critical category, only limits", () => {
    // Rigline rule: the radio is fitted and within spec; its photo is only lodged.
    const fitments = [...without("c1"), { ...good[2]!, evidence: [{ kind: "photo" as const, status: "lodged" as const }] }];
    const r = tripReadiness({ ...base, variance: varianceOf(fitments) });
    expect(r.state).toBe("limited");
    expect(r.reasons).toEqual([
      {
        code: "line_unproven",
        severity: "limited",
        ref: "c1",
        message: 'Communications line CM-01 "UHF radio" is fitted but not yet proven (awaiting photo). Town and graded roads only until the evidence is accepted.',
      },
    ]);
  });

  it("a must-not-fit item that is fitted", () => {
    // Rigline rule.
    const r = tripReadiness({ ...base, variance: varianceOf([...good, fitment({ id: "fn1", lineId: "n1" })]) });
    expect(r.state).toBe("limited");
    expect(r.reasons[0]).toMatchObject({ code: "prohibited_item_fitted", ref: "n1" });
    expect(r.reasons[0]?.message).toMatch(/LR-09 "Roof-top tent" must not be fitted.*Town and graded roads only/);
  });

  it("an item expiring within 30 days by default, inclusive", () => {
    // Rigline rule: 30 days out is within the default 30 (≤); the message gives date and days.
    const r = tripReadiness({ ...base, expiringItems: [{ label: "Fire extinguisher service tag", expiresAt: daysFromNow(30) }] });
    expect(r.state).toBe("limited");
    expect(r.reasons).toEqual([
      {
        code: "item_expiring_soon",
        severity: "limited",
        message: "Fire extinguisher service tag expires on 2026-03-31 (in 30 days). Town and graded roads only until it is replaced.",
      },
    ]);
  });

  it("soonDays narrows the window", () => {
    // Rigline rule: 10 days out, window 7 → no reason; window 10 → limited, "in 10 days".
    const items = [{ label: "First-aid kit", expiresAt: daysFromNow(10) }];
    expect(tripReadiness({ ...base, expiringItems: items, soonDays: 7 }).state).toBe("ready");
    const r = tripReadiness({ ...base, expiringItems: items, soonDays: 10 });
    expect(r.state).toBe("limited");
    expect(r.reasons[0]?.message).toMatch(/in 10 days/);
    // Half a day out counts as "in 1 day".
    const half = tripReadiness({ ...base, expiringItems: [{ label: "Flare", expiresAt: new Date(NOW.getTime() + 43_200_000) }] });
    expect(half.reasons[0]?.message).toMatch(/in 1 day\)/);
  });
});

describe("tripReadiness: several reasons", () => {
  it("not_ready wins, and reasons are listed not_ready, then limited, then notes", () => {
    // Rigline rule.
    const r = tripReadiness({
      ...base,
      vehicleState: "in_fitout",
      variance: varianceOf(without("s1")),
      openDefects: [
        { id: "d1", severity: "watch", title: "Worn wiper blade" },
        { id: "d2", severity: "before_next_trip", title: "Loose drawer latch" },
      ],
      expiringItems: [{ label: "First-aid kit", expiresAt: daysFromNow(-2) }],
    });
    expect(r.state).toBe("not_ready");
    expect(r.reasons.map((x) => [x.code, x.severity])).toEqual([
      ["critical_line_short", "not_ready"],
      ["item_expired", "not_ready"],
      ["vehicle_in_fitout", "limited"],
      ["before_next_trip_defect", "limited"],
      ["watch_defect", "note"],
    ]);
    for (const reason of r.reasons) expect(reason.message.length).toBeGreaterThan(10);
  });
});

describe("tripReadiness: bad input", () => {
  it("throws InputError naming the field", () => {
    // Rigline rule.
    const fieldOf = (f: () => unknown) => {
      try {
        f();
      } catch (e) {
        expect(e).toBeInstanceOf(InputError);
        return (e as InputError).field;
      }
      return "no error";
    };
    expect(fieldOf(() => tripReadiness({ ...base, soonDays: -1 }))).toBe("soonDays");
    expect(fieldOf(() => tripReadiness({ ...base, soonDays: Number.NaN }))).toBe("soonDays");
    expect(fieldOf(() => tripReadiness({ ...base, vehicleState: "parked" as never }))).toBe("vehicleState");
    expect(fieldOf(() => tripReadiness({ ...base, now: new Date("x") }))).toBe("now");
    expect(fieldOf(() => tripReadiness({ ...base, openDefects: [{ id: "d", severity: "urgent" as never, title: "x" }] }))).toBe("openDefects.0.severity");
    expect(fieldOf(() => tripReadiness({ ...base, expiringItems: [{ label: "Kit", expiresAt: new Date(Number.NaN) }] }))).toBe("expiringItems.0.expiresAt");
  });
});

describe("describeCriterion", () => {
  it("puts each operator in words", () => {
    // Rigline rule; the speed symbols listed are ISO 4000-1 / ETRTO symbols (S).
    expect(describeCriterion({ attribute: "x", op: "lte", value: 50, unit: "mm" })).toBe("at most 50 mm");
    expect(describeCriterion({ attribute: "x", op: "between", value: [6, 10], unit: "mm²" })).toBe("between 6 and 10 mm²");
    expect(describeCriterion({ attribute: "x", op: "one_of", value: ["Q", "R", "S"] })).toBe("one of Q, R, S");
    expect(describeCriterion({ attribute: "x", op: "eq", value: "265/70R17" })).toBe("265/70R17");
  });
});
