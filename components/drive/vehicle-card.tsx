import { ReadinessPill } from "@/components/readiness";
import { buttonClasses } from "@/components/ui";
import { VehicleStatePill } from "@/components/vehicles/vehicle-state";
import type { VehicleState } from "@/db/schema";
import type { TripReadiness } from "@/lib/readiness";
import { Instant } from "@/components/providers/time-zone";
import { faultCount } from "./fault-count";

export type DriveVehicle = {
  id: string;
  fleetNumber: string;
  registration: string | null;
  state: VehicleState;
  make: string;
  model: string;
};

/** One of the driver's vehicles: is it ready, when was it last checked, and the two things to do. */
export function DriveVehicleCard({ vehicle, readiness, lastCheck }: { vehicle: DriveVehicle; readiness: TripReadiness | null; lastCheck: { completedAt: Date; faults: number } | null }) {
  return (
    <article className="flex flex-col gap-3 rounded-lg border-2 border-line bg-surface-raised p-4" data-testid={`drive-vehicle-${vehicle.fleetNumber}`} aria-label={vehicle.fleetNumber}>
      <a href={`/drive/${vehicle.id}`} className="flex items-start justify-between gap-3 rounded-md hover:underline">
        <span>
          <span className="block text-2xl font-bold">{vehicle.fleetNumber}</span>
          <span className="block text-base text-muted">
            {vehicle.registration ?? "No registration"} · {vehicle.make} {vehicle.model}
          </span>
        </span>
        <span className="flex flex-col items-end gap-1">
          {readiness && <ReadinessPill state={readiness.state} size="lg" />}
          {vehicle.state !== "in_service" && <VehicleStatePill state={vehicle.state} />}
        </span>
      </a>
      {readiness && <p className="text-base font-semibold">{readiness.headline}</p>}
      <p className="text-sm text-muted">{lastCheck ? (
          <>
            Your last check: <Instant at={lastCheck.completedAt} /> · {faultCount(lastCheck.faults)}
          </>
        ) : (
          "You have not checked it yet"
        )}</p>
      <div className="grid grid-cols-2 gap-2">
        <a href={`/drive/${vehicle.id}/check`} className={buttonClasses({ size: "lg" })}>
          Pre-trip check
        </a>
        <a href={`/drive/${vehicle.id}/defect`} className={buttonClasses({ size: "lg", variant: "secondary" })}>
          Report a defect
        </a>
      </div>
    </article>
  );
}
