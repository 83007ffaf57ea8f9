import { z } from "zod";
import { ZONES } from "./zones";

const figure = (name: string) =>
  z.number({ error: `${name} must be a number` }).positive({ error: `${name} must be greater than zero` }).nullish();
const kg = (name: string) =>
  z.number({ error: `${name} must be a number of kg` }).nonnegative({ error: `${name} must not be negative` });
const zone = z.enum(ZONES, { error: `zone must be one of ${ZONES.join(", ")}` });
const placed = { xMm: z.number({ error: "xMm must be a number of mm behind the front axle" }).optional(), zone: zone.optional() };

const zonePosition = z.discriminatedUnion("kind", [
  z.object({ kind: z.literal("fraction"), fraction: z.number().min(-1).max(2) }),
  z.object({ kind: z.literal("behindFrontAxle"), mm: z.number() }),
  z.object({ kind: z.literal("behindRearAxle"), mm: z.number() }),
]);

/** Input of the per-vehicle mass computation (e.g. a what-if request from the planner). */
export const vehicleMassInputSchema = z.object({
  platform: z.object({
    wheelbaseMm: figure("platform.wheelbaseMm"),
    kerbMassKg: figure("platform.kerbMassKg"),
    kerbFrontKg: figure("platform.kerbFrontKg"),
    kerbRearKg: figure("platform.kerbRearKg"),
    gvmKg: figure("platform.gvmKg"),
    gcmKg: figure("platform.gcmKg"),
    frontAxleRatingKg: figure("platform.frontAxleRatingKg"),
    rearAxleRatingKg: figure("platform.rearAxleRatingKg"),
    towingCapacityKg: kg("platform.towingCapacityKg").nullish(),
    towballMaxKg: kg("platform.towballMaxKg").nullish(),
    roofDynamicLimitKg: kg("platform.roofDynamicLimitKg").nullish(),
    zonePositions: z.partialRecord(zone, zonePosition).optional(),
  }),
  measured: z
    .object({ frontKg: kg("measured.frontKg"), rearKg: kg("measured.rearKg"), includesFittedItems: z.boolean().optional() })
    .optional(),
  items: z
    .array(
      z.object({
        label: z.string().max(200).optional(),
        massKg: kg("massKg"),
        ...placed,
        variable: z.boolean().optional(),
        status: z.enum(["fitted", "planned"], { error: 'status must be "fitted" or "planned"' }).optional(),
        rackLoadLimitKg: kg("rackLoadLimitKg").optional(),
      }),
    )
    .max(500)
    .optional(),
  occupants: z
    .array(z.object({ count: z.number().int({ error: "count must be a whole number" }).min(0).max(20), ...placed }))
    .max(10)
    .optional(),
  occupantMassKg: z.number().positive().max(300).optional(),
  fuel: z.object({ litres: kg("fuel.litres"), densityKgPerL: z.number().positive().max(1.5).optional(), ...placed }).optional(),
  water: z.object({ litres: kg("water.litres"), ...placed }).optional(),
  cargo: z.object({ massKg: kg("cargo.massKg"), ...placed }).optional(),
  trailer: z
    .object({ atmKg: kg("trailer.atmKg"), towballKg: kg("trailer.towballKg") })
    .refine((t) => t.towballKg <= t.atmKg, { path: ["towballKg"], error: "towball download cannot exceed the trailer's ATM" })
    .optional(),
  towballXMm: z.number().optional(),
  tyres: z
    .object({
      size: z.string().max(40).optional(),
      frontLoadIndex: z.number().int().optional(),
      rearLoadIndex: z.number().int().optional(),
      frontCount: z.number().int().min(1).max(8).optional(),
      rearCount: z.number().int().min(1).max(8).optional(),
    })
    .optional(),
  brakeUpgradeFitted: z.boolean().optional(),
  aboveStandardWarnKg: kg("aboveStandardWarnKg").optional(),
});

export type VehicleMassApiInput = z.infer<typeof vehicleMassInputSchema>;
