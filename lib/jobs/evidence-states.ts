import { defineMachine } from "./machine";

export const EVIDENCE_STATES = ["lodged", "accepted", "rejected"] as const;
export type EvidenceState = (typeof EVIDENCE_STATES)[number];

export const EVIDENCE_STATE_LABELS: Readonly<Record<EvidenceState, string>> = {
  lodged: "Waiting for review",
  accepted: "Accepted",
  rejected: "Rejected",
};

/** lodged → accepted / rejected (with a reason). A review is final; new evidence is lodged anew. */
export const evidenceMachine = defineMachine<EvidenceState>({
  noun: "piece of evidence",
  states: EVIDENCE_STATES,
  labels: EVIDENCE_STATE_LABELS,
  moves: { lodged: ["accepted", "rejected"] },
  finalReason: { accepted: "a review is final", rejected: "a review is final; lodge new evidence instead" },
});
