import { StatusPill, type StatusTone } from "@/components/ui";
import { EVIDENCE_STATE_LABELS, JOB_STATE_LABELS, QUOTE_STATE_LABELS, type EvidenceState, type JobState, type QuoteState } from "@/lib/jobs";

const JOB_TONES: Record<JobState, StatusTone> = {
  open: "neutral",
  quoting: "info",
  awarded: "info",
  in_workshop: "warn",
  evidence_lodged: "warn",
  signed_off: "ok",
  closed: "neutral",
  cancelled: "danger",
};

const QUOTE_TONES: Record<QuoteState, StatusTone> = {
  draft: "neutral",
  submitted: "info",
  returned: "warn",
  awaiting_finance: "warn",
  accepted: "ok",
  declined: "danger",
  withdrawn: "neutral",
};

const EVIDENCE_TONES: Record<EvidenceState, StatusTone> = { lodged: "warn", accepted: "ok", rejected: "danger" };

/** Variance words of a spec line, as the job pages show them. */
export const LINE_STATUS_WORDS: Record<string, { word: string; tone: StatusTone }> = {
  meets: { word: "Meets", tone: "ok" },
  short: { word: "Short", tone: "danger" },
  off_spec: { word: "Off-spec", tone: "danger" },
  unproven: { word: "Unproven", tone: "warn" },
  concession: { word: "Concession", tone: "info" },
  prohibited_fitted: { word: "Prohibited item fitted", tone: "danger" },
  optional_absent: { word: "Not fitted (optional)", tone: "neutral" },
};

export function JobStatePill({ state, size }: { state: JobState; size?: "sm" | "md" | "lg" }) {
  return (
    <StatusPill tone={JOB_TONES[state]} size={size} data-testid="job-state">
      {JOB_STATE_LABELS[state]}
    </StatusPill>
  );
}

export function QuoteStatePill({ state, size }: { state: QuoteState; size?: "sm" | "md" | "lg" }) {
  return (
    <StatusPill tone={QUOTE_TONES[state]} size={size} data-testid="quote-state">
      {QUOTE_STATE_LABELS[state]}
    </StatusPill>
  );
}

export function EvidenceStatePill({ state }: { state: EvidenceState }) {
  return (
    <StatusPill tone={EVIDENCE_TONES[state]} size="sm" data-testid="evidence-state">
      {EVIDENCE_STATE_LABELS[state]}
    </StatusPill>
  );
}

export function LineStatusPill({ status }: { status: string }) {
  const found = LINE_STATUS_WORDS[status] ?? { word: status, tone: "neutral" as const };
  return (
    <StatusPill tone={found.tone} size="sm" data-testid="line-status">
      {found.word}
    </StatusPill>
  );
}


export const dateInputValue = (d: Date | string | null | undefined) => (d ? new Date(d).toISOString().slice(0, 10) : "");
