export { requireCents, exactDecimal, roundHalfUp, type Fraction } from "./exact";
export { GST_RATE_PERCENT, gstOnExclusive, gstInInclusive, withGst } from "./gst";
export {
  GST_METHOD_DESCRIPTIONS,
  quoteLineSchema,
  quoteTotalsInputSchema,
  quoteTotals,
  type GstMethod,
  type QuoteLineKind,
  type QuoteLineInput,
  type QuoteTotalsInput,
  type QuoteLineResult,
  type QuoteTotals,
  type QuoteTotalsResult,
} from "./quote";
export {
  TAX_INVOICE_ON_REQUEST_ABOVE_CENTS,
  BUYER_IDENTITY_FROM_CENTS,
  taxInvoiceRequirements,
  type TaxInvoiceRequirements,
} from "./tax-invoice";
export { formatCents, parseMoneyToCents } from "./format";
