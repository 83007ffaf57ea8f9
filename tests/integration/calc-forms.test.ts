import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it, vi } from "vitest";
import { POST as axleLoadsRoute } from "@/app/api/calc/axle-loads/route";
import { POST as batteryRoute } from "@/app/api/calc/battery/route";
import { POST as cableRoute } from "@/app/api/calc/cable/route";
import { POST as tyreChangeRoute } from "@/app/api/calc/tyre-change/route";
import { CalcError, calcErrorFrom, errorsByField, postCalc, unplacedDetails } from "@/components/calculators/api";
import { axleLoadsBody } from "@/components/calculators/axle-loads-calculator";
import { AxleLoadsResult } from "@/components/calculators/axle-loads-result";
import { batteryBody } from "@/components/calculators/battery-calculator";
import { BatteryResult } from "@/components/calculators/battery-result";
import { cableRunBody } from "@/components/calculators/cable-run-calculator";
import { CableRunResult } from "@/components/calculators/cable-run-result";
import { ELECTRICAL_CAUTION, MASS_CAUTION } from "@/components/calculators/cautions";
import { numberOrText } from "@/components/calculators/numbers";
import { TyreChangeResult } from "@/components/calculators/tyre-change-result";
import { tyreChangeBody } from "@/components/calculators/tyre-change-calculator";
import type { AxleLoadsResponse, BatteryResponse, CableRunResponse, TyreChangeResponse } from "@/components/calculators/types";
import { useTestDatabase } from "../helpers/db";
import { callRoute, requestUser } from "../helpers/route";
import { signedInAs } from "../helpers/users";

vi.mock("@/lib/server/session", async (original) => ({
  ...(await original<typeof import("@/lib/server/session")>()),
  currentUser: async () => requestUser.current,
}));

const database = await useTestDatabase();
const driver = await signedInAs(database, "driver@mirrabel-health.example");

