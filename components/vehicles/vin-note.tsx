"use client";

import { checkVin } from "@/lib/vin";

/**
 * What the VIN's check digit says, as information beside the field: ISO 3779 fixes the
 * structure; the position-9 check digit (49 CFR 565) is only required in North America.
 */
export function VinCheckDigitNote({ vin, id }: { vin: string; id?: string }) {
  if (vin.trim() === "") return null;
  const result = checkVin(vin);
  if (!result.structureOk || !result.checkDigit) return null;
  const { expected, actual, matches } = result.checkDigit;
  return (
    <p id={id} className="text-sm text-muted" data-testid="vin-check-digit" aria-live="polite">
      {matches
        ? `Check digit (position 9) is ${actual}, as the North American rule expects.`
        : `Check digit (position 9) is ${actual}; the North American rule would give ${expected}. This is information only: the check digit is not required outside North America.`}
    </p>
  );
}
