export { type Finding, type Severity, worstSeverity } from "./findings";
export { type RuleSet, type RuleSetInput, ruleSetSchema } from "./ruleSet";
export { EXAMPLE_RULE_SETS, exampleRuleSet } from "./examples";
export {
  type LiftCheckInput,
  type LiftCheckResult,
  liftCheck,
  tyreDiameterFindings,
  tyreLiftMm,
} from "./lift";
