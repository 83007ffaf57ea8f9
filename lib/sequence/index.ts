export { LINE_KINDS, sequenceLineSchema, sequenceLinesSchema, type LineKind, type LineRef, type SequenceLine } from "./types";
export {
  DependencyCycleError,
  detectCycles,
  dependencyCycleError,
  type DependencyCycle,
} from "./cycles";
export {
  buildOrder,
  type BuildOrder,
  type BuildStage,
  type PlannedLine,
  type OutOfOrderLine,
} from "./build-order";
export {
  canAward,
  awardCheckInputSchema,
  type AwardCheck,
  type RefusedLine,
  type MissingPrerequisite,
  type MissingReason,
} from "./award";
export { sequenceWarnings, type SequenceWarning, type SequenceWarningCode } from "./warnings";
