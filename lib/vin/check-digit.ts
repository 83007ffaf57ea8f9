import { InputError } from "@/lib/errors";

/** Transliteration of letters for the check digit (US 49 CFR 565); I, O and Q have no value. */
const LETTER_VALUES: Readonly<Record<string, number>> = {
  A: 1, B: 2, C: 3, D: 4, E: 5, F: 6, G: 7, H: 8,
  J: 1, K: 2, L: 3, M: 4, N: 5, P: 7, R: 9,
  S: 2, T: 3, U: 4, V: 5, W: 6, X: 7, Y: 8, Z: 9,
};

/** Weight of each position 1–17 (49 CFR 565); position 9, the check digit itself, weighs 0. */
export const VIN_WEIGHTS = [8, 7, 6, 5, 4, 3, 2, 10, 0, 9, 8, 7, 6, 5, 4, 3, 2] as const;

export function vinCharacterValue(character: string): number | undefined {
  if (/^[0-9]$/.test(character)) return Number(character);
  return LETTER_VALUES[character];
}

export interface VinCheckDigit {
  weightedSum: number;
  /** Weighted sum mod 11, written "X" for 10. */
  expected: string;
}

/** The position-9 check digit of a 17-character VIN that is already structurally valid. */
export function vinCheckDigit(vin: string): VinCheckDigit {
  if (vin.length !== VIN_WEIGHTS.length) throw new InputError("vin", "a VIN has 17 characters");
  let weightedSum = 0;
  VIN_WEIGHTS.forEach((weight, index) => {
    const value = vinCharacterValue(vin.charAt(index));
    if (value === undefined) throw new InputError("vin", `position ${index + 1} is not a VIN character`);
    weightedSum += value * weight;
  });
  const remainder = weightedSum % 11;
  return { weightedSum, expected: remainder === 10 ? "X" : String(remainder) };
}
