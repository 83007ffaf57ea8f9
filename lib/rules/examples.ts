import { InputError } from "../errors";
import type { RuleSet } from "./ruleSet";

const CAUTION =
  "Example values — check your local rules. Limits differ between jurisdictions and change; " +
  "any lift or tyre change beyond them needs a licensed vehicle engineer's sign-off.";

/**
 * Shipped example rule sets. Each is a plausible set of limits of the kind road authorities
 * publish, not the law of any place: an admin copies one and edits it to the local rules.
 */
export const EXAMPLE_RULE_SETS: readonly Readonly<RuleSet>[] = Object.freeze(
  (
  [
  {
    id: "example-a-50mm-tyre",
    name: "Example set A — 50 mm tyre rule",
    exampleOnly: true,
    note:
      `${CAUTION} Without certification: suspension change up to 50 mm and no more than a third of ` +
      "the original travel; tyres up to 50 mm larger in diameter than the largest the maker " +
      "specifies, covered by the bodywork and not fouling; combined lift up to 75 mm of which up " +
      "to 25 mm from tyres; wheel track up to 25 mm wider than the maker's maximum.",
    suspensionLiftMaxMm: 50,
    suspensionLiftMaxTravelFraction: 1 / 3,
    tyreDiameterIncreaseMaxMm: 50,
    combinedLiftMaxMm: 75,
    tyreLiftShareMaxMm: 25,
    wheelTrackIncreaseMaxMm: 25,
  },
  {
    id: "example-b-7pct-tyre",
    name: "Example set B — 7 % tyre rule",
    exampleOnly: true,
    note:
      `${CAUTION} Without certification: suspension change up to 50 mm and no more than a third of ` +
      "the original travel; tyres up to 7 % larger in diameter than the largest the maker " +
      "specifies; combined lift up to 75 mm of which up to 25 mm from tyres; wheel track up to " +
      "25 mm wider than the maker's maximum.",
    suspensionLiftMaxMm: 50,
    suspensionLiftMaxTravelFraction: 1 / 3,
    tyreDiameterIncreaseMaxPct: 7,
    combinedLiftMaxMm: 75,
    tyreLiftShareMaxMm: 25,
    wheelTrackIncreaseMaxMm: 25,
  },
  {
    id: "example-c-150mm-ceiling",
    name: "Example set C — 75 mm combined, 150 mm certified ceiling",
    exampleOnly: true,
    note:
      `${CAUTION} Without certification: combined lift up to 75 mm (suspension up to 50 mm, tyres ` +
      "up to 25 mm of lift, i.e. 50 mm more diameter); with certification up to 150 mm in all; " +
      "wheel track up to 25 mm wider than the maker's maximum.",
    suspensionLiftMaxMm: 50,
    suspensionLiftMaxTravelFraction: 1 / 3,
    tyreDiameterIncreaseMaxMm: 50,
    combinedLiftMaxMm: 75,
    tyreLiftShareMaxMm: 25,
    maxCertifiedLiftMm: 150,
    wheelTrackIncreaseMaxMm: 25,
  },
  ] satisfies RuleSet[]
  ).map((r) => Object.freeze(r)),
);

/** The shipped example set with this id; throws InputError for an unknown id. */
export function exampleRuleSet(id: string): Readonly<RuleSet> {
  const found = EXAMPLE_RULE_SETS.find((r) => r.id === id);
  if (!found) {
    throw new InputError(
      "ruleSetId",
      `unknown rule set "${id}"; expected one of ${EXAMPLE_RULE_SETS.map((r) => r.id).join(", ")}`,
    );
  }
  return found;
}
