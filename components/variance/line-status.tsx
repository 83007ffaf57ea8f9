import { StatusPill, type StatusTone } from "@/components/ui";
import type { LineStatus } from "@/lib/variance";

export const LINE_STATUS_WORDS: Record<LineStatus, string> = {
  meets: "Meets",
  short: "Short",
  off_spec: "Off-spec",
  unproven: "Unproven",
  concession: "Concession",
  prohibited_fitted: "Prohibited item fitted",
  optional_absent: "Not fitted (optional)",
};

export const LINE_STATUS_TONES: Record<LineStatus, StatusTone> = {
  meets: "ok",
  short: "danger",
  off_spec: "warn",
  unproven: "info",
  concession: "neutral",
  prohibited_fitted: "danger",
  optional_absent: "neutral",
};

/** A line's status: word, shape and colour. */
export function LineStatusPill({ status, size = "sm" }: { status: LineStatus; size?: "sm" | "md" | "lg" }) {
  return (
    <StatusPill tone={LINE_STATUS_TONES[status]} size={size} data-status={status}>
      {LINE_STATUS_WORDS[status]}
    </StatusPill>
  );
}

export const VEHICLE_VARIANCE_WORDS = { meets_standard: "Meets its standard", gaps: "Has gaps", no_edition: "No standard assigned" } as const;
export const VEHICLE_VARIANCE_TONES = { meets_standard: "ok", gaps: "danger", no_edition: "neutral" } as const;

export function VehicleVariancePill({ status, size = "md" }: { status: keyof typeof VEHICLE_VARIANCE_WORDS; size?: "sm" | "md" | "lg" }) {
  return (
    <StatusPill tone={VEHICLE_VARIANCE_TONES[status]} size={size} data-status={status}>
      {VEHICLE_VARIANCE_WORDS[status]}
    </StatusPill>
  );
}
