import { z } from "zod";
import { InputError, requireFinite, requirePositive } from "@/lib/errors";

export type BatteryChemistry = "lead-acid" | "agm" | "lithium-iron-phosphate";

/**
 * Share of nominal capacity used in normal cycling (common practice, from makers' literature):
 * about half for flooded lead-acid and AGM, about 80 % for lithium iron phosphate.
 */
export const USABLE_DEPTH_OF_DISCHARGE: Readonly<Record<BatteryChemistry, number>> = {
  "lead-acid": 0.5,
  agm: 0.5,
  "lithium-iron-phosphate": 0.8,
};

/** Inverter efficiency used when none is given: about 0.9. */
export const DEFAULT_INVERTER_EFFICIENCY = 0.9;

/**
 * Nominal capacities deep-cycle batteries are commonly sold in, Ah at the system voltage
 * (common practice). Above the largest, batteries are paralleled.
 */
export const STANDARD_BATTERY_SIZES_AH = [
  50, 60, 75, 80, 90, 100, 120, 135, 150, 170, 200, 230, 250, 300,
] as const;

const MAX_DAYS_AUTONOMY = 60;

const consumerSchema = z
  .object({
    label: z.string({ error: "label must be text" }).trim().min(1, { error: "label is required" }).max(120),
    currentA: z.number({ error: "currentA must be a number" }).nonnegative({ error: "currentA must not be negative" }).optional(),
    powerW: z.number({ error: "powerW must be a number" }).nonnegative({ error: "powerW must not be negative" }).optional(),
    hoursPerDay: z
      .number({ error: "hoursPerDay must be a number" })
      .min(0, { error: "hoursPerDay must not be negative" })
      .max(24, { error: "hoursPerDay must be at most 24" }),
    dutyPct: z
      .number({ error: "dutyPct must be a number" })
      .min(0, { error: "dutyPct must not be negative" })
      .max(100, { error: "dutyPct must be at most 100" })
      .optional(),
    ac: z.boolean({ error: "ac must be true or false" }).optional(),
  })
  .refine((c) => (c.currentA === undefined) !== (c.powerW === undefined), {
    error: "give either currentA or powerW, not both",
    path: ["powerW"],
  })
  .refine((c) => !(c.ac === true && c.currentA !== undefined), {
    error: "an AC consumer is given by its powerW",
    path: ["currentA"],
  });

/** The battery part of the `POST /api/calc/battery` body. */
export const batteryPlanInputSchema = z.object({
  consumers: z.array(consumerSchema).min(1, { error: "add at least one consumer" }).max(200),
  systemV: z.number({ error: "systemV must be a number" }).positive({ error: "systemV must be greater than zero" }),
  daysAutonomy: z
    .number({ error: "daysAutonomy must be a number" })
    .positive({ error: "daysAutonomy must be greater than zero" })
    .max(MAX_DAYS_AUTONOMY, { error: `daysAutonomy must be at most ${MAX_DAYS_AUTONOMY}` }),
  chemistry: z.enum(["lead-acid", "agm", "lithium-iron-phosphate"], {
    error: 'chemistry must be "lead-acid", "agm" or "lithium-iron-phosphate"',
  }),
  inverterEfficiency: z
    .number({ error: "inverterEfficiency must be a number" })
    .gt(0, { error: "inverterEfficiency must be greater than zero" })
    .max(1, { error: "inverterEfficiency must be at most 1" })
    .optional(),
});

export type BatteryConsumer = z.infer<typeof consumerSchema>;
export type BatteryPlanInput = z.infer<typeof batteryPlanInputSchema>;

export interface ConsumerBudget {
  label: string;
  /** Draw from the battery while running, W (AC loads include the inverter's loss). */
  batteryDrawW: number;
  whPerDay: number;
  ahPerDay: number;
}

export interface SuggestedBattery {
  count: number;
  capacityAhEach: number;
  totalAh: number;
}

export interface BatteryPlanResult {
  consumers: ConsumerBudget[];
  dailyWh: number;
  dailyAh: number;
  daysAutonomy: number;
  chemistry: BatteryChemistry;
  usableDepthOfDischargePct: number;
  inverterEfficiency: number;
  /** Ah per day × days ÷ usable depth of discharge. */
  requiredCapacityAh: number;
  suggestedBattery: SuggestedBattery;
}

