import type { Metadata } from "next";
import Link from "next/link";
import type { ReactNode } from "react";
import { VehicleReadinessPanel } from "@/components/readiness/readiness-panel";
import { Button, Card, CardBody, CardHeader, Caution, Quantity, StatusPill } from "@/components/ui";
import { GroundingActions } from "@/components/vehicles/grounding-actions";
import { VinCheckDigitNote } from "@/components/vehicles/vin-note";
import { getVehicle } from "@/lib/commands/vehicles";
import { requirePermission } from "@/lib/server/guard";
import { execute } from "@/lib/server/operation";
import { formatCalendarDay } from "@/lib/format/dates";

export const metadata: Metadata = { title: "Vehicle" };

/** Registration expiry and weighing dates are calendar days; null stays empty for the facts list. */
const day = (d: Date | null) => (d ? formatCalendarDay(d) : null);

function isPast(date: Date): boolean {
  return date.getTime() < Date.now();
}

function Facts({ items }: { items: [string, ReactNode][] }) {
  return (
    <dl className="grid grid-cols-1 gap-x-8 gap-y-3 sm:grid-cols-2">
      {items.map(([label, value]) => (
        <div key={label} className="flex flex-col">
          <dt className="text-sm text-muted">{label}</dt>
          <dd className="font-medium">{value ?? "—"}</dd>
        </div>
      ))}
    </dl>
  );
}

export default async function VehicleDetailsPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const user = await requirePermission("read", "Vehicle");
  const vehicle = await execute(getVehicle, user, { id });
  const canEdit = user.ability.can("manage", "Vehicle");
  const canGround = user.ability.can("manage", "Grounding");
  const field = user.role === "driver" || user.role === "contractor";
  const p = vehicle.platform;
  const expiry = vehicle.registrationExpiry ? new Date(vehicle.registrationExpiry) : null;
  const expired = expiry !== null && isPast(expiry);

  return (
    <>
      {vehicle.state === "grounded" && (
        <p role="status" className="rounded-md border-l-4 border-danger bg-danger-soft px-3 py-2 font-medium text-danger-ink" data-testid="grounded-banner">
          Grounded: {vehicle.groundedReason ?? "no reason recorded"}. Do not drive until a manager returns it to service.
        </p>
      )}
      <VehicleReadinessPanel actor={user} vehicleId={vehicle.id} />
      {(canEdit || canGround) && (
        <div className="flex flex-wrap gap-3">
          {canEdit && (
            <Button asChild variant="secondary">
              <Link href={`/vehicles/${vehicle.id}/edit`}>Edit vehicle</Link>
            </Button>
          )}
          {canGround && <GroundingActions vehicleId={vehicle.id} fleetNumber={vehicle.fleetNumber} state={vehicle.state} />}
        </div>
      )}
      <div className="grid grid-cols-1 gap-6 lg:grid-cols-2">
        <Card>
          <CardHeader title="Details" />
          <CardBody className="flex flex-col gap-3">
            <Facts
              items={[
                ["Registration", vehicle.registration],
                [
                  "Registration expiry",
                  expiry ? (
                    <span className="inline-flex items-center gap-2">
                      {day(expiry)}
                      {expired && (
                        <StatusPill tone="danger" size="sm">
                          Expired
                        </StatusPill>
                      )}
                    </span>
                  ) : null,
                ],
                ["VIN", vehicle.vin ? <span className="font-mono">{vehicle.vin}</span> : null],
                ["Depot", vehicle.depot],
                ["Cost centre", vehicle.costCentre],
                ["Odometer", vehicle.odometerKm !== null ? <Quantity value={vehicle.odometerKm} unit="km" /> : null],
                ["Build year", vehicle.buildYear],
                [
                  "Standard",
                  vehicle.edition ? `${vehicle.edition.standardName}, edition ${vehicle.edition.number}` : "None assigned",
                ],
              ]}
            />
            {vehicle.vin && !field && <VinCheckDigitNote vin={vehicle.vin} />}
            {vehicle.notes && <p className="whitespace-pre-line text-sm text-muted">{vehicle.notes}</p>}
          </CardBody>
        </Card>
        <Card>
          <CardHeader title="Drivers" description="The drivers who see this vehicle on their phones." />
          <CardBody>
            {vehicle.drivers.length === 0 ? (
              <p className="text-muted">No driver assigned.</p>
            ) : (
              <ul className="flex flex-col gap-1" data-testid="vehicle-drivers">
                {vehicle.drivers.map((d) => (
                  <li key={d.id} className="font-medium">
                    {d.name}
                  </li>
                ))}
              </ul>
            )}
          </CardBody>
        </Card>
        <Card>
          <CardHeader
            title="Platform"
            description={p.ratingsMissing ? "The maker's ratings are not all entered yet." : "The maker's ratings this vehicle is held to."}
            actions={
              !field && (
                <Link href={`/platforms/${p.id}`} className="text-sm font-semibold text-accent hover:underline">
                  {p.name}
                </Link>
              )
            }
          />
          <CardBody>
            <Facts
              items={[
                ["Kerb mass", p.kerbMassKg !== null ? <Quantity value={p.kerbMassKg} unit="kg" /> : null],
                ["GVM", p.gvmKg !== null ? <Quantity value={p.gvmKg} unit="kg" /> : null],
                ["GCM", p.gcmKg !== null ? <Quantity value={p.gcmKg} unit="kg" /> : null],
                [
                  "Axle ratings, front / rear",
                  p.frontAxleRatingKg !== null && p.rearAxleRatingKg !== null ? (
                    <>
                      <Quantity value={p.frontAxleRatingKg} unit="kg" /> / <Quantity value={p.rearAxleRatingKg} unit="kg" />
                    </>
                  ) : null,
                ],
                ["Standard tyre", p.standardTyreSize],
                ["Braked towing", p.towingCapacityKg !== null ? <Quantity value={p.towingCapacityKg} unit="kg" /> : null],
              ]}
            />
          </CardBody>
        </Card>
        <Card>
          <CardHeader title="Measured masses" description="From the latest weighbridge ticket." />
          <CardBody className="flex flex-col gap-3">
            {vehicle.measured ? (
              <>
                <Facts
                  items={[
                    ["Front axle", vehicle.measured.frontKg !== null ? <Quantity value={vehicle.measured.frontKg} unit="kg" /> : null],
                    ["Rear axle", vehicle.measured.rearKg !== null ? <Quantity value={vehicle.measured.rearKg} unit="kg" /> : null],
                    ["Gross", vehicle.measured.grossKg !== null ? <Quantity value={vehicle.measured.grossKg} unit="kg" /> : null],
                    ["Weighed", day(vehicle.measured.measuredAt)],
                  ]}
                />
                <Caution text="Measured on the day of the ticket. Weigh again after the fit-out changes; limits and modifications are decided under local rules by an authorised vehicle engineer." />
              </>
            ) : (
              <p className="text-muted">Not weighed yet. A weighbridge ticket lodged on a job fills this in.</p>
            )}
          </CardBody>
        </Card>
      </div>
    </>
  );
}
