import { z } from "zod";
import { batteryPlan, batteryPlanInputSchema, type BatteryPlanResult } from "./battery";
import { rechargeInputSchema, rechargeTime, type RechargeResult } from "./recharge";

/**
 * The `POST /api/calc/battery` body: the consumers and battery, and optionally the charging
 * sources. With sources, the deficit recovered is the full autonomy's use (daily Ah × days).
 */
export const batteryCalcInputSchema = batteryPlanInputSchema.extend({
  charging: rechargeInputSchema.pick({ sources: true, solarDerating: true }).optional(),
});

export type BatteryCalcInput = z.infer<typeof batteryCalcInputSchema>;

export interface BatteryCalcResult {
  plan: BatteryPlanResult;
  recharge: RechargeResult | null;
  /** Whether the daily charge in covers the daily use, or null without sources with hours per day. */
  chargingKeepsUp: boolean | null;
}

export function batteryCalc(input: BatteryCalcInput): BatteryCalcResult {
  const plan = batteryPlan(input);
  if (input.charging === undefined) return { plan, recharge: null, chargingKeepsUp: null };
  const recharge = rechargeTime({
    deficitAh: plan.dailyAh * plan.daysAutonomy,
    systemV: input.systemV,
    sources: input.charging.sources,
    solarDerating: input.charging.solarDerating,
  });
  return {
    plan,
    recharge,
    chargingKeepsUp: recharge.daysToRecover === null ? null : recharge.dailyAhIn >= plan.dailyAh,
  };
}
