import { z } from "zod";
import { InputError } from "@/lib/errors";
import { batteryPlan, type BatteryChemistry, type BatteryPlanResult } from "./battery";
import { cableRun, type CircuitKind } from "./cable-run";
import { rechargeTime, type ChargeSourceKind, type RechargeResult } from "./recharge";

/**
 * A vehicle's saved 12 V plan: what a user enters on the Mass tab (consumers, days of autonomy,
 * chemistry, charging sources, cable runs), stored as one validated JSON document per vehicle,
 * and its summary (daily use, battery, recharge, each cable run's size, drop and fuse), which
 * is always recomputed from the inputs so a stored plan never carries stale results.
 */

/** A number typed into a form ("4.5") or sent as JSON (4.5); blank is "missing", never 0. */
function numberSchema(label: string, min: number, max: number, unit: string, options: { exclusiveMin?: boolean } = {}) {
  return z
    .number({ error: `Enter ${label} in ${unit}` })
    .refine((n) => Number.isFinite(n), { error: `Enter ${label} in ${unit}` })
    .refine((n) => (options.exclusiveMin ? n > min : n >= min), { error: `${capital(label)} must be ${options.exclusiveMin ? "more than" : "at least"} ${min} ${unit}` })
    .refine((n) => n <= max, { error: `${capital(label)} must be at most ${max.toLocaleString("en-AU")} ${unit}` });
}

const typedNumber = (v: unknown) => (typeof v === "string" ? (v.trim() === "" ? undefined : Number(v.trim())) : v === null ? undefined : v);

const numberField = (label: string, min: number, max: number, unit: string, options: { exclusiveMin?: boolean } = {}) =>
  z.preprocess(typedNumber, numberSchema(label, min, max, unit, options));

/** The same, where a blank field simply leaves the figure out. */
const optionalNumberField = (label: string, min: number, max: number, unit: string, options: { exclusiveMin?: boolean } = {}) =>
  z.preprocess(typedNumber, numberSchema(label, min, max, unit, options).optional());

function capital(text: string): string {
  return `${text.charAt(0).toUpperCase()}${text.slice(1)}`;
}

const label = (what: string) =>
  z
    .string({ error: `Name the ${what}` })
    .trim()
    .min(1, { error: `Name the ${what}` })
    .max(120, { error: `The ${what}'s name is too long (at most 120 characters)` });

export const PLAN_CHEMISTRIES = ["lead-acid", "agm", "lithium-iron-phosphate"] as const satisfies readonly BatteryChemistry[];
export const PLAN_SOURCE_KINDS = ["dc-dc", "solar", "mains"] as const satisfies readonly ChargeSourceKind[];
export const PLAN_CIRCUITS = ["critical", "other"] as const satisfies readonly CircuitKind[];

export const planConsumerSchema = z.object({
  label: label("consumer"),
  currentA: numberField("the current", 0, 500, "A", { exclusiveMin: true }),
  hoursPerDay: numberField("the hours a day", 0, 24, "h"),
  /** Share of the hours the consumer actually draws (a fridge compressor cycles); 100 % when not given. */
  dutyPct: optionalNumberField("the duty", 0, 100, "%"),
});

export const planSourceSchema = z
  .object({
    kind: z.enum(PLAN_SOURCE_KINDS, { error: 'kind must be "dc-dc", "solar" or "mains"' }),
    amount: numberField("the output", 0, 5000, "A or W", { exclusiveMin: true }),
    unit: z.enum(["A", "W"], { error: 'unit must be "A" or "W"' }),
    hoursPerDay: optionalNumberField("the hours a day", 0, 24, "h"),
  })
  .refine((s) => s.kind !== "solar" || s.hoursPerDay !== undefined, { path: ["hoursPerDay"], error: "Give the peak sun hours a day for a solar panel" });

export const planRunSchema = z.object({
  label: label("cable run"),
  currentA: numberField("the current", 0, 500, "A", { exclusiveMin: true }),
  lengthOneWayM: numberField("the one-way length", 0, 50, "m", { exclusiveMin: true }),
  circuit: z.enum(PLAN_CIRCUITS, { error: 'circuit must be "critical" or "other"' }),
});

