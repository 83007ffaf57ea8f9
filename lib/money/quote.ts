import { z } from "zod";
import { InputError, requireNonNegative } from "@/lib/errors";
import { exactDecimal, requireCents, roundHalfUp, toSafeCents } from "./exact";
import { GST_RATE_PERCENT } from "./gst";

export type QuoteLineKind = "part" | "labour" | "other";

/**
 * How GST is rounded across a quote (GST Act s 9-90 allows either; the result names the one
 * used so the screen and the document can say so).
 */
/** How GST is rounded on a quote: per line, or once on the invoice total. */
export const GST_METHODS = ["per-line", "invoice-total"] as const;
export type GstMethod = (typeof GST_METHODS)[number];

const cents = (field: string) =>
  z
    .number({ error: `${field} must be a number of cents` })
    .int({ error: `${field} must be a whole number of cents` })
    .refine(Number.isSafeInteger, { error: `${field} is too large` });

const amount = (field: string) =>
  z.number({ error: `${field} must be a number` }).nonnegative({ error: `${field} must not be negative` });

const description = z.string({ error: "description must be text" }).max(500).optional();

const pricedLineSchema = z.object({
  kind: z.enum(["part", "other"]),
  description,
  quantity: amount("quantity"),
  /** GST-exclusive price of one unit; negative for a discount or credit line. */
  unitPriceCents: cents("unitPriceCents"),
  taxable: z.boolean({ error: "taxable must be true or false" }),
});

const labourLineSchema = z.object({
  kind: z.literal("labour"),
  description,
  hours: amount("hours"),
  /** GST-exclusive hourly rate. */
  rateCents: cents("rateCents").refine((value) => value >= 0, { error: "rateCents must not be negative" }),
  taxable: z.boolean({ error: "taxable must be true or false" }),
});

export const quoteLineSchema = z.discriminatedUnion("kind", [pricedLineSchema, labourLineSchema], {
  error: 'kind must be "part", "labour" or "other"',
});

export const quoteTotalsInputSchema = z.object({
  lines: z.array(quoteLineSchema).max(1000),
  method: z.enum(GST_METHODS, { error: 'method must be "per-line" or "invoice-total"' }),
});

export type QuoteLineInput = z.infer<typeof quoteLineSchema>;
export type QuoteTotalsInput = z.infer<typeof quoteTotalsInputSchema>;

export interface QuoteLineResult {
  index: number;
  kind: QuoteLineKind;
  description: string | null;
  /** Quantity × unit price (labour: hours × rate), to the nearest cent, half a cent up. */
  exGstCents: number;
  /** True when the exact line amount had a fraction of a cent and was rounded. */
  amountRounded: boolean;
  taxable: boolean;
  /** The line's GST, exact, in tenths of a cent (10 % of whole cents is always whole tenths). */
  gstTenthsOfCent: number;
  /** The line's GST rounded to the cent; summed only by the "per-line" method. */
  gstCents: number;
  inclGstCents: number;
}

export interface QuoteTotals {
  exGstCents: number;
  taxableExGstCents: number;
  gstFreeExGstCents: number;
  gstCents: number;
  inclGstCents: number;
  byKindExGstCents: Record<QuoteLineKind, number>;
}

export interface QuoteTotalsResult {
  method: GstMethod;
  /** One sentence the screen shows beside the total. */
  methodDescription: string;
  gstRatePercent: number;
  lines: QuoteLineResult[];
  totals: QuoteTotals;
}

export const GST_METHOD_DESCRIPTIONS: Readonly<Record<GstMethod, string>> = {
  "per-line":
    "GST is worked out on each line and rounded to the nearest cent (half a cent up); the GST total is the sum of the rounded line amounts.",
  "invoice-total":
    "GST is worked out once on the total of the taxable lines and rounded to the nearest cent (half a cent up); line GST is shown for information.",
};

const LINE_AMOUNT_NOTE =
  " A line whose quantity or hours make a fraction of a cent is rounded to the nearest cent, half a cent up, before GST.";

