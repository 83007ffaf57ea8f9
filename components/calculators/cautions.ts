import { DEFAULT_CAUTION } from "@/components/ui/caution";

/**
 * The cautions that go beside every calculator result. The API returns them with each result
 * and the result panels show them, so a result never travels without its caution.
 */

/** Axle loads: a planning figure, not a weighbridge ticket. */
export const MASS_CAUTION = DEFAULT_CAUTION;

/** Cable runs and 12 V plans. */
export const ELECTRICAL_CAUTION =
  "Planning aid only. Wiring follows the equipment makers' instructions and local wiring rules.";

/** Tyre changes: names the rule set used, which is only ever an example. */
export function tyreCaution(ruleSetName: string): string {
  return (
    `Checked against "${ruleSetName}": example values — check your local rules. ` +
    "Planning aid only: whether the change may be made is decided by an authorised vehicle engineer."
  );
}
