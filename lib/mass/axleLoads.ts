import { z } from "zod";
import { InputError, requireFinite, requireNonNegative, requirePositive } from "../errors";
import { leverRule } from "./lever";
import { zoneXMm } from "./zones";

export interface AxleLoadsInput {
  wheelbaseMm: number;
  /** The vehicle before these items: kerb, measured, or a previous result. */
  base: { frontKg: number; rearKg: number };
  ratings: { frontKg: number; rearKg: number; gvmKg: number; gcmKg?: number };
  items: Array<{ label?: string; massKg: number; xMm: number }>;
  trailer?: { atmKg: number; towballKg: number };
  /** Towball distance behind the front axle (default: the towbar zone behind the rear axle). */
  towballXMm?: number;
}

export type AxleLimit = "front" | "rear" | "gvm" | "gcm";

export interface AxleLoadsResult {
  frontKg: number;
  rearKg: number;
  grossKg: number;
  /** Rating minus load: negative means over the limit. */
  headroom: { frontKg: number; rearKg: number; gvmKg: number; gcmKg?: number };
  /** The limit with the least headroom. */
  binding: { limit: AxleLimit; marginKg: number };
}

const kg = (name: string) =>
  z.number({ error: `${name} must be a number of kg` }).nonnegative({ error: `${name} must not be negative` });
const positiveKg = (name: string) =>
  z.number({ error: `${name} must be a number of kg` }).positive({ error: `${name} must be greater than zero` });

/** Input of POST /api/calc/axle-loads. */
export const axleLoadsInputSchema = z
  .object({
    wheelbaseMm: z
      .number({ error: "wheelbaseMm must be a number of mm" })
      .positive({ error: "wheelbaseMm must be greater than zero" })
      .max(10_000, { error: "wheelbaseMm looks wrong: more than 10 m" }),
    base: z.object({ frontKg: kg("base.frontKg"), rearKg: kg("base.rearKg") }),
    ratings: z.object({
      frontKg: positiveKg("ratings.frontKg"),
      rearKg: positiveKg("ratings.rearKg"),
      gvmKg: positiveKg("ratings.gvmKg"),
      gcmKg: positiveKg("ratings.gcmKg").optional(),
    }),
    items: z
      .array(
        z.object({
          label: z.string().max(200, { error: "label is too long" }).optional(),
          massKg: kg("massKg"),
          xMm: z.number({ error: "xMm must be a number of mm behind the front axle" }),
        }),
      )
      .max(500, { error: "at most 500 items" }),
    trailer: z
      .object({ atmKg: kg("trailer.atmKg"), towballKg: kg("trailer.towballKg") })
      .refine((t) => t.towballKg <= t.atmKg, { path: ["towballKg"], error: "towball download cannot exceed the trailer's ATM" })
      .optional(),
    towballXMm: z.number({ error: "towballXMm must be a number of mm behind the front axle" }).optional(),
  });

export type AxleLoadsApiInput = z.infer<typeof axleLoadsInputSchema>;

/**
 * Axle loads after adding items (and a trailer's towball download) to a base, by the lever rule,
 * with headroom against each rating and the limit that binds. The towball download counts within
 * GVM; the combination is the vehicle plus the trailer's ATM less the download (= vehicle + GTM).
 */
export function axleLoads(input: AxleLoadsInput): AxleLoadsResult {
  const wb = requirePositive("wheelbaseMm", input.wheelbaseMm);
  let frontKg = requireNonNegative("base.frontKg", input.base?.frontKg);
  let rearKg = requireNonNegative("base.rearKg", input.base?.rearKg);
  const r = input.ratings;
  if (!r) throw new InputError("ratings", "ratings are required");
  requirePositive("ratings.frontKg", r.frontKg);
  requirePositive("ratings.rearKg", r.rearKg);
  requirePositive("ratings.gvmKg", r.gvmKg);
  if (r.gcmKg !== undefined) requirePositive("ratings.gcmKg", r.gcmKg);
  if (!Array.isArray(input.items)) throw new InputError("items", "items must be a list");

  input.items.forEach((item, i) => {
    requireNonNegative(`items.${i}.massKg`, item.massKg);
    const share = leverRule(item, wb, `items.${i}`);
    frontKg += share.frontKg;
    rearKg += share.rearKg;
  });

  let trailerOnGroundKg = 0;
  if (input.trailer) {
    const atm = requireNonNegative("trailer.atmKg", input.trailer.atmKg);
    const ball = requireNonNegative("trailer.towballKg", input.trailer.towballKg);
    if (ball > atm) throw new InputError("trailer.towballKg", "towball download cannot exceed the trailer's ATM");
    const x =
      input.towballXMm === undefined ? zoneXMm("towbar", wb) : requireFinite("towballXMm", input.towballXMm);
    const share = leverRule({ massKg: ball, xMm: x }, wb, "trailer.towball");
    frontKg += share.frontKg;
    rearKg += share.rearKg;
    trailerOnGroundKg = atm - ball;
  }

  const grossKg = frontKg + rearKg;
  const headroom: AxleLoadsResult["headroom"] = {
    frontKg: r.frontKg - frontKg,
    rearKg: r.rearKg - rearKg,
    gvmKg: r.gvmKg - grossKg,
    ...(r.gcmKg === undefined ? {} : { gcmKg: r.gcmKg - (grossKg + trailerOnGroundKg) }),
  };

  // Ties go to the first listed: GVM, then the axles, then GCM.
  const candidates: Array<[AxleLimit, number | undefined]> = [
    ["gvm", headroom.gvmKg],
    ["front", headroom.frontKg],
    ["rear", headroom.rearKg],
    ["gcm", headroom.gcmKg],
  ];
  let binding: AxleLoadsResult["binding"] = { limit: "gvm", marginKg: headroom.gvmKg };
  for (const [limit, margin] of candidates) {
    if (margin !== undefined && margin < binding.marginKg) binding = { limit, marginKg: margin };
  }

  return { frontKg, rearKg, grossKg, headroom, binding };
}
