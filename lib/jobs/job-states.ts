import { defineMachine } from "./machine";

export const JOB_STATES = [
  "open",
  "quoting",
  "awarded",
  "in_workshop",
  "evidence_lodged",
  "signed_off",
  "closed",
  "cancelled",
] as const;
export type JobState = (typeof JOB_STATES)[number];

export const JOB_STATE_LABELS: Readonly<Record<JobState, string>> = {
  open: "Open",
  quoting: "Out for quotes",
  awarded: "Awarded",
  in_workshop: "In the workshop",
  evidence_lodged: "Evidence lodged",
  signed_off: "Signed off",
  closed: "Closed",
  cancelled: "Cancelled",
};

/**
 * open → quoting → awarded → in workshop → evidence lodged → signed off → closed; open, quoting
 * and awarded may be cancelled (with a reason). Evidence lodged may go back to in workshop when
 * the manager rejects evidence and more work is needed.
 */
export const jobMachine = defineMachine<JobState>({
  noun: "job",
  states: JOB_STATES,
  labels: JOB_STATE_LABELS,
  moves: {
    open: ["quoting", "cancelled"],
    quoting: ["awarded", "cancelled"],
    awarded: ["in_workshop", "cancelled"],
    in_workshop: ["evidence_lodged"],
    evidence_lodged: ["in_workshop", "signed_off"],
    signed_off: ["closed"],
  },
  finalReason: {
    in_workshop: "work has started, so it can no longer be cancelled; it can only move on to evidence lodged",
    closed: "a closed job is final",
    cancelled: "a cancelled job is final",
  },
});

/** States in which the job is still to be done (counted as work in hand, can be overdue). */
export const OPEN_JOB_STATES: readonly JobState[] = ["open", "quoting", "awarded", "in_workshop", "evidence_lodged"];

/** Whether a job with this due date and state is overdue at `now`. */
export function isJobOverdue(state: JobState, dueAt: Date | null, now: Date): boolean {
  return dueAt !== null && OPEN_JOB_STATES.includes(state) && dueAt.getTime() < now.getTime();
}
