import type { BatteryCalcResult, CableRunResult } from "@/lib/electrical";
import type { AxleLoadsResult } from "@/lib/mass";
import type { TyreChangeResult } from "@/lib/tyres";

/** What the calculator routes answer: the computation's result and the caution that goes with it. */
export type AxleLoadsResponse = AxleLoadsResult & { caution: string };
export type TyreChangeResponse = TyreChangeResult & {
  ruleSet: { id: string; name: string; note: string; exampleOnly: true };
  caution: string;
};
export type CableRunResponse = CableRunResult & { caution: string };
export type BatteryResponse = BatteryCalcResult & { caution: string };

/** A rule set as the tyre calculator offers it. */
export type RuleSetOption = { id: string; name: string };
