import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { InputError } from "@/lib/errors";
import { checkVin, requireVin, vinCheckDigit, vinSchema } from "@/lib/vin";

describe("VIN check digit (US 49 CFR 565, P)", () => {
  it.each([
    // 49 CFR 565 sample (S)
    ["1G4AH59H45G118341", 411, "4"],
    // NHTSA new-manufacturer guide (S)
    ["1J9RP1A36A1644345", 314, "6"],
    // widely used textbook example (S)
    ["1M8GDM9AXKP042788", 351, "X"],
    // ISO 3779 structure, 49 CFR 565 check digit (S)
    ["LJCPCBLCX11000237", 186, "X"],
  ])("%s has weighted sum %i and check digit %s", (vin, weightedSum, digit) => {
    expect(vinCheckDigit(vin)).toEqual({ weightedSum, expected: digit });
    const result = checkVin(vin);
    expect(result.structureOk).toBe(true);
    expect(result.problems).toEqual([]);
    expect(result.checkDigit).toMatchObject({ weightedSum, expected: digit, actual: digit, matches: true });
  });

  it("a wrong check digit is reported, never a rejection", () => {
    // 49 CFR 565 sample (S) with position 9 changed from 4 to 7: still a well-formed VIN
    const result = checkVin("1G4AH59H75G118341");
    expect(result.structureOk).toBe(true);
    expect(result.checkDigit).toMatchObject({ expected: "4", actual: "7", matches: false });
    expect(result.checkDigit?.note).toMatch(/North America/);
    expect(requireVin("1G4AH59H75G118341")).toBe("1G4AH59H75G118341");
  });
});

describe("checkVin structure (ISO 3779, S)", () => {
  it("normalises lower case and spaces", () => {
    // 49 CFR 565 sample (S), typed in lower case with spaces
    const result = checkVin("  1g4ah59h4 5g118341 ");
    expect(result.normalised).toBe("1G4AH59H45G118341");
    expect(result.structureOk).toBe(true);
    expect(result.checkDigit?.matches).toBe(true);
  });

  it.each([
    ["1G4AH59H45GI18341", 12, "I", "1"],
    ["1G4AO59H45G118341", 5, "O", "0"],
    ["1G4AH59H45G11834Q", 17, "Q", "0"],
  ])("refuses %s naming position %i", (vin, position, letter, digit) => {
    // ISO 3779 (S): the letters I, O and Q are never used
    const result = checkVin(vin);
    expect(result.structureOk).toBe(false);
    expect(result.checkDigit).toBeNull();
    expect(result.problems).toEqual([
      {
        position,
        message: `Position ${position} is the letter ${letter}, which a VIN never uses; it is probably the digit ${digit}.`,
      },
    ]);
  });

  it("names a wrong length", () => {
    // ISO 3779 (S): 17 characters
    expect(checkVin("1G4AH59H45G11834").problems).toEqual([{ message: "A VIN has 17 characters; this one has 16." }]);
    expect(checkVin("1G4AH59H45G1183411").problems[0]?.message).toMatch(/this one has 18/);
    expect(checkVin("   ").problems).toEqual([{ message: "Enter the 17-character VIN." }]);
  });

  it("names characters that are not letters or digits", () => {
    expect(checkVin("1G4AH59H4-G118341").problems).toEqual([
      { position: 10, message: 'Position 10 is "-"; a VIN has only letters and digits.' },
    ]);
  });

  it("requireVin and vinSchema turn problems into errors", () => {
    expect(() => requireVin("1G4AO59H45G118341", "rows.3.vin")).toThrow(
      expect.objectContaining({ name: "InputError", field: "rows.3.vin" }),
    );
    expect(() => requireVin("short")).toThrow(InputError);
    expect(vinSchema.parse(" 1m8gdm9axkp042788")).toBe("1M8GDM9AXKP042788");
    const bad = vinSchema.safeParse("1G4AO59H45G1183");
    expect(bad.success).toBe(false);
    expect(bad.error?.issues.map((issue) => issue.message)).toEqual([
      "A VIN has 17 characters; this one has 15.",
      "Position 5 is the letter O, which a VIN never uses; it is probably the digit 0.",
    ]);
  });

  it("any 17 characters from the VIN alphabet are well formed and get a check digit", () => {
    const alphabet = [..."ABCDEFGHJKLMNPRSTUVWXYZ0123456789"];
    fc.assert(
      fc.property(fc.array(fc.constantFrom(...alphabet), { minLength: 17, maxLength: 17 }), (chars) => {
        const result = checkVin(chars.join(""));
        expect(result.structureOk).toBe(true);
        expect(result.checkDigit?.expected).toMatch(/^[0-9X]$/);
        expect(result.checkDigit?.matches).toBe(result.checkDigit?.expected === chars[8]);
      }),
    );
  });
});
