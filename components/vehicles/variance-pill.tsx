import { StatusPill } from "@/components/ui";

export type VarianceStatusValue = "meets_standard" | "gaps" | "no_edition";

export const VARIANCE_LABELS: Record<VarianceStatusValue, string> = {
  meets_standard: "Meets standard",
  gaps: "Has gaps",
  no_edition: "No standard",
};

const tone = { meets_standard: "ok", gaps: "warn", no_edition: "neutral" } as const;

/** Whether a vehicle meets the edition it must meet: word, shape and colour. */
export function VariancePill({ status, size = "sm" }: { status: VarianceStatusValue; size?: "sm" | "md" | "lg" }) {
  return (
    <StatusPill tone={tone[status]} size={size}>
      {VARIANCE_LABELS[status]}
    </StatusPill>
  );
}
