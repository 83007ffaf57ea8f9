/**
 * Demo vehicle identifiers: VINs with a valid ISO 3779 structure (17 characters, no I, O or Q)
 * under an invented manufacturer code, and invented registrations.
 */
const VIN_ALPHABET = "ABCDEFGHJKLMNPRSTUVWXYZ0123456789";

export function demoVin(prefix: string, index: number): string {
  const wmi = prefix === "MH" ? "7RM" : "7RG"; // invented world manufacturer codes
  let body = "";
  let n = (index + 1) * 2654435761;
  for (let k = 0; k < 6; k++) {
    body += VIN_ALPHABET[n % VIN_ALPHABET.length];
    n = Math.floor(n / VIN_ALPHABET.length) + 7 * k + index;
  }
  const serial = String(100000 + index * 37).slice(-6);
  // position 9 (check digit slot) left as "0"; the North American check digit is not required here
  return `${wmi}${body}0R${"K"}${serial}`.slice(0, 17);
}

export function demoRegistration(prefix: string, index: number): string {
  const letters = "ABCDEFGHJKLMNPRSTUVWXYZ";
  const a = letters[(index * 7) % letters.length]!;
  const b = letters[(index * 11 + 3) % letters.length]!;
  return `${prefix === "MH" ? "1" : "2"}${a}${b}-${String(100 + ((index * 37) % 900))}`;
}
