import { describe, expect, it } from "vitest";
import { defectMoveSchema, defectReportSchema, defectTitle, preTripCheckSchema } from "@/lib/defects";

// Input rules are Rigline's own. Latitude and longitude ranges are those of WGS 84 as used by
// the W3C Geolocation API (from memory).

const base = {
  clientId: "0b5c6a3e-2f7d-4a7b-9d1c-6f2e8a1b3c4d",
  vehicleId: "v1",
  severity: "stop",
  category: "brakes",
  description: "Pedal goes to the floor",
};

describe("defect report input", () => {
  it("reads form strings: blank optional fields are absent, numbers are numbers", () => {
    const parsed = defectReportSchema.parse({ ...base, odometerKm: "123456", latitude: "", longitude: "" });
    expect(parsed.odometerKm).toBe(123456);
    expect(parsed.latitude).toBeUndefined();
  });

  it("names each bad field", () => {
    const result = defectReportSchema.safeParse({ ...base, clientId: "x", severity: "bad", description: " ", odometerKm: "-4" });
    expect(result.success).toBe(false);
    const fields = result.error!.issues.map((i) => i.path.join(".")).sort();
    expect(fields).toEqual(["clientId", "description", "odometerKm", "severity"]);
  });

  it("takes a location only as a pair within range (from memory: WGS 84 ranges)", () => {
    expect(defectReportSchema.safeParse({ ...base, latitude: "-23.7", longitude: "133.87" }).success).toBe(true);
    const half = defectReportSchema.safeParse({ ...base, latitude: "-23.7" });
    expect(half.error?.issues[0]?.path).toEqual(["longitude"]);
    expect(defectReportSchema.safeParse({ ...base, latitude: "-91", longitude: "0" }).success).toBe(false);
    expect(defectReportSchema.safeParse({ ...base, latitude: "0", longitude: "180.5" }).success).toBe(false);
  });

  it("reads a check's answers and a move", () => {
    const check = preTripCheckSchema.parse({ clientId: base.clientId, vehicleId: "v1", items: [{ key: "general.tyres", result: "fail", note: " Cut in sidewall ", defectClientId: "" }] });
    expect(check.items[0]).toEqual({ key: "general.tyres", result: "fail", note: "Cut in sidewall" });
    expect(defectMoveSchema.parse({ move: "close", reason: "" })).toEqual({ move: "close" });
    expect(defectMoveSchema.safeParse({ move: "start_repair" }).success).toBe(false);
  });

  it("titles a defect by its category and the start of its description", () => {
    expect(defectTitle("brakes", "Pedal  goes to\nthe floor")).toBe("Brakes: Pedal goes to the floor");
    expect(defectTitle("other", "x".repeat(80), 10)).toBe("Other: xxxxxxxxx…");
    expect(defectTitle("winch", "Cable frayed")).toBe("winch: Cable frayed");
  });
});