function checkConsumer(consumer: BatteryConsumer, index: number): void {
  const at = `consumers.${index}`;
  if (typeof consumer.label !== "string" || consumer.label.trim() === "") {
    throw new InputError(`${at}.label`, "label is required");
  }
  if ((consumer.currentA === undefined) === (consumer.powerW === undefined)) {
    throw new InputError(`${at}.powerW`, "give either currentA or powerW, not both");
  }
  if (consumer.ac === true && consumer.currentA !== undefined) {
    throw new InputError(`${at}.currentA`, "an AC consumer is given by its powerW");
  }
  for (const key of ["currentA", "powerW"] as const) {
    const value = consumer[key];
    if (value !== undefined) {
      requireFinite(`${at}.${key}`, value);
      if (value < 0) throw new InputError(`${at}.${key}`, `${key} must not be negative`);
    }
  }
  requireFinite(`${at}.hoursPerDay`, consumer.hoursPerDay);
  if (consumer.hoursPerDay < 0 || consumer.hoursPerDay > 24) {
    throw new InputError(`${at}.hoursPerDay`, "hoursPerDay must be between 0 and 24");
  }
  if (consumer.dutyPct !== undefined) {
    requireFinite(`${at}.dutyPct`, consumer.dutyPct);
    if (consumer.dutyPct < 0 || consumer.dutyPct > 100) {
      throw new InputError(`${at}.dutyPct`, "dutyPct must be between 0 and 100");
    }
  }
}

/** Smallest standard size covering the need, paralleling the fewest batteries when one is not enough. */
export function suggestBattery(requiredAh: number): SuggestedBattery {
  requirePositive("requiredAh", requiredAh);
  const largestAh = STANDARD_BATTERY_SIZES_AH[STANDARD_BATTERY_SIZES_AH.length - 1] ?? 1;
  const count = Math.max(1, Math.ceil(requiredAh / largestAh - 1e-9));
  const eachNeededAh = requiredAh / count;
  const capacityAhEach = STANDARD_BATTERY_SIZES_AH.find((size) => size >= eachNeededAh * (1 - 1e-9)) ?? largestAh;
  return { count, capacityAhEach, totalAh: count * capacityAhEach };
}

/**
 * Daily energy budget and battery size: Ah/day = Σ(W × h) / V, AC loads divided by the
 * inverter efficiency first; capacity = Ah/day × days of autonomy / usable depth of discharge.
 */
export function batteryPlan(input: BatteryPlanInput): BatteryPlanResult {
  const systemV = requirePositive("systemV", input.systemV);
  const daysAutonomy = requirePositive("daysAutonomy", input.daysAutonomy);
  if (daysAutonomy > MAX_DAYS_AUTONOMY) {
    throw new InputError("daysAutonomy", `daysAutonomy must be at most ${MAX_DAYS_AUTONOMY}`);
  }
  const depth = Object.hasOwn(USABLE_DEPTH_OF_DISCHARGE, input.chemistry)
    ? USABLE_DEPTH_OF_DISCHARGE[input.chemistry]
    : undefined;
  if (depth === undefined) {
    throw new InputError("chemistry", 'chemistry must be "lead-acid", "agm" or "lithium-iron-phosphate"');
  }
  const inverterEfficiency = input.inverterEfficiency ?? DEFAULT_INVERTER_EFFICIENCY;
  requirePositive("inverterEfficiency", inverterEfficiency);
  if (inverterEfficiency > 1) throw new InputError("inverterEfficiency", "inverterEfficiency must be at most 1");
  if (!Array.isArray(input.consumers as unknown) || input.consumers.length === 0) {
    throw new InputError("consumers", "add at least one consumer");
  }

  const consumers = input.consumers.map((consumer, index): ConsumerBudget => {
    checkConsumer(consumer, index);
    const loadW = consumer.powerW ?? (consumer.currentA ?? 0) * systemV;
    const batteryDrawW = consumer.ac === true ? loadW / inverterEfficiency : loadW;
    const whPerDay = (batteryDrawW * consumer.hoursPerDay * (consumer.dutyPct ?? 100)) / 100;
    return { label: consumer.label.trim(), batteryDrawW, whPerDay, ahPerDay: whPerDay / systemV };
  });

  const dailyWh = consumers.reduce((sum, c) => sum + c.whPerDay, 0);
  if (dailyWh <= 0) throw new InputError("consumers", "the consumers draw no energy; give currents or powers and hours");
  const dailyAh = dailyWh / systemV;
  const requiredCapacityAh = (dailyAh * daysAutonomy) / depth;

  return {
    consumers,
    dailyWh,
    dailyAh,
    daysAutonomy,
    chemistry: input.chemistry,
    usableDepthOfDischargePct: depth * 100,
    inverterEfficiency,
    requiredCapacityAh,
    suggestedBattery: suggestBattery(requiredCapacityAh),
  };
}
