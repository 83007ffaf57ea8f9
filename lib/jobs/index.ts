export { defineMachine, type Move, type MoveCheck, type StateMachine } from "./machine";
export { JOB_STATES, JOB_STATE_LABELS, OPEN_JOB_STATES, isJobOverdue, jobMachine, type JobState } from "./job-states";
export {
  EDITABLE_QUOTE_STATES,
  LIVE_QUOTE_STATES,
  QUOTE_STATES,
  QUOTE_STATE_LABELS,
  quoteMachine,
  type QuoteState,
} from "./quote-states";
export { EVIDENCE_STATES, EVIDENCE_STATE_LABELS, evidenceMachine, type EvidenceState } from "./evidence-states";
export {
  DECISIONS,
  DECISION_LABELS,
  decisionInputSchema,
  decisionOutcome,
  financeApprovalInputSchema,
  financeOutcome,
  mayDecide,
  type Decision,
  type DecisionOutcome,
} from "./decisions";
export { costCategoryFor } from "./cost";
export { quoteContentSchema, quoteLineInputSchema, toTotalsLine, type QuoteContent, type QuoteLineDraft } from "./quote-input";
