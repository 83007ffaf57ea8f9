import { StatusPill, type StatusTone } from "@/components/ui";
import type { ReadinessState } from "@/lib/readiness";

export const READINESS_LABELS: Record<ReadinessState, string> = { ready: "Ready", limited: "Limited", not_ready: "Not ready" };
export const READINESS_TONES: Record<ReadinessState, StatusTone> = { ready: "ok", limited: "warn", not_ready: "danger" };

/** Trip readiness in one word, with its shape and colour. */
export function ReadinessPill({ state, size }: { state: ReadinessState; size?: "sm" | "md" | "lg" }) {
  return (
    <StatusPill tone={READINESS_TONES[state]} size={size} data-readiness={state}>
      {READINESS_LABELS[state]}
    </StatusPill>
  );
}
