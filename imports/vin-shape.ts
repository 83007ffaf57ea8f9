/**
 * Structural VIN check (ISO 3779): 17 characters, letters and digits only, never I, O or Q.
 * The check digit in position 9 is a North American requirement and is not judged here.
 */

export type VinShape = { ok: true; vin: string } | { ok: false; message: string };

export const VIN_LENGTH = 17;

/** Upper-cases, drops spaces, and says in plain words what is wrong, if anything. */
export function checkVinShape(raw: string): VinShape {
  const vin = raw.replace(/\s+/g, "").toUpperCase();
  if (vin.length !== VIN_LENGTH) {
    return { ok: false, message: `VIN has ${vin.length} character${vin.length === 1 ? "" : "s"}; it needs ${VIN_LENGTH}` };
  }
  for (let i = 0; i < vin.length; i++) {
    const char = vin[i]!;
    if (char === "I" || char === "O" || char === "Q") {
      const hint = char === "O" || char === "Q" ? " (perhaps the digit 0)" : " (perhaps the digit 1)";
      return { ok: false, message: `VIN has the letter ${char} at position ${i + 1}${hint}; a VIN never uses I, O or Q` };
    }
    if (!/[A-Z0-9]/.test(char)) {
      return { ok: false, message: `VIN has "${char}" at position ${i + 1}; a VIN holds only letters and digits` };
    }
  }
  return { ok: true, vin };
}