/** Visible text of rendered markup: cells and blocks apart, entities decoded, spaces made plain. */
function text(html: string): string {
  return html
    .replace(/<\/?(td|th|tr|p|li|div|h\d|dt|dd|ul|section|table|thead|tbody|tfoot)\b[^>]*>/g, " ")
    .replace(/<[^>]+>/g, "")
    .replace(/&nbsp;|&#xA0;|&#160;|\u00a0/g, " ")
    .replace(/&amp;/g, "&")
    .replace(/&quot;/g, '"')
    .replace(/&#x27;|&#39;/g, "'")
    .replace(/\s+/g, " ");
}

describe("numberOrText", () => {
  it("sends numbers as numbers and anything else as typed, for the API to name", () => {
    expect(numberOrText("3000")).toBe(3000);
    expect(numberOrText(" 1,234.5 ")).toBe(1234.5);
    expect(numberOrText("-600")).toBe(-600);
    expect(numberOrText("\u2212600")).toBe(-600);
    expect(numberOrText(".5")).toBe(0.5);
    expect(numberOrText("")).toBeUndefined();
    expect(numberOrText("   ")).toBeUndefined();
    expect(numberOrText("heavy")).toBe("heavy");
    expect(numberOrText("12 kg")).toBe("12 kg");
    expect(numberOrText("1e999")).toBe("1e999");
  });
});

describe("calculator API client", () => {
  it("reads the one error shape and places details by field", () => {
    const error = calcErrorFrom(422, {
      error: {
        code: "validation_failed",
        message: "Some fields need attention",
        details: [
          { field: "items.1.massKg", message: "massKg must not be negative" },
          { field: "items.1.massKg", message: "second message" },
          { message: "no field" },
          { field: "somethingElse", message: "unshown" },
          "junk",
        ],
      },
    });
    expect(error).toBeInstanceOf(CalcError);
    expect(error.status).toBe(422);
    expect(errorsByField(error)).toEqual({ "items.1.massKg": "massKg must not be negative", somethingElse: "unshown" });
    expect(unplacedDetails(error, (f) => f.startsWith("items.")).map((d) => d.message)).toEqual(["no field", "unshown"]);
    expect(errorsByField(null)).toEqual({});
  });

  it("turns other failures into plain messages", async () => {
    expect(calcErrorFrom(401, null).code).toBe("unauthenticated");
    expect(calcErrorFrom(502, "<html>").code).toBe("internal");
    const offline = (() => Promise.reject(new TypeError("offline"))) as unknown as typeof fetch;
    await expect(postCalc("/api/calc/cable", {}, offline)).rejects.toMatchObject({ status: 0, code: "network" });
    const html = (async () => new Response("<html>", { status: 502 })) as unknown as typeof fetch;
    await expect(postCalc("/api/calc/cable", {}, html)).rejects.toMatchObject({ status: 502, code: "internal" });
  });

  it("posts JSON and returns the result", async () => {
    let seen: RequestInit | undefined;
    const ok = (async (_url: string, init?: RequestInit) => {
      seen = init;
      return Response.json({ fuseA: 25 });
    }) as unknown as typeof fetch;
    await expect(postCalc("/api/calc/cable", { currentA: 20 }, ok)).resolves.toEqual({ fuseA: 25 });
    expect(seen?.method).toBe("POST");
    expect(seen?.body).toBe('{"currentA":20}');
  });
});

describe("forms → routes → result panels", () => {
  it("axle loads: the towing case from typed figures, with the binding limit and the caution", async () => {
    // ADR Definitions and Vehicle Categories (S); Qld mass regulation 2005 s 48(2) (P); case (C):
    // tare 2,150 + fit-out 350 + occupants 160 + 70 L diesel × 0.832 = 58 + towball 250 = 2,968;
    // combination 2,968 + GTM 2,250 = 5,218.
    const body = axleLoadsBody(
      {
        wheelbaseMm: "3000",
        "base.frontKg": "1200",
        "base.rearKg": "950",
        "ratings.frontKg": "1450",
        "ratings.rearKg": "1880",
        "ratings.gvmKg": "3,100",
        "ratings.gcmKg": "5900",
        "trailer.atmKg": "2500",
        "trailer.towballKg": "250",
      },
      [
        { label: "fit-out", massKg: "350", xMm: "2400" },
        { label: "occupants", massKg: "160", xMm: "1100" },
        { label: "diesel 70 L", massKg: String(70 * 0.832), xMm: "1500" },
      ],
      true,
    );
    const { status, json } = await callRoute(axleLoadsRoute, { user: driver, body });
    expect(status).toBe(200);
    const html = renderToStaticMarkup(createElement(AxleLoadsResult, { result: json as AxleLoadsResponse, gcmRatingKg: 5900 }));
    const t = text(html);
    expect(t).toMatch(/Vehicle \(GVM\)( binds)? 2,968 kg 3,100 kg/);
    expect(t).toMatch(/Combination \(GCM\)( binds)? 5,218 kg 5,900 kg/);
    // Case (C): GVM 3,100 − 2,968 = 132 kg, the least headroom of the four limits.
    expect(t).toContain("Within No limit exceeded. The GVM binds first, with 132 kg to spare.");
    expect(t).toMatch(/Vehicle \(GVM\) binds 2,968 kg/);
    expect(t).toContain(MASS_CAUTION);
    expect(html).toMatch(/role="note"/);
  });

  it("axle loads: says which limit is exceeded and by how much", async () => {
    // Hand-worked: 1000 kg mid-wheelbase → 1700 / 1450 on 2000 / 2000 axles, gross 3150 > GVM 3100 by 50 kg.
    const body = axleLoadsBody(
      {
        wheelbaseMm: "3000",
        "base.frontKg": "1200",
        "base.rearKg": "950",
        "ratings.frontKg": "2000",
        "ratings.rearKg": "2000",
        "ratings.gvmKg": "3100",
        "ratings.gcmKg": "",
        "trailer.atmKg": "",
        "trailer.towballKg": "",
      },
      [{ label: "", massKg: "1000", xMm: "1500" }],
      false,
    );
    expect(body.trailer).toBeUndefined();
    const { json } = await callRoute(axleLoadsRoute, { user: driver, body });
    const t = text(renderToStaticMarkup(createElement(AxleLoadsResult, { result: json as AxleLoadsResponse })));
    expect(t).toContain("Over the GVM by 50 kg");
    expect(t).not.toContain("Combination");
  });

  it("axle loads: a typed word reaches the API and comes back naming its field", async () => {
    const body = axleLoadsBody(
      {
        wheelbaseMm: "3000",
        "base.frontKg": "1200",
        "base.rearKg": "950",
        "ratings.frontKg": "1450",
        "ratings.rearKg": "1880",
        "ratings.gvmKg": "3100",
        "ratings.gcmKg": "",
        "trailer.atmKg": "",
        "trailer.towballKg": "",
      },
      [{ label: "bar", massKg: "heavy", xMm: "-600" }],
      false,
    );
    const { status, json } = await callRoute(axleLoadsRoute, { user: driver, body });
    expect(status).toBe(422);
    expect(errorsByField(calcErrorFrom(status, json))).toHaveProperty(["items.0.massKg"]);
  });

  it("tyre change: 265/70R17 → 285/70R17 shows the speedometer failing, the rule set and the caution", async () => {
    const body = tyreChangeBody({ from: "265/70R17", to: "285/70R17", speedoReadsHighPct: "", ruleSetId: "example-b-7pct-tyre", suspensionLiftMm: "" });
    const { status, json } = await callRoute(tyreChangeRoute, { user: driver, body });
    expect(status).toBe(200);
    const result = json as TyreChangeResponse;
    const t = text(renderToStaticMarkup(createElement(TyreChangeResult, { result })));
    // ETRTO / ISO metric designation (C): 802.8 mm → 830.8 mm
    expect(t).toContain("802.8 mm");
    expect(t).toContain("830.8 mm");
    // UN Regulation 39 ¶5.3, ADR 18/03 (C): indicated 100 → true 103.49 → reads low, fails
    expect(t).toContain("100 km/h 100.0 km/h 103.5 km/h -3.5 km/h");
    expect(t).toContain("Reads low");
    expect(t).toContain("Exceeded: speedometer accuracy");
    expect(result.ruleSet.id).toBe("example-b-7pct-tyre");
    expect(t).toContain(result.ruleSet.name);
    expect(t).toContain("example values — check your local rules");
    expect(t).toContain("authorised vehicle engineer");
  });

  it("cable: the 20 A / 5 m / 6 mm² case shows the drop over the limit, the size and the fuse", async () => {
    const body = cableRunBody({
      currentA: "20",
      lengthOneWayM: "5",
      systemV: "12",
      limit: "critical",
      maxDropPct: "",
      areaMm2: "6",
      temperatureC: "",
      sizeSeries: "metric",
    });
    expect(body).toMatchObject({ circuit: "critical", maxDropPct: undefined });
    const { status, json } = await callRoute(cableRoute, { user: driver, body });
    expect(status).toBe(200);
    const t = text(renderToStaticMarkup(createElement(CableRunResult, { result: json as CableRunResponse })));
    // Two-wire DC drop case (C): 0.575 V = 4.79 %; ABYC E-11 (S): 3 % for critical circuits → fails;
    // case (C): next standard size 10 mm². Fuse 20 A × 1.25 → 25 A (common practice, hand-worked).
    expect(t).toContain("6 mm² drops 4.79% against the 3.00% limit, 1.79% over. Use 10 mm² with a 25 A fuse.");
    expect(t).toContain("0.575 V");
    expect(t).toContain(ELECTRICAL_CAUTION);
  });

  it("cable: a limit of one's own is sent as maxDropPct", () => {
    const body = cableRunBody({
      currentA: "20",
      lengthOneWayM: "5",
      systemV: "12",
      limit: "own",
      maxDropPct: "5",
      areaMm2: "",
      temperatureC: "",
      sizeSeries: "awg",
    });
    expect(body).toMatchObject({ circuit: undefined, maxDropPct: 5, areaMm2: undefined, sizeSeries: "awg" });
  });

  it("battery: the 720 Wh/day case with solar that falls behind", async () => {
    const body = batteryBody(
      { systemV: "12", daysAutonomy: "2", chemistry: "lithium-iron-phosphate", inverterEfficiency: "" },
      [{ label: "Camp fridge", amount: "60", unit: "W", hoursPerDay: "12", dutyPct: "", ac: false }],
      [{ kind: "solar", amount: "160", unit: "W", hoursPerDay: "5" }],
    );
    expect(body.consumers[0]).toMatchObject({ powerW: 60, hoursPerDay: 12 });
    expect(body.charging?.sources[0]).toMatchObject({ kind: "solar", watts: 160 });
    const { status, json } = await callRoute(batteryRoute, { user: driver, body });
    expect(status).toBe(200);
    const t = text(renderToStaticMarkup(createElement(BatteryResult, { result: json as BatteryResponse })));
    // Ah per day = Σ(W × h) / V (S); case (C): 720 Wh → 60 Ah; 2 days / 0.8 (common practice) = 150 Ah (hand-worked)
    expect(t).toContain("Each day 720 Wh 60.0 Ah");
    expect(t).toContain("Needs 150 Ah");
    // Hand-worked: 160 W / 12 V × 0.75 derating (common practice) = 10 A × 5 h = 50 Ah/day < 60 Ah/day
    expect(t).toContain("Falls behind");
    expect(t).toContain(ELECTRICAL_CAUTION);
  });

  it("battery: inverter efficiency is typed in % and sent as a fraction", () => {
    const body = batteryBody(
      { systemV: "24", daysAutonomy: "1", chemistry: "agm", inverterEfficiency: "85" },
      [{ label: "Laptop", amount: "90", unit: "W", hoursPerDay: "4", dutyPct: "", ac: true }],
      null,
    );
    expect(body.inverterEfficiency).toBeCloseTo(0.85, 12);
    expect(body.consumers[0]).toMatchObject({ ac: true, powerW: 90 });
    expect(body.charging).toBeUndefined();
  });
});
