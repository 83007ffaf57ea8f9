import { z } from "zod";
import type { QuoteState } from "./quote-states";

export const DECISIONS = ["accept", "decline", "return"] as const;
export type Decision = (typeof DECISIONS)[number];

/** Every decision the record keeps: the manager's three and finance's two. */
export const RECORDED_DECISIONS = [...DECISIONS, "finance_approve", "finance_decline"] as const;
export type RecordedDecision = (typeof RECORDED_DECISIONS)[number];

export const DECISION_LABELS: Readonly<Record<RecordedDecision, string>> = {
  accept: "Accepted",
  decline: "Declined",
  return: "Returned for changes",
  finance_approve: "Approved by finance",
  finance_decline: "Declined by finance",
};

const reason = z.string({ error: "Give a reason" }).trim().max(2000, { error: "The reason is too long (at most 2,000 characters)" });

/** `{ decision, reason, version }` — the version the decider saw, for the optimistic check. */
export const decisionInputSchema = z
  .object({
    decision: z.enum(DECISIONS, { error: 'decision must be "accept", "decline" or "return"' }),
    reason: reason.optional().default(""),
    version: z.coerce.number({ error: "version is required" }).int({ error: "version must be a whole number" }).min(1, { error: "version is required" }),
  })
  .superRefine((value, ctx) => {
    if (value.decision !== "accept" && value.reason.length === 0) {
      ctx.addIssue({
        code: "custom",
        path: ["reason"],
        message: value.decision === "return" ? "Say what needs to change" : "Give the reason for declining",
      });
    }
  });

export const financeApprovalInputSchema = z
  .object({
    approve: z.union([z.boolean(), z.enum(["true", "false"]).transform((v) => v === "true")], { error: "approve must be true or false" }),
    reason: reason.optional().default(""),
    version: z.coerce.number({ error: "version is required" }).int().min(1, { error: "version is required" }),
  })
  .superRefine((value, ctx) => {
    if (!value.approve && value.reason.length === 0) {
      ctx.addIssue({ code: "custom", path: ["reason"], message: "Give the reason for declining" });
    }
  });

export type DecisionOutcome = {
  /** The quote's state after the decision. */
  status: QuoteState;
  /** True when the acceptance waits for a finance approval (the total is above the threshold). */
  needsFinance: boolean;
  /** True when the quote is now accepted and the job is awarded to its firm. */
  awards: boolean;
};

/**
 * What a manager's decision does to a submitted quote. Acceptance of a quote whose total
 * (incl. GST) is above the organisation's approval threshold waits for finance; a total equal to
 * the threshold does not ("above" is strict).
 */
export function decisionOutcome(decision: Decision, totalInclGstCents: number, thresholdCents: number): DecisionOutcome {
  if (!Number.isSafeInteger(totalInclGstCents)) throw new RangeError("totalInclGstCents must be whole cents");
  if (!Number.isSafeInteger(thresholdCents) || thresholdCents < 0) throw new RangeError("thresholdCents must be whole cents, not negative");
  switch (decision) {
    case "accept":
      return totalInclGstCents > thresholdCents
        ? { status: "awaiting_finance", needsFinance: true, awards: false }
        : { status: "accepted", needsFinance: false, awards: true };
    case "decline":
      return { status: "declined", needsFinance: false, awards: false };
    case "return":
      return { status: "returned", needsFinance: false, awards: false };
  }
}

/** What a finance approval does to a quote awaiting finance. */
export function financeOutcome(approve: boolean): DecisionOutcome {
  return approve ? { status: "accepted", needsFinance: false, awards: true } : { status: "declined", needsFinance: false, awards: false };
}

/**
 * Nobody decides their own work: the user who submitted or revised a quote (or created it)
 * cannot decide it.
 */
export function mayDecide(deciderId: string, quote: { submittedBy: string | null; createdBy: string | null; revisedBy?: readonly string[] }): boolean {
  if (deciderId === quote.submittedBy || deciderId === quote.createdBy) return false;
  return !(quote.revisedBy ?? []).includes(deciderId);
}
