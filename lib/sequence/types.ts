import { z } from "zod";

/**
 * What a line asks for. "engineering" is a licensed engineer's advice or sign-off; it gates
 * every line that depends on it. "alignment" is the wheel alignment that follows suspension or
 * steering work. "decision" is a choice that fixes later work (for example the tyre size).
 */
export const LINE_KINDS = ["fitting", "engineering", "alignment", "decision", "inspection"] as const;
export type LineKind = (typeof LINE_KINDS)[number];

export const sequenceLineSchema = z.object({
  id: z.string({ error: "id must be text" }).min(1, { error: "id is required" }),
  label: z.string({ error: "label must be text" }).trim().min(1, { error: "label is required" }),
  category: z.string({ error: "category must be text" }).min(1, { error: "category is required" }),
  dependsOn: z.array(z.string({ error: "each dependency is a line id" })),
  met: z.boolean({ error: "met must be true or false" }),
  kind: z.enum(LINE_KINDS, { error: `kind must be one of ${LINE_KINDS.join(", ")}` }).optional(),
});

export const sequenceLinesSchema = z.array(sequenceLineSchema);

/** One line of an edition as the sequence sees it. */
export type SequenceLine = z.infer<typeof sequenceLineSchema>;

/** A line named in a result. */
export interface LineRef {
  id: string;
  label: string;
  kind: LineKind;
}
