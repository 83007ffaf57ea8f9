import { InputError, requireFinite } from "@/lib/errors";

/** An exact fraction numerator / denominator (denominator > 0). */
export interface Fraction {
  numerator: bigint;
  denominator: bigint;
}

/** Throws InputError unless `value` is a whole number of cents JavaScript can hold exactly. */
export function requireCents(field: string, value: number): number {
  requireFinite(field, value);
  if (!Number.isSafeInteger(value)) throw new InputError(field, `${field} must be a whole number of cents`);
  return value;
}

/**
 * The decimal a number was written as, exactly: 1.5 → 15/10, 0.1 → 1/10 (not the binary
 * approximation), 1e-7 → 1/10000000. Quantities typed as decimals keep their exact value.
 */
export function exactDecimal(field: string, value: number): Fraction {
  requireFinite(field, value);
  const match = /^(-?)(\d+)(?:\.(\d+))?(?:e([+-]\d+))?$/.exec(String(value));
  if (match === null) throw new InputError(field, `${field} must be a decimal number`);
  const [, sign = "", whole = "0", fraction = "", exponent = "0"] = match;
  let numerator = BigInt(`${sign}${whole}${fraction}`);
  const scale = Number(exponent) - fraction.length;
  let denominator = 1n;
  if (scale >= 0) numerator *= 10n ** BigInt(scale);
  else denominator = 10n ** BigInt(-scale);
  return { numerator, denominator };
}

/**
 * numerator / denominator to the nearest whole number, half away from zero: 0.5 c rounds up
 * (GST Act s 9-90), and a credit rounds the same way as the charge it reverses.
 */
export function roundHalfUp(numerator: bigint, denominator: bigint): bigint {
  if (denominator <= 0n) throw new InputError("denominator", "denominator must be positive");
  const negative = numerator < 0n;
  const magnitude = negative ? -numerator : numerator;
  const rounded = (magnitude * 2n + denominator) / (denominator * 2n);
  return negative ? -rounded : rounded;
}

/** Back to a number of cents, refusing amounts too large to hold exactly. */
export function toSafeCents(field: string, cents: bigint): number {
  if (cents > BigInt(Number.MAX_SAFE_INTEGER) || cents < BigInt(Number.MIN_SAFE_INTEGER)) {
    throw new InputError(field, `${field} is too large`);
  }
  return Number(cents);
}
