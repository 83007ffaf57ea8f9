import { z } from "zod";
import { CRITERION_OPS, EVIDENCE_KINDS, LINE_CATEGORIES, MASS_KINDS, REQUIREMENTS, ZONES } from "@/lib/variance";

/**
 * Input schema for one line of a draft edition (every field of EditionLine but its id, which the
 * database gives). Route handlers parse with it, then call the edition functions.
 *
 * Limits (Rigline rules): quantity a whole number 1–1,000; mass 0–5,000 kg; position 3 m ahead
 * of the front axle to 15 m behind it; cost whole cents up to $10 million; a line with mass that
 * may or must be fitted says where it sits (xMm, a zone, or both) so mass and axle loads can be
 * worked out.
 */

const text = (name: string, max: number) =>
  z
    .string({ error: `${name} must be text` })
    .trim()
    .min(1, { error: `${name} is required` })
    .max(max, { error: `${name} must be at most ${max} characters` });

const scalar = z.union([z.number({ error: "a criterion value must be a number or text" }), text("a criterion value", 60)], {
  error: "a criterion value must be a number or text",
});

const isNumeric = (v: number | string) => typeof v === "number" || /^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?$/.test(v);

export const criterionInputSchema = z
  .object({
    attribute: text("attribute", 60),
    label: text("label", 80).optional(),
    unit: text("unit", 20).optional(),
    op: z.enum(CRITERION_OPS, { error: `op must be one of ${CRITERION_OPS.join(", ")}` }),
    value: z.union([scalar, z.array(scalar).min(1, { error: "list at least one value" }).max(50, { error: "list at most 50 values" })], {
      error: "value must be a number, text or a list of them",
    }),
  })
  .superRefine((c, ctx) => {
    const fail = (message: string) => ctx.addIssue({ code: "custom", path: ["value"], message });
    switch (c.op) {
      case "gte":
      case "lte":
        if (Array.isArray(c.value) || !isNumeric(c.value)) fail(`"${c.op}" needs a single number`);
        break;
      case "eq":
        if (Array.isArray(c.value)) fail(`"eq" needs a single value`);
        break;
      case "between": {
        if (!Array.isArray(c.value) || c.value.length !== 2 || !c.value.every(isNumeric)) {
          fail(`"between" needs two numbers: [low, high]`);
        } else if (Number(c.value[0]) > Number(c.value[1])) {
          fail("the low bound must not exceed the high bound");
        }
        break;
      }
      case "one_of":
        if (!Array.isArray(c.value)) fail(`"one_of" needs a list of values`);
        break;
    }
  });

export const editionLineInputSchema = z
  .object({
    key: text("key", 100),
    code: text("code", 20),
    category: z.enum(LINE_CATEGORIES, { error: `category must be one of ${LINE_CATEGORIES.join(", ")}` }),
    title: text("title", 160),
    requirement: z.enum(REQUIREMENTS, { error: `requirement must be one of ${REQUIREMENTS.join(", ")}` }),
    quantity: z
      .number({ error: "quantity must be a number" })
      .int({ error: "quantity must be a whole number" })
      .min(1, { error: "quantity must be at least 1" })
      .max(1000, { error: "quantity must be at most 1,000" }),
    massKg: z
      .number({ error: "massKg must be a number" })
      .min(0, { error: "massKg must not be negative" })
      .max(5000, { error: "massKg must be at most 5,000 kg" }),
    xMm: z
      .number({ error: "xMm must be a number of millimetres" })
      .min(-3000, { error: "xMm must be no more than 3,000 mm ahead of the front axle" })
      .max(15000, { error: "xMm must be no more than 15,000 mm behind the front axle" })
      .nullable()
      .default(null),
    zone: z.enum(ZONES, { error: `zone must be one of ${ZONES.join(", ")}` }).nullable().default(null),
    massKind: z.enum(MASS_KINDS, { error: "massKind must be constant or variable" }),
    criteria: z.array(criterionInputSchema).max(20, { error: "at most 20 criteria per line" }).default([]),
    evidenceNeeded: z
      .array(z.enum(EVIDENCE_KINDS, { error: `evidence kind must be one of ${EVIDENCE_KINDS.join(", ")}` }))
      .refine((kinds) => new Set(kinds).size === kinds.length, { error: "list each evidence kind once" })
      .default([]),
    standardCostCents: z
      .number({ error: "standardCostCents must be a number" })
      .int({ error: "standardCostCents must be whole cents" })
      .min(0, { error: "standardCostCents must not be negative" })
      .max(1_000_000_000, { error: "standardCostCents must be at most $10,000,000" }),
    dependsOn: z
      .array(text("a dependency", 100))
      .max(100, { error: "at most 100 dependencies per line" })
      .refine((ids) => new Set(ids).size === ids.length, { error: "list each dependency once" })
      .default([]),
    checkable: z.boolean({ error: "checkable must be true or false" }).default(false),
    expiryMonths: z
      .number({ error: "expiryMonths must be a number" })
      .int({ error: "expiryMonths must be whole months" })
      .min(1, { error: "expiryMonths must be at least 1" })
      .max(240, { error: "expiryMonths must be at most 240" })
      .nullable()
      .default(null),
  })
  .superRefine((line, ctx) => {
    if (line.massKg > 0 && line.requirement !== "must_not_fit" && line.xMm === null && line.zone === null) {
      ctx.addIssue({
        code: "custom",
        path: ["xMm"],
        message: "say where the line sits: a distance behind the front axle (xMm) or a zone",
      });
    }
  });

/** A parsed edition line input (defaults applied). */
export type EditionLineInput = z.output<typeof editionLineInputSchema>;

/** The lines of one draft edition: keys unique. */
export const editionLinesInputSchema = z
  .array(editionLineInputSchema)
  .max(500, { error: "an edition has at most 500 lines" })
  .superRefine((lines, ctx) => {
    const seen = new Map<string, number>();
    lines.forEach((line, i) => {
      const first = seen.get(line.key);
      if (first !== undefined) {
        ctx.addIssue({ code: "custom", path: [i, "key"], message: `key ${line.key} is already used by line ${first + 1}` });
      } else seen.set(line.key, i);
    });
  });
