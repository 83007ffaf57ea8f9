import { z } from "zod";
import { InputError } from "../errors";
import { parseTyreSize } from "./size";

// A size field: text that parseTyreSize understands; its own message says what form is expected.
const tyreSizeText = (name: string) =>
  z
    .string({ error: `${name} must be a tyre size as text` })
    .trim()
    .min(1, { error: `${name} is required` })
    .max(40, { error: `${name} is too long for a tyre size` })
    .superRefine((value, ctx) => {
      try {
        parseTyreSize(value, name);
      } catch (e) {
        ctx.addIssue({ code: "custom", message: e instanceof InputError ? e.message : `${name} is not a tyre size` });
      }
    });

/** Input of the tyre change check as the API accepts it. */
export const tyreChangeInputSchema = z.object({
  from: tyreSizeText("from"),
  to: tyreSizeText("to"),
  speedoReadsHighPct: z
    .number({ error: "speedoReadsHighPct must be a number (% of the indicated speed)" })
    .min(-20, { error: "speedoReadsHighPct must be at least -20" })
    .max(50, { error: "speedoReadsHighPct must be at most 50" })
    .optional(),
});

export type TyreChangeApiInput = z.infer<typeof tyreChangeInputSchema>;
