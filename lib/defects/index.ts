export {
  CATEGORY_LABELS,
  DEFECT_CATEGORIES,
  DEFECT_SEVERITIES,
  DEFECT_STATES,
  OPEN_DEFECT_STATES,
  SEVERITY_HINTS,
  SEVERITY_LABELS,
  SEVERITY_RANK,
  STATE_HINTS,
  STATE_LABELS,
  categoryLabel,
  defectTitle,
  isCategory,
  isDefectState,
  isSeverity,
} from "./vocabulary";
export type { DefectCategory, DefectSeverity, DefectState } from "./vocabulary";
export {
  DEFECT_MOVES,
  MIN_CLOSE_REASON_CHARS,
  MOVE_LABELS,
  allowedMoves,
  canReceiveMerge,
  closeNeedsReason,
  defectMove,
} from "./machine";
export type { DefectMove, DefectMoveKind, MoveOutcome } from "./machine";
export {
  CHECK_RESULTS,
  CHECK_RESULT_LABELS,
  GENERAL_CHECK_ITEMS,
  buildChecklist,
  checkAnswers,
  checkSummary,
} from "./checklist";
export type { CheckAnswer, CheckedAnswer, CheckResult, CheckableLine, ChecklistItem } from "./checklist";
export {
  checkAnswerSchema,
  clientIdSchema,
  defectMoveSchema,
  defectReportSchema,
  preTripCheckSchema,
  returnToServiceSchema,
} from "./schema";
export type { DefectMoveInput, DefectReportInput, PreTripCheckInput } from "./schema";
