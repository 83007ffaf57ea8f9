import type { Metadata } from "next";
import { Card, CardBody } from "@/components/ui";
import { VehicleForm } from "@/components/vehicles/vehicle-form";
import { getVehicle, vehicleFormOptions } from "@/lib/commands/vehicles";
import { requirePermission } from "@/lib/server/guard";
import { execute } from "@/lib/server/operation";

export const metadata: Metadata = { title: "Edit vehicle" };

const isoDay = (d: Date | null) => (d ? new Date(d).toISOString().slice(0, 10) : null);

export default async function EditVehiclePage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const user = await requirePermission("manage", "Vehicle");
  // The layout has already answered 404 for a vehicle the user may not see.
  const [vehicle, options] = await Promise.all([execute(getVehicle, user, { id }), execute(vehicleFormOptions, user, {})]);
  return (
    <Card>
      <CardBody>
        <h2 className="mb-4 text-xl font-semibold">Edit {vehicle.fleetNumber}</h2>
        <VehicleForm
          options={options}
          vehicle={{
            id: vehicle.id,
            version: vehicle.version,
            fleetNumber: vehicle.fleetNumber,
            vin: vehicle.vin,
            registration: vehicle.registration,
            registrationExpiry: isoDay(vehicle.registrationExpiry),
            platformId: vehicle.platform.id,
            depotId: vehicle.depotId,
            costCentre: vehicle.costCentre,
            state: vehicle.state,
            odometerKm: vehicle.odometerKm,
            buildYear: vehicle.buildYear,
            notes: vehicle.notes,
            driverIds: vehicle.drivers.map((d) => d.id),
          }}
        />
      </CardBody>
    </Card>
  );
}
