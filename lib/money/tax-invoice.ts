import { requireCents } from "./exact";

/** Above this GST-inclusive amount a buyer may ask for a tax invoice ($82.50; ATO). */
export const TAX_INVOICE_ON_REQUEST_ABOVE_CENTS = 8250;
/** From this GST-inclusive amount a tax invoice must also show the buyer's identity or ABN ($1,000; ATO). */
export const BUYER_IDENTITY_FROM_CENTS = 100000;

export interface TaxInvoiceRequirements {
  /** The sale is over $82.50 including GST: the buyer may ask for a tax invoice. */
  buyerMayRequestTaxInvoice: boolean;
  /** The sale is $1,000 or more including GST: the tax invoice must show the buyer's identity or ABN. */
  mustShowBuyerIdentityOrAbn: boolean;
  notes: string[];
}

export function taxInvoiceRequirements(totalInclCents: number): TaxInvoiceRequirements {
  requireCents("totalInclCents", totalInclCents);
  const buyerMayRequestTaxInvoice = totalInclCents > TAX_INVOICE_ON_REQUEST_ABOVE_CENTS;
  const mustShowBuyerIdentityOrAbn = totalInclCents >= BUYER_IDENTITY_FROM_CENTS;
  const notes: string[] = [];
  if (buyerMayRequestTaxInvoice) notes.push("Over $82.50 including GST: the buyer may ask for a tax invoice.");
  if (mustShowBuyerIdentityOrAbn) notes.push("$1,000 or more including GST: the tax invoice must show the buyer's identity or ABN.");
  return { buyerMayRequestTaxInvoice, mustShowBuyerIdentityOrAbn, notes };
}
