import type { Metadata } from "next";
import { Card, CardBody, CardHeader } from "@/components/ui";
import { getVehicle } from "@/lib/commands/vehicles";
import { requirePermission } from "@/lib/server/guard";
import { execute } from "@/lib/server/operation";

export const metadata: Metadata = { title: "Vehicle" };

export default async function VehicleDetailsPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const user = await requirePermission("read", "Vehicle");
  const vehicle = await execute(getVehicle, user, { id });
  const facts: [string, string | number | null | undefined][] = [
    ["Registration", vehicle.registration],
    ["VIN", vehicle.vin],
    ["Platform", `${vehicle.platform.make} ${vehicle.platform.model} ${vehicle.platform.variant}`],
    ["Depot", vehicle.depot],
    ["Cost centre", vehicle.costCentre],
    ["Odometer", vehicle.odometerKm != null ? `${vehicle.odometerKm.toLocaleString("en-AU")} km` : null],
    ["Build year", vehicle.buildYear],
    ["Drivers", vehicle.drivers.map((d) => d.name).join(", ") || "None assigned"],
  ];
  return (
    <>
      {vehicle.groundedReason && vehicle.state === "grounded" && (
        <p className="rounded-md border-l-4 border-danger bg-danger-soft px-3 py-2 font-medium text-danger-ink">
          Grounded: {vehicle.groundedReason}
        </p>
      )}
      <Card>
        <CardHeader title="Details" />
        <CardBody>
          <dl className="grid grid-cols-1 gap-x-8 gap-y-3 sm:grid-cols-2">
            {facts.map(([label, value]) => (
              <div key={label} className="flex flex-col">
                <dt className="text-sm text-muted">{label}</dt>
                <dd className="font-medium">{value ?? "—"}</dd>
              </div>
            ))}
          </dl>
        </CardBody>
      </Card>
    </>
  );
}
