import { z } from "zod";

/**
 * A jurisdiction's limits on lifts and tyre changes made without an engineer's certificate.
 * Rules differ by jurisdiction and change over time, so Rigline ships them only as editable
 * examples (`exampleOnly: true`): the product informs, it never certifies.
 */
export interface RuleSet {
  id: string;
  name: string;
  exampleOnly: true;
  /** Shown beside every result that uses this set. */
  note: string;
  /** Largest suspension ride-height change without certification. */
  suspensionLiftMaxMm: number;
  /** Largest suspension lift as a share of the original suspension travel (e.g. 1/3). */
  suspensionLiftMaxTravelFraction: number;
  /** Largest tyre diameter increase over the largest tyre the maker specifies, in mm. */
  tyreDiameterIncreaseMaxMm?: number;
  /** Largest tyre diameter increase as a percentage of the largest tyre the maker specifies. */
  tyreDiameterIncreaseMaxPct?: number;
  /** Largest combined lift (suspension + tyre lift) without certification. */
  combinedLiftMaxMm: number;
  /** Largest part of the combined lift that may come from tyres (tyre lift = ½ × diameter increase). */
  tyreLiftShareMaxMm: number;
  /** Largest lift that can be certified at all, where the jurisdiction sets one. */
  maxCertifiedLiftMm?: number;
  /** Largest wheel track increase beyond the maker's maximum without approval. */
  wheelTrackIncreaseMaxMm: number;
}

const mm = (name: string) =>
  z
    .number({ error: `${name} must be a number of millimetres` })
    .nonnegative({ error: `${name} must not be negative` })
    .max(1000, { error: `${name} looks wrong: more than 1000 mm` });

/** Validates a rule set as an admin edits it; cross-field rules report on the field at fault. */
export const ruleSetSchema = z
  .object({
    id: z
      .string({ error: "id must be text" })
      .regex(/^[a-z0-9][a-z0-9-]{0,63}$/, { error: "id must be lower-case letters, digits and hyphens" }),
    name: z.string({ error: "name must be text" }).trim().min(1, { error: "name is required" }).max(120),
    exampleOnly: z.literal(true, { error: "rule sets are example values and must say so (exampleOnly: true)" }),
    note: z.string({ error: "note must be text" }).trim().min(1, { error: "note is required" }).max(2000),
    suspensionLiftMaxMm: mm("suspensionLiftMaxMm"),
    suspensionLiftMaxTravelFraction: z
      .number({ error: "suspensionLiftMaxTravelFraction must be a number" })
      .gt(0, { error: "suspensionLiftMaxTravelFraction must be greater than 0" })
      .max(1, { error: "suspensionLiftMaxTravelFraction must be at most 1 (all of the travel)" }),
    tyreDiameterIncreaseMaxMm: mm("tyreDiameterIncreaseMaxMm").optional(),
    tyreDiameterIncreaseMaxPct: z
      .number({ error: "tyreDiameterIncreaseMaxPct must be a number" })
      .nonnegative({ error: "tyreDiameterIncreaseMaxPct must not be negative" })
      .max(50, { error: "tyreDiameterIncreaseMaxPct looks wrong: more than 50 %" })
      .optional(),
    combinedLiftMaxMm: mm("combinedLiftMaxMm"),
    tyreLiftShareMaxMm: mm("tyreLiftShareMaxMm"),
    maxCertifiedLiftMm: mm("maxCertifiedLiftMm").optional(),
    wheelTrackIncreaseMaxMm: mm("wheelTrackIncreaseMaxMm"),
  })
  .refine((r) => r.tyreDiameterIncreaseMaxMm !== undefined || r.tyreDiameterIncreaseMaxPct !== undefined, {
    path: ["tyreDiameterIncreaseMaxMm"],
    error: "give a tyre diameter limit in mm or in %",
  })
  .refine((r) => r.tyreLiftShareMaxMm <= r.combinedLiftMaxMm, {
    path: ["tyreLiftShareMaxMm"],
    error: "the tyre share of the lift cannot exceed the combined lift limit",
  })
  .refine((r) => r.suspensionLiftMaxMm <= r.combinedLiftMaxMm, {
    path: ["suspensionLiftMaxMm"],
    error: "the suspension lift limit cannot exceed the combined lift limit",
  })
  .refine((r) => r.maxCertifiedLiftMm === undefined || r.maxCertifiedLiftMm >= r.combinedLiftMaxMm, {
    path: ["maxCertifiedLiftMm"],
    error: "the most that can be certified cannot be below the limit without certification",
  });

export type RuleSetInput = z.input<typeof ruleSetSchema>;
