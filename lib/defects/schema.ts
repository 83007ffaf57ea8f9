import { z } from "zod";
import { CHECK_RESULTS } from "./checklist";
import { DEFECT_CATEGORIES, DEFECT_SEVERITIES } from "./vocabulary";

/**
 * Input schemas shared by the phone forms (checked before a report is queued) and the API
 * (checked again on arrival). Form fields arrive as strings: an empty field means "not given".
 */

const blankToUndefined = (v: unknown) => (typeof v === "string" && v.trim() === "" ? undefined : v);

const optionalNumber = (schema: z.ZodNumber) => z.preprocess(blankToUndefined, z.coerce.number().pipe(schema).optional());

export const clientIdSchema = z.uuid({ error: "The report needs a device id (a UUID)" });

/** Device time of an offline report; a clock far off is not trusted beyond now. */
const reportedAt = z.preprocess(blankToUndefined, z.coerce.date({ error: "Not a date" }).optional());

export const defectReportSchema = z
  .object({
    clientId: clientIdSchema,
    vehicleId: z.string().trim().min(1, { error: "Pick the vehicle" }).max(64),
    severity: z.enum(DEFECT_SEVERITIES, { error: "Pick how bad it is" }),
    category: z.enum(DEFECT_CATEGORIES, { error: "Pick what it is about" }),
    description: z
      .string({ error: "Say what is wrong" })
      .trim()
      .min(3, { error: "Say what is wrong (a few words)" })
      .max(2000, { error: "Keep it under 2,000 characters" }),
    odometerKm: optionalNumber(
      z.number().int({ error: "Whole kilometres" }).min(0, { error: "Cannot be negative" }).max(3_000_000, { error: "Too large for an odometer" }),
    ),
    latitude: optionalNumber(z.number().min(-90, { error: "Latitude is between -90 and 90" }).max(90, { error: "Latitude is between -90 and 90" })),
    longitude: optionalNumber(z.number().min(-180, { error: "Longitude is between -180 and 180" }).max(180, { error: "Longitude is between -180 and 180" })),
    reportedAt,
  })
  .check((ctx) => {
    const { latitude, longitude } = ctx.value;
    if ((latitude === undefined) !== (longitude === undefined)) {
      ctx.issues.push({ code: "custom", input: ctx.value, path: [latitude === undefined ? "latitude" : "longitude"], message: "Give both latitude and longitude, or neither" });
    }
  });
export type DefectReportInput = z.output<typeof defectReportSchema>;

export const checkAnswerSchema = z.object({
  key: z.string().trim().min(1).max(200),
  /** The item's label as the phone showed it (kept when the checklist has changed since). */
  label: z.preprocess(blankToUndefined, z.string().trim().max(200).optional()),
  result: z.enum(CHECK_RESULTS, { error: "Answer OK, fault or not applicable" }),
  note: z.preprocess(blankToUndefined, z.string().trim().max(1000, { error: "Keep the note under 1,000 characters" }).optional()),
  /** The device id of the defect raised from this item, when one was. */
  defectClientId: z.preprocess(blankToUndefined, clientIdSchema.optional()),
});

export const preTripCheckSchema = z.object({
  clientId: clientIdSchema,
  vehicleId: z.string().trim().min(1, { error: "Pick the vehicle" }).max(64),
  items: z.array(checkAnswerSchema, { error: "Answer the checklist" }).min(1, { error: "Answer the checklist" }).max(200),
  completedAt: reportedAt,
});
export type PreTripCheckInput = z.output<typeof preTripCheckSchema>;

const reasonText = z
  .string()
  .trim()
  .max(1000, { error: "Keep the reason under 1,000 characters" });

export const defectMoveSchema = z.discriminatedUnion(
  "move",
  [
    z.object({ move: z.literal("triage") }),
    z.object({ move: z.literal("start_repair"), jobId: z.string().trim().min(1, { error: "Pick the job" }).max(64) }),
    z.object({ move: z.literal("resolve") }),
    z.object({ move: z.literal("close"), reason: z.preprocess(blankToUndefined, reasonText.optional()) }),
    z.object({ move: z.literal("merge"), intoId: z.string().trim().min(1, { error: "Pick the report to keep" }).max(64) }),
  ],
  { error: "Pick what to do with the defect" },
);
export type DefectMoveInput = z.output<typeof defectMoveSchema>;

export const returnToServiceSchema = z.object({
  vehicleId: z.string().trim().min(1).max(64),
  reason: z
    .string({ error: "Say why the vehicle is safe again" })
    .trim()
    .min(3, { error: "Say why the vehicle is safe again" })
    .max(1000, { error: "Keep the reason under 1,000 characters" }),
});
