import { InputError } from "@/lib/errors";
import { isDefectState, STATE_LABELS, type DefectState } from "./vocabulary";

/**
 * The life of a defect (Rigline's states):
 *   reported → triaged → in_repair (a job is linked) → resolved → closed
 *   reported / triaged → closed, with a reason (not a fault, or not worth a job)
 *   reported / triaged → merged into another open report of the same fault
 * closed and merged are final. Every other move is refused with the reason in words, which
 * the server answers as 409.
 */

export const DEFECT_MOVES = ["triage", "start_repair", "resolve", "close", "merge"] as const;
export type DefectMoveKind = (typeof DEFECT_MOVES)[number];

export type DefectMove =
  | { kind: "triage" }
  | { kind: "start_repair"; jobId: string }
  | { kind: "resolve" }
  | { kind: "close"; reason?: string | null }
  | { kind: "merge"; intoId: string };

export type MoveOutcome = { ok: true; to: DefectState } | { ok: false; reason: string };

export const MOVE_LABELS: Record<DefectMoveKind, string> = {
  triage: "Mark as triaged",
  start_repair: "Link a repair job",
  resolve: "Mark as resolved",
  close: "Close",
  merge: "Merge into another report",
};

const TABLE: Record<DefectState, Partial<Record<DefectMoveKind, DefectState>>> = {
  reported: { triage: "triaged", close: "closed", merge: "merged" },
  triaged: { start_repair: "in_repair", close: "closed", merge: "merged" },
  in_repair: { resolve: "resolved" },
  resolved: { close: "closed" },
  closed: {},
  merged: {},
};

/** The shortest reason that makes sense for a close without a fix. */
export const MIN_CLOSE_REASON_CHARS = 3;

/** The moves open from a state (for showing only the buttons that can work). */
export function allowedMoves(from: DefectState): DefectMoveKind[] {
  checkState(from);
  return DEFECT_MOVES.filter((m) => TABLE[from][m] !== undefined);
}

/** Whether closing from this state needs a reason (a close without a repair always does). */
export function closeNeedsReason(from: DefectState): boolean {
  checkState(from);
  return from === "reported" || from === "triaged";
}

function checkState(from: unknown): asserts from is DefectState {
  if (!isDefectState(from)) throw new InputError("state", `state must be one of ${Object.keys(TABLE).join(", ")}`);
}

function refusal(from: DefectState, move: DefectMoveKind): string {
  const now = `It is ${STATE_LABELS[from].toLowerCase()}`;
  if (from === "closed" || from === "merged") {
    return `This defect is ${STATE_LABELS[from].toLowerCase()}: it cannot change any more. Report the fault again if it came back.`;
  }
  switch (move) {
    case "triage":
      return `${now}: only a newly reported defect can be triaged.`;
    case "start_repair":
      return from === "reported"
        ? `${now}: triage it before linking a repair job.`
        : `${now}: a repair job can only be linked to a triaged defect.`;
    case "resolve":
      return `${now}: only a defect in repair can be marked resolved.`;
    case "close":
      return `${now}: a defect in repair is closed after it is resolved.`;
    case "merge":
      return `${now}: only a reported or triaged defect can be merged into another.`;
  }
}

/** Where a move takes a defect, or why it cannot. Pure: the caller writes the result. */
export function defectMove(from: DefectState, move: DefectMove): MoveOutcome {
  checkState(from);
  if (move === null || typeof move !== "object" || !(DEFECT_MOVES as readonly string[]).includes(move.kind)) {
    throw new InputError("move", `move must be one of ${DEFECT_MOVES.join(", ")}`);
  }
  const to = TABLE[from][move.kind];
  if (to === undefined) return { ok: false, reason: refusal(from, move.kind) };
  switch (move.kind) {
    case "start_repair":
      if (typeof move.jobId !== "string" || move.jobId.trim() === "") {
        return { ok: false, reason: "Name the job that will repair it." };
      }
      break;
    case "merge":
      if (typeof move.intoId !== "string" || move.intoId.trim() === "") {
        return { ok: false, reason: "Name the report to merge it into." };
      }
      break;
    case "close":
      if (closeNeedsReason(from) && (move.reason ?? "").trim().length < MIN_CLOSE_REASON_CHARS) {
        return { ok: false, reason: "Say why it is closed without a repair." };
      }
      break;
    default:
      break;
  }
  return { ok: true, to };
}

/** Whether `target` can take in a merged report: only a report still open (not yet resolved). */
export function canReceiveMerge(target: DefectState): boolean {
  checkState(target);
  return target === "reported" || target === "triaged" || target === "in_repair";
}
