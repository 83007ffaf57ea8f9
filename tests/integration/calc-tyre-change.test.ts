import { describe, expect, it, vi } from "vitest";
import { POST as tyreChangeRoute } from "@/app/api/calc/tyre-change/route";
import { useTestDatabase } from "../helpers/db";
import { callRoute, requestUser } from "../helpers/route";
import { signedInAs } from "../helpers/users";

vi.mock("@/lib/server/session", async (original) => ({
  ...(await original<typeof import("@/lib/server/session")>()),
  currentUser: async () => requestUser.current,
}));

const database = await useTestDatabase();
const manager = await signedInAs(database, "manager@mirrabel-health.example");

type Row = { indicatedKmh: number; trueNewKmh: number; readsHighKmh: number; allowedHighKmh: number; compliant: boolean };
type Finding = { code: string; severity: string; message: string };
type TyreResult = {
  oldDiameterMm: number;
  newDiameterMm: number;
  diameterChangeMm: number;
  diameterRatio: number;
  clearanceGainedMm: number;
  speedometer: Row[];
  findings: Finding[];
  worst: string;
  lift?: { combinedLiftMm: number; ruleSetId: string };
  ruleSet: { id: string; name: string; note: string; exampleOnly: boolean };
  caution: string;
};
type ErrorJson = { error: { code: string; details: { field?: string; message: string }[] } };

const post = (body: unknown) => callRoute(tyreChangeRoute, { user: manager, url: "http://localhost/api/calc/tyre-change", body });
const row100 = (r: TyreResult) => r.speedometer.find((x) => x.indicatedKmh === 100);
const finding = (r: TyreResult, code: string) => r.findings.find((f) => f.code === code);

describe("POST /api/calc/tyre-change", () => {
  it("265/70R17 → 285/70R17: diameters, ratio and clearance", async () => {
    const { status, json } = await post({ from: "265/70R17", to: "285/70R17" });
    expect(status).toBe(200);
    const r = json as TyreResult;
    // ETRTO / ISO metric designation (C): 802.8 mm → 830.8 mm
    expect(r.oldDiameterMm).toBeCloseTo(802.8, 6);
    expect(r.newDiameterMm).toBeCloseTo(830.8, 6);
    // UN Regulation 39 ¶5.3, ADR 18/03 (C): diameter ratio 1.03488
    expect(r.diameterRatio).toBeCloseTo(1.03488, 5);
    // Queensland guidance (S): tyre lift = ½ × diameter increase → 14 mm more clearance
    expect(r.clearanceGainedMm).toBeCloseTo(14, 6);
  });

  it("exact on the old tyres: indicated 100 → true 103.49, reads low → fails", async () => {
    const { json } = await post({ from: "265/70R17", to: "285/70R17" });
    const r = json as TyreResult;
    // UN Regulation 39 ¶5.3, ADR 18/03 (C): V1 − V2 = −3.49 → fails (may read high, never low)
    expect(row100(r)?.trueNewKmh).toBeCloseTo(103.49, 2);
    expect(row100(r)?.readsHighKmh).toBeCloseTo(-3.49, 2);
    expect(row100(r)?.compliant).toBe(false);
    expect(finding(r, "speedometer")?.severity).toBe("exceeds");
    expect(r.worst).toBe("exceeds");
  });

  it("read 100 at a true 95 on the old tyres: true 98.31 on the new ones → passes", async () => {
    const { status, json } = await post({ from: "265/70R17", to: "285/70R17", speedoReadsHighPct: 5 });
    expect(status).toBe(200);
    const r = json as TyreResult;
    // UN Regulation 39 ¶5.3, ADR 18/03 (C): true 98.31, V1 − V2 = 1.69 ≤ 13.83
    expect(row100(r)?.trueNewKmh).toBeCloseTo(98.31, 2);
    expect(row100(r)?.readsHighKmh).toBeCloseTo(1.69, 2);
    expect(row100(r)?.allowedHighKmh).toBeCloseTo(13.83, 2);
    expect(row100(r)?.compliant).toBe(true);
    expect(r.speedometer.every((x) => x.compliant)).toBe(true);
    expect(finding(r, "speedometer")?.severity).toBe("ok");
  });

  it("checks the lift against the chosen example rule set and says which set was used", async () => {
    const { status, json } = await post({
      from: "265/70R17",
      to: "285/70R17",
      speedoReadsHighPct: 5,
      ruleSetId: "example-a-50mm-tyre",
      suspensionLiftMm: 50,
    });
    expect(status).toBe(200);
    const r = json as TyreResult;
    // Queensland guidance (S): combined 50 + 28/2 = 64 mm ≤ 75 mm.
    // VSB 14 section LS as quoted by the Victorian VSI 8 (S): ≤ +50 mm diameter → +28 mm is within.
    expect(r.lift?.combinedLiftMm).toBeCloseTo(64, 6);
    expect(finding(r, "combined-lift")?.severity).toBe("ok");
    expect(finding(r, "tyre-diameter-mm")?.severity).toBe("ok");
    expect(r.ruleSet).toMatchObject({ id: "example-a-50mm-tyre", exampleOnly: true });
    expect(r.caution).toContain(r.ruleSet.name);
    expect(r.caution).toMatch(/example values — check your local rules/);
    expect(r.caution).toMatch(/authorised vehicle engineer/);
  });

  it("uses the first example rule set when none is named, and still names it", async () => {
    const { json } = await post({ from: "265/70R17", to: "285/70R17" });
    const r = json as TyreResult;
    expect(r.ruleSet.id).toBe("example-a-50mm-tyre");
    expect(r.lift?.ruleSetId).toBe("example-a-50mm-tyre");
    expect(r.caution).toContain(r.ruleSet.name);
  });

  it("a suspension lift beyond the combined limit needs certification", async () => {
    const { json } = await post({ from: "265/70R17", to: "285/70R17", ruleSetId: "example-c-150mm-ceiling", suspensionLiftMm: 70 });
    const r = json as TyreResult;
    // Queensland guidance (S): combined lift ≤ 75 mm; hand-worked 70 + 28/2 = 84 mm → above it
    expect(r.lift?.combinedLiftMm).toBeCloseTo(84, 6);
    expect(finding(r, "combined-lift")?.severity).toBe("exceeds");
  });

  it("answers 422 naming the field for a garbage tyre size", async () => {
    const { status, json } = await post({ from: "265/70R17", to: "big chunky ones" });
    expect(status).toBe(422);
    const body = json as ErrorJson;
    expect(body.error.code).toBe("validation_failed");
    expect(body.error.details[0]?.field).toBe("to");
    expect(body.error.details[0]?.message).toMatch(/metric size like/);
  });

  it("answers 422 naming the field for an unknown rule set and a negative lift", async () => {
    const set = await post({ from: "265/70R17", to: "285/70R17", ruleSetId: "somewhere-else" });
    expect(set.status).toBe(422);
    expect((set.json as ErrorJson).error.details[0]?.field).toBe("ruleSetId");
    const lift = await post({ from: "265/70R17", to: "285/70R17", suspensionLiftMm: -10 });
    expect(lift.status).toBe(422);
    expect((lift.json as ErrorJson).error.details[0]?.field).toBe("suspensionLiftMm");
    const speedo = await post({ from: "265/70R17", to: "285/70R17", speedoReadsHighPct: "five" });
    expect(speedo.status).toBe(422);
    expect((speedo.json as ErrorJson).error.details[0]?.field).toBe("speedoReadsHighPct");
  });
});
