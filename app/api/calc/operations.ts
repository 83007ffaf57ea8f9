import "server-only";
import { z } from "zod";
import { ELECTRICAL_CAUTION, MASS_CAUTION, tyreCaution } from "@/components/calculators/cautions";
import type { AxleLoadsResponse, BatteryResponse, CableRunResponse, TyreChangeResponse } from "@/components/calculators/types";
import { batteryCalc, batteryCalcInputSchema, cableRun, cableRunInputSchema } from "@/lib/electrical";
import { axleLoads, axleLoadsInputSchema } from "@/lib/mass";
import { EXAMPLE_RULE_SETS, exampleRuleSet } from "@/lib/rules";
import { query } from "@/lib/server/operation";
import { tyreChange, tyreChangeInputSchema } from "@/lib/tyres";

/**
 * The stateless calculators. Each is a read: it checks the session, the "use Calculator"
 * permission and the input, runs the pure computation and returns its result with the caution
 * that must be shown beside it. Nothing is stored and nothing is audited.
 */

const USE_CALCULATOR = ["use", "Calculator"] as const;

/** POST /api/calc/axle-loads */
export const axleLoadsCalc = query({
  name: "calc.axleLoads",
  input: axleLoadsInputSchema,
  permission: USE_CALCULATOR,
  run: async ({ input }): Promise<AxleLoadsResponse> => ({ ...axleLoads(input), caution: MASS_CAUTION }),
});

const RULE_SET_IDS = EXAMPLE_RULE_SETS.map((r) => r.id) as [string, ...string[]];

/** The example rule set used when the request names none. */
export const DEFAULT_RULE_SET_ID = RULE_SET_IDS[0];

/**
 * The tyre change body: the lib contract plus the rule set to check the lift against and the
 * suspension lift fitted with the tyres (both optional).
 */
export const tyreChangeCalcInputSchema = tyreChangeInputSchema.extend({
  ruleSetId: z.enum(RULE_SET_IDS, { error: `ruleSetId must be one of ${RULE_SET_IDS.join(", ")}` }).optional(),
  suspensionLiftMm: z
    .number({ error: "suspensionLiftMm must be a number of mm" })
    .nonnegative({ error: "suspensionLiftMm must not be negative" })
    .max(1000, { error: "suspensionLiftMm looks wrong: more than 1000 mm" })
    .optional(),
});

/** POST /api/calc/tyre-change */
export const tyreChangeCalc = query({
  name: "calc.tyreChange",
  input: tyreChangeCalcInputSchema,
  permission: USE_CALCULATOR,
  run: async ({ input }): Promise<TyreChangeResponse> => {
    const rules = exampleRuleSet(input.ruleSetId ?? DEFAULT_RULE_SET_ID);
    const result = tyreChange({
      from: input.from,
      to: input.to,
      speedoReadsHighPct: input.speedoReadsHighPct,
      rules,
      suspensionLiftMm: input.suspensionLiftMm ?? 0,
    });
    return {
      ...result,
      ruleSet: { id: rules.id, name: rules.name, note: rules.note, exampleOnly: rules.exampleOnly },
      caution: tyreCaution(rules.name),
    };
  },
});

/** POST /api/calc/cable */
export const cableRunCalc = query({
  name: "calc.cableRun",
  input: cableRunInputSchema,
  permission: USE_CALCULATOR,
  run: async ({ input }): Promise<CableRunResponse> => ({ ...cableRun(input), caution: ELECTRICAL_CAUTION }),
});

/** POST /api/calc/battery */
export const batteryCalcOp = query({
  name: "calc.battery",
  input: batteryCalcInputSchema,
  permission: USE_CALCULATOR,
  run: async ({ input }): Promise<BatteryResponse> => ({ ...batteryCalc(input), caution: ELECTRICAL_CAUTION }),
});
