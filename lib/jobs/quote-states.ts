import { defineMachine } from "./machine";

export const QUOTE_STATES = [
  "draft",
  "submitted",
  "returned",
  "awaiting_finance",
  "accepted",
  "declined",
  "withdrawn",
] as const;
export type QuoteState = (typeof QUOTE_STATES)[number];

export const QUOTE_STATE_LABELS: Readonly<Record<QuoteState, string>> = {
  draft: "Draft",
  submitted: "Submitted",
  returned: "Returned for changes",
  awaiting_finance: "Awaiting finance",
  accepted: "Accepted",
  declined: "Declined",
  withdrawn: "Withdrawn",
};

/**
 * draft → submitted → returned → (revised) submitted …; submitted → accepted, or → awaiting
 * finance → accepted / declined; submitted → declined; draft / submitted / returned → withdrawn.
 */
export const quoteMachine = defineMachine<QuoteState>({
  noun: "quote",
  states: QUOTE_STATES,
  labels: QUOTE_STATE_LABELS,
  moves: {
    draft: ["submitted", "withdrawn"],
    submitted: ["returned", "awaiting_finance", "accepted", "declined", "withdrawn"],
    returned: ["submitted", "withdrawn"],
    awaiting_finance: ["accepted", "declined"],
  },
  finalReason: {
    accepted: "decisions are final",
    declined: "decisions are final",
    withdrawn: "a withdrawn quote is final",
    awaiting_finance: "it waits for a finance approval, which accepts or declines it",
  },
});

/** A contractor may change lines, validity and notes only while the quote is theirs to edit. */
export const EDITABLE_QUOTE_STATES: readonly QuoteState[] = ["draft", "returned"];

/** Quotes still in the running for the job. */
export const LIVE_QUOTE_STATES: readonly QuoteState[] = ["draft", "submitted", "returned", "awaiting_finance"];
