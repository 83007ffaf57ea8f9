import { StatusPill, type StatusTone } from "@/components/ui";
import { SEVERITY_LABELS, STATE_LABELS, type DefectSeverity, type DefectState } from "@/lib/defects";

const SEVERITY_TONE: Record<DefectSeverity, StatusTone> = { stop: "danger", before_next_trip: "warn", watch: "info" };
const STATE_TONE: Record<DefectState, StatusTone> = {
  reported: "warn",
  triaged: "info",
  in_repair: "info",
  resolved: "ok",
  closed: "neutral",
  merged: "neutral",
};

/** Short words for tight spaces; the full label is in the title. */
const SEVERITY_SHORT: Record<DefectSeverity, string> = { stop: "Stop", before_next_trip: "Before next trip", watch: "Watch" };

export function SeverityPill({ severity, size, full = false }: { severity: DefectSeverity; size?: "sm" | "md" | "lg"; full?: boolean }) {
  return (
    <StatusPill tone={SEVERITY_TONE[severity]} size={size} title={SEVERITY_LABELS[severity]} data-severity={severity}>
      {full ? SEVERITY_LABELS[severity] : SEVERITY_SHORT[severity]}
    </StatusPill>
  );
}

export function DefectStatePill({ state, size }: { state: DefectState; size?: "sm" | "md" | "lg" }) {
  return (
    <StatusPill tone={STATE_TONE[state]} size={size} data-state={state}>
      {STATE_LABELS[state]}
    </StatusPill>
  );
}