/** The `PUT /api/vehicles/{id}/electrical-plan` body and the stored document. */
export const electricalPlanSchema = z.object({
  systemV: z.preprocess((v) => (typeof v === "string" && v.trim() !== "" ? Number(v) : v), z.union([z.literal(12), z.literal(24)], { error: "systemV must be 12 or 24" })),
  daysAutonomy: numberField("the days of autonomy", 0, 60, "days", { exclusiveMin: true }),
  chemistry: z.enum(PLAN_CHEMISTRIES, { error: 'chemistry must be "lead-acid", "agm" or "lithium-iron-phosphate"' }),
  consumers: z.array(planConsumerSchema, { error: "consumers must be a list" }).min(1, { error: "Add at least one consumer" }).max(60, { error: "At most 60 consumers" }),
  sources: z.array(planSourceSchema, { error: "sources must be a list" }).max(20, { error: "At most 20 charging sources" }).default([]),
  runs: z.array(planRunSchema, { error: "runs must be a list" }).max(60, { error: "At most 60 cable runs" }).default([]),
});

export type ElectricalPlanInput = z.input<typeof electricalPlanSchema>;
export type ElectricalPlan = z.output<typeof electricalPlanSchema>;

export type CableRunSummary = {
  label: string;
  currentA: number;
  lengthOneWayM: number;
  circuit: CircuitKind;
  maxDropPct: number;
  sizeLabel: string;
  areaMm2: number;
  dropV: number;
  dropPct: number;
  withinLimit: boolean;
  fuseA: number;
  fuseLocation: string;
};

export type ElectricalPlanSummary = {
  systemV: 12 | 24;
  chemistry: BatteryChemistry;
  daysAutonomy: number;
  battery: BatteryPlanResult;
  /** Null without charging sources. */
  recharge: RechargeResult | null;
  runs: CableRunSummary[];
};

/**
 * Runs a calculator; its InputError is re-pointed at the plan's own field: the last part of the
 * path renamed by `fields`, and put under `prefix` when the calculator saw one item alone.
 */
function within<T>(prefix: string, fields: Record<string, string>, fn: () => T): T {
  try {
    return fn();
  } catch (error) {
    if (error instanceof InputError) {
      const parts = error.field.split(".");
      const tail = parts.pop() ?? error.field;
      const renamed = fields[tail] ?? tail;
      throw new InputError(prefix ? `${prefix}${renamed}` : [...parts, renamed].join("."), error.message);
    }
    throw error;
  }
}

/**
 * The results of a valid plan: daily Ah and battery for the days of autonomy, recharge time from
 * the sources, and each run's conductor, drop and fuse (the calculators of this folder).
 */
export function summariseElectricalPlan(plan: ElectricalPlan): ElectricalPlanSummary {
  const battery = within("", { requiredAh: "consumers" }, () =>
    batteryPlan({
      consumers: plan.consumers.map((c) => ({
        label: c.label,
        currentA: c.currentA,
        hoursPerDay: c.hoursPerDay,
        ...(c.dutyPct !== undefined ? { dutyPct: c.dutyPct } : {}),
      })),
      systemV: plan.systemV,
      daysAutonomy: plan.daysAutonomy,
      chemistry: plan.chemistry,
    }),
  );
  const deficitAh = battery.dailyAh * battery.daysAutonomy;
  const recharge =
    plan.sources.length > 0 && deficitAh > 0
      ? within("", { currentA: "amount", watts: "amount" }, () =>
          rechargeTime({
            deficitAh,
            systemV: plan.systemV,
            sources: plan.sources.map((s) => ({
              kind: s.kind,
              ...(s.unit === "A" ? { currentA: s.amount } : { watts: s.amount }),
              ...(s.hoursPerDay !== undefined ? { hoursPerDay: s.hoursPerDay } : {}),
            })),
          }),
        )
      : null;
  const runs = plan.runs.map((r, i) => {
    const result = within(`runs.${i}.`, { currentA: "currentA", lengthOneWayM: "lengthOneWayM" }, () =>
      cableRun({ currentA: r.currentA, lengthOneWayM: r.lengthOneWayM, systemV: plan.systemV, circuit: r.circuit }),
    );
    return {
      label: r.label,
      currentA: r.currentA,
      lengthOneWayM: r.lengthOneWayM,
      circuit: r.circuit,
      maxDropPct: result.maxDropPct,
      sizeLabel: result.recommendedSizeLabel,
      areaMm2: result.recommendedAreaMm2,
      dropV: result.dropV,
      dropPct: result.dropPct,
      withinLimit: result.withinLimit,
      fuseA: result.fuseA,
      fuseLocation: result.fuseLocation,
    };
  });
  return { systemV: plan.systemV, chemistry: plan.chemistry, daysAutonomy: plan.daysAutonomy, battery, recharge, runs };
}
