import { describe, expect, it } from "vitest";
import { InputError } from "@/lib/errors";
import { taxInvoiceRequirements } from "@/lib/money";

describe("taxInvoiceRequirements", () => {
  it("a buyer may ask for a tax invoice only over $82.50 including GST", () => {
    // ATO tax invoice rules (P/S): over $82.50 incl. GST
    expect(taxInvoiceRequirements(8250).buyerMayRequestTaxInvoice).toBe(false);
    expect(taxInvoiceRequirements(8251).buyerMayRequestTaxInvoice).toBe(true);
  });

  it("from exactly $1,000 the buyer's identity or ABN must be shown", () => {
    // ATO tax invoice rules (P/S): from $1,000 — exactly $1,000 included
    expect(taxInvoiceRequirements(99999).mustShowBuyerIdentityOrAbn).toBe(false);
    const atThreshold = taxInvoiceRequirements(100000);
    expect(atThreshold).toMatchObject({ buyerMayRequestTaxInvoice: true, mustShowBuyerIdentityOrAbn: true });
    expect(atThreshold.notes).toHaveLength(2);
    expect(taxInvoiceRequirements(0)).toEqual({
      buyerMayRequestTaxInvoice: false,
      mustShowBuyerIdentityOrAbn: false,
      notes: [],
    });
  });

  it("refuses fractions of a cent", () => {
    expect(() => taxInvoiceRequirements(8250.5)).toThrow(InputError);
  });
});
