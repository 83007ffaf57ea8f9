import { requireCents, roundHalfUp, toSafeCents } from "./exact";

/** GST rate, per cent: A New Tax System (Goods and Services Tax Imposition—General) Act 1999 s 4. */
export const GST_RATE_PERCENT = 10;

const HUNDRED = 100n;
const RATE = BigInt(GST_RATE_PERCENT);

/** GST on a GST-exclusive amount: 10 %, to the nearest cent, half a cent up (GST Act s 9-90). */
export function gstOnExclusive(exclusiveCents: number): number {
  requireCents("exclusiveCents", exclusiveCents);
  return toSafeCents("exclusiveCents", roundHalfUp(BigInt(exclusiveCents) * RATE, HUNDRED));
}

/** The GST inside a fully taxable GST-inclusive price: 1/11 of it, to the cent, half a cent up. */
export function gstInInclusive(inclusiveCents: number): number {
  requireCents("inclusiveCents", inclusiveCents);
  return toSafeCents("inclusiveCents", roundHalfUp(BigInt(inclusiveCents) * RATE, HUNDRED + RATE));
}

/** A GST-exclusive amount with its GST added. */
export function withGst(exclusiveCents: number): number {
  const gstCents = gstOnExclusive(exclusiveCents);
  return toSafeCents("exclusiveCents", BigInt(exclusiveCents) + BigInt(gstCents));
}
