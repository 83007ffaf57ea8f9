import { z } from "zod";
import type { QuoteLineInput } from "@/lib/money";

const cents = (label: string) =>
  z.coerce
    .number({ error: `${label} must be an amount in cents` })
    .int({ error: `${label} must be whole cents` })
    .refine(Number.isSafeInteger, { error: `${label} is too large` });

const amount = (label: string) =>
  z.coerce.number({ error: `${label} must be a number` }).nonnegative({ error: `${label} must not be negative` }).max(100_000, { error: `${label} is too large` });

const bool = z.union([z.boolean(), z.enum(["true", "false", "on"]).transform((v) => v !== "false")]);

/** One line of a contractor's quote as the API and the quote editor send it. */
export const quoteLineInputSchema = z.discriminatedUnion(
  "kind",
  [
    z.object({
      kind: z.enum(["part", "other"]),
      description: z.string({ error: "Describe the line" }).trim().min(1, { error: "Describe the line" }).max(500),
      quantity: amount("Quantity"),
      unitPriceCents: cents("Unit price"),
      taxable: bool.default(true),
      lineKey: z.string().trim().max(120).nullish().transform((v) => v || null),
    }),
    z.object({
      kind: z.literal("labour"),
      description: z.string({ error: "Describe the line" }).trim().min(1, { error: "Describe the line" }).max(500),
      hours: amount("Hours"),
      rateCents: cents("Hourly rate").refine((v) => v >= 0, { error: "Hourly rate must not be negative" }),
      taxable: bool.default(true),
      lineKey: z.string().trim().max(120).nullish().transform((v) => v || null),
    }),
  ],
  { error: 'Each line is a "part", "labour" or "other" line' },
);
export type QuoteLineDraft = z.output<typeof quoteLineInputSchema>;

/** Lines arrive as a list (API) or as the JSON text of one (the quote editor's hidden field). */
const linesField = z.preprocess((value) => {
  if (typeof value !== "string") return value;
  try {
    return JSON.parse(value);
  } catch {
    return value;
  }
}, z.array(quoteLineInputSchema, { error: "lines must be a list of quote lines" }).max(200, { error: "At most 200 lines" }));

const dateField = z.preprocess(
  (value) => (value === "" || value === null ? undefined : value),
  z.coerce.date({ error: "Give a valid date" }).optional(),
);

/** The editable part of a quote: lines, validity date and notes. */
export const quoteContentSchema = z.object({
  lines: linesField,
  validUntil: dateField,
  notes: z.string().trim().max(4000, { error: "Notes are too long (at most 4,000 characters)" }).optional().transform((v) => v || null),
});
export type QuoteContent = z.output<typeof quoteContentSchema>;

/** The line as `quoteTotals` reads it (labour: hours × rate; parts and other: quantity × unit price). */
export function toTotalsLine(line: QuoteLineDraft): QuoteLineInput {
  return line.kind === "labour"
    ? { kind: "labour", description: line.description, hours: line.hours, rateCents: line.rateCents, taxable: line.taxable }
    : { kind: line.kind, description: line.description, quantity: line.quantity, unitPriceCents: line.unitPriceCents, taxable: line.taxable };
}
