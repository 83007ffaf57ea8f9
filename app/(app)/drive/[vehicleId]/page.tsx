import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { ReadinessPanel } from "@/components/readiness";
import { PageHeader, buttonClasses } from "@/components/ui";
import { VehicleStatePill } from "@/components/vehicles/vehicle-state";
import { db } from "@/db/client";
import { driverVehicles, latestChecksByVehicle, listDefects } from "@/db/defects";
import { loadVehicleReadiness } from "@/db/readiness";
import { requirePermission } from "@/lib/server/guard";
import { MyReports } from "@/components/drive/my-reports";
import { Instant } from "@/components/providers/time-zone";
import { faultCount } from "@/components/drive/fault-count";

export const metadata: Metadata = { title: "My vehicle" };

export default async function DriveVehiclePage({ params }: { params: Promise<{ vehicleId: string }> }) {
  const { vehicleId } = await params;
  const user = await requirePermission("create", "PreTripCheck");
  const vehicle = (await driverVehicles(db(), user)).find((v) => v.id === vehicleId);
  if (!vehicle) notFound();
  const [readiness, checks, reports] = await Promise.all([
    loadVehicleReadiness(db(), user, vehicle.id),
    latestChecksByVehicle(db(), user, [vehicle.id]),
    listDefects(db(), user, { vehicleId: vehicle.id, limit: 20 }),
  ]);
  const last = checks.get(vehicle.id);
  return (
    <>
      <PageHeader
        eyebrow={
          // Plain links on the driver screens: without signal they load the page the phone kept.
          // eslint-disable-next-line @next/next/no-html-link-for-pages
          <a href="/drive" className="underline underline-offset-4">
            My vehicles
          </a>
        }
        title={vehicle.fleetNumber}
        question="Can I take it out today?"
        actions={vehicle.state !== "in_service" ? <VehicleStatePill state={vehicle.state} size="lg" /> : undefined}
      />
      <p className="-mt-2 text-base text-muted">
        {vehicle.registration ?? "No registration"} · {vehicle.make} {vehicle.model} {vehicle.variant}
      </p>
      {vehicle.state === "grounded" && (
        <p className="rounded-lg border-l-8 border-danger bg-danger-soft px-4 py-3 text-lg font-bold text-danger-ink" data-testid="grounded-banner">
          Grounded — do not drive.
          {vehicle.groundedReason && <span className="mt-1 block text-base font-medium">{vehicle.groundedReason}</span>}
        </p>
      )}
      {readiness && <ReadinessPanel readiness={readiness} size="field" title="Ready for the trip?" />}
      <div className="grid grid-cols-1 gap-3 sm:grid-cols-2">
        <a href={`/drive/${vehicle.id}/check`} className={buttonClasses({ size: "lg", className: "text-lg" })}>
          Start pre-trip check
        </a>
        <a href={`/drive/${vehicle.id}/defect`} className={buttonClasses({ size: "lg", variant: "secondary", className: "text-lg" })}>
          Report a defect
        </a>
      </div>
      <p className="text-base text-muted" data-testid="last-check">
        {last ? (
          <>
            Your last check: <Instant at={last.completedAt} /> · {faultCount(last.faults)}
          </>
        ) : (
          "You have not checked this vehicle yet."
        )}
      </p>
      <section aria-labelledby="vehicle-reports-heading" className="flex flex-col gap-3">
        <h2 id="vehicle-reports-heading" className="text-xl font-bold">
          My reports on {vehicle.fleetNumber}
        </h2>
        <MyReports reports={reports} showVehicle={false} />
      </section>
    </>
  );
}
