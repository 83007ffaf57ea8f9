import { Card, CardBody, CardHeader, Caution, StatusShape, cn, type StatusTone } from "@/components/ui";
import { db } from "@/db/client";
import { loadVehicleReadiness } from "@/db/readiness";
import type { Actor } from "@/lib/permissions";
import type { ReasonSeverity, TripReadiness } from "@/lib/readiness";
import { ReadinessPill } from "./readiness-pill";

/**
 * Trip readiness of one vehicle: the state in a word, the one-line headline, and every reason.
 *
 *   <ReadinessPanel readiness={r} />                       // when you already have it
 *   <VehicleReadinessPanel actor={user} vehicleId={id} />  // server component: loads it itself
 *
 * `size="field"` is the driver's version (bigger type, for a phone in the sun).
 */

const REASON_TONE: Record<ReasonSeverity, StatusTone> = { not_ready: "danger", limited: "warn", note: "neutral" };
const REASON_WORD: Record<ReasonSeverity, string> = { not_ready: "Stops the trip", limited: "Limits the trip", note: "Note" };

export const READINESS_CAUTION =
  "Worked out from what Rigline knows. Your own walk-round comes first: if something looks wrong, do not drive.";

export type ReadinessPanelProps = {
  readiness: TripReadiness;
  size?: "desk" | "field";
  title?: string;
  className?: string;
};

export function ReadinessPanel({ readiness, size = "desk", title = "Trip readiness", className }: ReadinessPanelProps) {
  const field = size === "field";
  return (
    <Card className={className} data-testid="readiness-panel" aria-label={title}>
      <CardHeader title={title} actions={<ReadinessPill state={readiness.state} size={field ? "lg" : "md"} />} />
      <CardBody className="flex flex-col gap-3">
        <p className={cn("font-semibold", field ? "text-lg" : "text-base")} data-testid="readiness-headline">
          {readiness.headline}
        </p>
        {readiness.reasons.length > 0 && (
          <ul className={cn("flex flex-col gap-2", field ? "text-base" : "text-sm")} aria-label="Reasons">
            {readiness.reasons.map((reason, i) => (
              <li key={`${reason.code}-${reason.ref ?? i}`} className="flex items-start gap-2" data-reason={reason.code}>
                <StatusShape tone={REASON_TONE[reason.severity]} sizePx={field ? 16 : 14} className="mt-1" />
                <span>
                  <span className="sr-only">{REASON_WORD[reason.severity]}: </span>
                  {reason.message}
                </span>
              </li>
            ))}
          </ul>
        )}
        <Caution text={READINESS_CAUTION} label="About readiness" />
      </CardBody>
    </Card>
  );
}

/** Loads and shows one vehicle's readiness (nothing when the actor may not see the vehicle). */
export async function VehicleReadinessPanel({ actor, vehicleId, size, title, className }: { actor: Actor; vehicleId: string } & Omit<ReadinessPanelProps, "readiness">) {
  const readiness = await loadVehicleReadiness(db(), actor, vehicleId);
  if (!readiness) return null;
  return <ReadinessPanel readiness={readiness} size={size} title={title} className={className} />;
}
