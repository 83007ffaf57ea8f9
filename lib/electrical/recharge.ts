import { z } from "zod";
import { InputError, requireFinite, requireNonNegative, requirePositive } from "@/lib/errors";

export type ChargeSourceKind = "dc-dc" | "solar" | "mains";

/**
 * Share of a panel's rated power that reaches the battery on a clear day once heat, dust,
 * wiring and controller losses are counted (common practice: 0.7–0.8 is the usual allowance).
 */
export const SOLAR_DERATING = 0.75;

const chargeSourceSchema = z
  .object({
    kind: z.enum(["dc-dc", "solar", "mains"], { error: 'kind must be "dc-dc", "solar" or "mains"' }),
    currentA: z.number({ error: "currentA must be a number" }).positive({ error: "currentA must be greater than zero" }).optional(),
    watts: z.number({ error: "watts must be a number" }).positive({ error: "watts must be greater than zero" }).optional(),
    /** Driving hours (dc-dc), peak sun hours (solar) or hours on shore power (mains). */
    hoursPerDay: z
      .number({ error: "hoursPerDay must be a number" })
      .min(0, { error: "hoursPerDay must not be negative" })
      .max(24, { error: "hoursPerDay must be at most 24" })
      .optional(),
  })
  .refine((s) => (s.currentA === undefined) !== (s.watts === undefined), {
    error: "give either currentA or watts, not both",
    path: ["watts"],
  })
  .refine((s) => s.kind !== "solar" || s.hoursPerDay !== undefined, {
    error: "give the peak sun hours per day for a solar source",
    path: ["hoursPerDay"],
  });

export const rechargeInputSchema = z.object({
  deficitAh: z.number({ error: "deficitAh must be a number" }).positive({ error: "deficitAh must be greater than zero" }),
  systemV: z.number({ error: "systemV must be a number" }).positive({ error: "systemV must be greater than zero" }).optional(),
  sources: z.array(chargeSourceSchema).min(1, { error: "add at least one charging source" }).max(20),
  solarDerating: z
    .number({ error: "solarDerating must be a number" })
    .gt(0, { error: "solarDerating must be greater than zero" })
    .max(1, { error: "solarDerating must be at most 1" })
    .optional(),
});

export type ChargeSource = z.infer<typeof chargeSourceSchema>;
export type RechargeInput = z.infer<typeof rechargeInputSchema>;

export interface ChargeSourceResult {
  kind: ChargeSourceKind;
  /** Current into the battery while the source delivers, A (solar: at rated sun after derating). */
  chargeA: number;
  /** Ah per day, or null when no hours per day were given. */
  dailyAh: number | null;
}

export interface RechargeResult {
  sources: ChargeSourceResult[];
  /** All sources delivering at once, A. */
  chargeA: number;
  /** Hours to put back the deficit with every source delivering at once. */
  hoursToRecover: number;
  /** Ah per day from the sources that have hours per day. */
  dailyAhIn: number;
  /** Deficit ÷ daily Ah in, or null when no source has hours per day. */
  daysToRecover: number | null;
  solarDerating: number;
}

function sourceChargeA(source: ChargeSource, index: number, systemV: number | undefined, derating: number): number {
  const at = `sources.${index}`;
  if (source.kind !== "dc-dc" && source.kind !== "solar" && source.kind !== "mains") {
    throw new InputError(`${at}.kind`, 'kind must be "dc-dc", "solar" or "mains"');
  }
  if ((source.currentA === undefined) === (source.watts === undefined)) {
    throw new InputError(`${at}.watts`, "give either currentA or watts, not both");
  }
  if (source.currentA !== undefined) return requirePositive(`${at}.currentA`, source.currentA);
  const watts = requirePositive(`${at}.watts`, source.watts as number);
  if (systemV === undefined) throw new InputError("systemV", "systemV is needed to turn watts into amperes");
  // A solar panel's rating is at standard test conditions; real output is derated.
  return source.kind === "solar" ? (watts / systemV) * derating : watts / systemV;
}

/**
 * How long the charging sources take to put back a deficit. Solar delivers
 * watts × peak sun hours / V × derating per day; dc-dc and mains their current × hours.
 */
export function rechargeTime(input: RechargeInput): RechargeResult {
  const deficitAh = requirePositive("deficitAh", input.deficitAh);
  const systemV = input.systemV === undefined ? undefined : requirePositive("systemV", input.systemV);
  const solarDerating = input.solarDerating ?? SOLAR_DERATING;
  requirePositive("solarDerating", solarDerating);
  if (solarDerating > 1) throw new InputError("solarDerating", "solarDerating must be at most 1");
  if (!Array.isArray(input.sources as unknown) || input.sources.length === 0) {
    throw new InputError("sources", "add at least one charging source");
  }

  const sources = input.sources.map((source, index): ChargeSourceResult => {
    const chargeA = sourceChargeA(source, index, systemV, solarDerating);
    let dailyAh: number | null = null;
    if (source.hoursPerDay !== undefined) {
      const hours = requireNonNegative(`sources.${index}.hoursPerDay`, source.hoursPerDay);
      if (hours > 24) throw new InputError(`sources.${index}.hoursPerDay`, "hoursPerDay must be at most 24");
      dailyAh = chargeA * hours;
    } else if (source.kind === "solar") {
      throw new InputError(`sources.${index}.hoursPerDay`, "give the peak sun hours per day for a solar source");
    }
    return { kind: source.kind, chargeA, dailyAh };
  });

  const chargeA = sources.reduce((sum, s) => sum + s.chargeA, 0);
  requireFinite("sources", chargeA);
  const dailyAhIn = sources.reduce((sum, s) => sum + (s.dailyAh ?? 0), 0);
  const hasDaily = sources.some((s) => s.dailyAh !== null);
  return {
    sources,
    chargeA,
    hoursToRecover: deficitAh / chargeA,
    dailyAhIn,
    daysToRecover: hasDaily && dailyAhIn > 0 ? deficitAh / dailyAhIn : null,
    solarDerating,
  };
}
