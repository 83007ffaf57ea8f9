import { InputError } from "@/lib/errors";
import { requireCents, toSafeCents } from "./exact";

/** Cents as Australian dollars: 123450 → "$1,234.50", −500 → "-$5.00". */
export function formatCents(cents: number): string {
  requireCents("cents", cents);
  const magnitude = Math.abs(cents);
  const dollars = Math.floor(magnitude / 100)
    .toString()
    .replace(/\B(?=(\d{3})+(?!\d))/g, ",");
  const rest = (magnitude % 100).toString().padStart(2, "0");
  return `${cents < 0 ? "-" : ""}$${dollars}.${rest}`;
}

// Optional minus, optional $, whole dollars either ungrouped or grouped in threes, 0–2 decimals.
const MONEY_TEXT = /^(-)?\$?(\d{1,3}(?:,\d{3})+|\d+)(?:\.(\d{1,2}))?$/;

/**
 * Strict reading of a dollar amount typed or imported: "1,234.50", "$1,234.50", "1234.5",
 * "-20" are accepted; anything else ("12.345", "1,23", "1e3", "twelve", "") is an InputError.
 */
export function parseMoneyToCents(text: string, field = "amount"): number {
  if (typeof text !== "string") throw new InputError(field, `${field} must be text`);
  const match = MONEY_TEXT.exec(text.trim());
  if (match === null) {
    throw new InputError(field, `${field} must be an amount in dollars and cents, such as 1,234.50`);
  }
  const [, minus, dollars = "0", fraction = ""] = match;
  const cents = BigInt(dollars.replaceAll(",", "")) * 100n + BigInt(fraction.padEnd(2, "0"));
  return toSafeCents(field, minus === "-" ? -cents : cents) + 0; // + 0 turns −0 into 0
}
