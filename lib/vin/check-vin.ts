import { z } from "zod";
import { InputError } from "@/lib/errors";
import { vinCharacterValue, vinCheckDigit } from "./check-digit";

export const VIN_LENGTH = 17;

export interface VinProblem {
  /** 1-based position of the character at fault; absent for a problem with the whole VIN. */
  position?: number;
  message: string;
}

export interface VinCheckDigitReport {
  weightedSum: number;
  expected: string;
  actual: string;
  matches: boolean;
  /** Why a mismatch is information only. */
  note: string;
}

export interface VinCheck {
  /** Trimmed, upper-cased, spaces removed. */
  normalised: string;
  /** 17 characters, letters and digits only, never I, O or Q (ISO 3779). */
  structureOk: boolean;
  problems: VinProblem[];
  /** Reported when the structure is sound; never a reason to refuse the VIN. */
  checkDigit: VinCheckDigitReport | null;
}

const CHECK_DIGIT_NOTE =
  "The position-9 check digit is required only on vehicles built for North America; elsewhere a mismatch is normal.";

const LOOKS_LIKE: Readonly<Record<string, string>> = { I: "1", O: "0", Q: "0" };

export function normaliseVin(text: string): string {
  return text.trim().toUpperCase().replace(/\s+/g, "");
}

/** Checks a VIN's structure (ISO 3779) and reports its check digit (49 CFR 565) as information. */
export function checkVin(text: string): VinCheck {
  if (typeof text !== "string") throw new InputError("vin", "vin must be text");
  const normalised = normaliseVin(text);
  const problems: VinProblem[] = [];
  if (normalised.length === 0) {
    problems.push({ message: "Enter the 17-character VIN." });
  } else if (normalised.length !== VIN_LENGTH) {
    problems.push({
      message: `A VIN has ${VIN_LENGTH} characters; this one has ${normalised.length}.`,
    });
  }
  [...normalised].forEach((character, index) => {
    const position = index + 1;
    const digitFor = LOOKS_LIKE[character];
    if (digitFor !== undefined) {
      problems.push({
        position,
        message: `Position ${position} is the letter ${character}, which a VIN never uses; it is probably the digit ${digitFor}.`,
      });
    } else if (vinCharacterValue(character) === undefined) {
      problems.push({ position, message: `Position ${position} is "${character}"; a VIN has only letters and digits.` });
    }
  });

  let checkDigit: VinCheckDigitReport | null = null;
  if (problems.length === 0) {
    const { weightedSum, expected } = vinCheckDigit(normalised);
    const actual = normalised.charAt(8);
    checkDigit = { weightedSum, expected, actual, matches: expected === actual, note: CHECK_DIGIT_NOTE };
  }
  return { normalised, structureOk: problems.length === 0, problems, checkDigit };
}

/** The normalised VIN, or an InputError carrying the first problem. */
export function requireVin(text: string, field = "vin"): string {
  const result = checkVin(text);
  const first = result.problems[0];
  if (first !== undefined) throw new InputError(field, first.message);
  return result.normalised;
}

/** A VIN field in a request or an import row: parsed to the normalised VIN, problems as issues. */
export const vinSchema = z.string({ error: "VIN must be text" }).transform((text, ctx) => {
  const result = checkVin(text);
  for (const problem of result.problems) ctx.issues.push({ code: "custom", message: problem.message, input: text });
  return result.normalised;
});