function lineAmountCents(line: QuoteLineInput, index: number): { cents: bigint; rounded: boolean } {
  const at = `lines.${index}`;
  let multiplier;
  let priceCents: number;
  if (line.kind === "labour") {
    requireNonNegative(`${at}.hours`, line.hours);
    multiplier = exactDecimal(`${at}.hours`, line.hours);
    priceCents = requireCents(`${at}.rateCents`, line.rateCents);
    if (priceCents < 0) throw new InputError(`${at}.rateCents`, "rateCents must not be negative");
  } else if (line.kind === "part" || line.kind === "other") {
    requireNonNegative(`${at}.quantity`, line.quantity);
    multiplier = exactDecimal(`${at}.quantity`, line.quantity);
    priceCents = requireCents(`${at}.unitPriceCents`, line.unitPriceCents);
  } else {
    throw new InputError(`${at}.kind`, 'kind must be "part", "labour" or "other"');
  }
  const numerator = multiplier.numerator * BigInt(priceCents);
  return {
    cents: roundHalfUp(numerator, multiplier.denominator),
    rounded: numerator % multiplier.denominator !== 0n,
  };
}

/**
 * Line amounts, GST and totals of a quote, in integer cents. Prices are GST-exclusive; GST is
 * 10 % of taxable lines, rounded by the method chosen.
 */
export function quoteTotals(lines: readonly QuoteLineInput[], method: GstMethod): QuoteTotalsResult {
  if (method !== "per-line" && method !== "invoice-total") {
    throw new InputError("method", 'method must be "per-line" or "invoice-total"');
  }
  if (!Array.isArray(lines as unknown)) throw new InputError("lines", "lines must be a list");
  const rate = BigInt(GST_RATE_PERCENT);

  let exTotal = 0n;
  let taxableTotal = 0n;
  let roundedGstTotal = 0n;
  const byKind: Record<QuoteLineKind, bigint> = { part: 0n, labour: 0n, other: 0n };
  const results = lines.map((line, index): QuoteLineResult => {
    if (typeof line.taxable !== "boolean") throw new InputError(`lines.${index}.taxable`, "taxable must be true or false");
    const { cents, rounded } = lineAmountCents(line, index);
    const gstTenths = line.taxable ? (cents * rate) / 10n : 0n; // whole cents × 10 % = whole tenths
    const gstCents = line.taxable ? roundHalfUp(cents * rate, 100n) : 0n;
    exTotal += cents;
    byKind[line.kind] += cents;
    if (line.taxable) taxableTotal += cents;
    roundedGstTotal += gstCents;
    const field = `lines.${index}`;
    return {
      index,
      kind: line.kind,
      description: line.description ?? null,
      exGstCents: toSafeCents(field, cents),
      amountRounded: rounded,
      taxable: line.taxable,
      gstTenthsOfCent: toSafeCents(field, gstTenths),
      gstCents: toSafeCents(field, gstCents),
      inclGstCents: toSafeCents(field, cents + gstCents),
    };
  });

  const gstTotal = method === "per-line" ? roundedGstTotal : roundHalfUp(taxableTotal * rate, 100n);
  return {
    method,
    methodDescription: GST_METHOD_DESCRIPTIONS[method] + LINE_AMOUNT_NOTE,
    gstRatePercent: GST_RATE_PERCENT,
    lines: results,
    totals: {
      exGstCents: toSafeCents("lines", exTotal),
      taxableExGstCents: toSafeCents("lines", taxableTotal),
      gstFreeExGstCents: toSafeCents("lines", exTotal - taxableTotal),
      gstCents: toSafeCents("lines", gstTotal),
      inclGstCents: toSafeCents("lines", exTotal + gstTotal),
      byKindExGstCents: {
        part: toSafeCents("lines", byKind.part),
        labour: toSafeCents("lines", byKind.labour),
        other: toSafeCents("lines", byKind.other),
      },
    },
  };
}
