import type { Metadata } from "next";
import Link from "next/link";
import { PageHeader, Table, TBody, Td, Th, THead, Tr, EmptyState } from "@/components/ui";
import { VehicleStatePill } from "@/components/vehicles/vehicle-state";
import { db } from "@/db/client";
import { listVehicleSummaries } from "@/db/vehicles";
import { requirePermission } from "@/lib/server/guard";

export const metadata: Metadata = { title: "Vehicles" };

export default async function VehiclesPage() {
  const user = await requirePermission("read", "Vehicle");
  const rows = await listVehicleSummaries(db(), user);
  const mine = user.role === "driver" || user.role === "contractor";
  return (
    <div className="flex flex-col gap-6">
      <PageHeader
        title={mine ? "My vehicles" : "Vehicles"}
        question={mine ? "Which vehicles are in my care?" : "What is in the fleet, and where is each vehicle?"}
      />
      {rows.length === 0 ? (
        <EmptyState title="No vehicles to show">
          {mine ? "No vehicle is assigned to you yet." : "Add or import vehicles to start the register."}
        </EmptyState>
      ) : (
        <Table label="Vehicles">
          <THead>
            <Tr>
              <Th>Fleet no.</Th>
              <Th>Registration</Th>
              <Th>Platform</Th>
              <Th>Depot</Th>
              <Th>State</Th>
              <Th numeric>Odometer</Th>
            </Tr>
          </THead>
          <TBody>
            {rows.map((v) => (
              <Tr key={v.id}>
                <Td>
                  <Link href={`/vehicles/${v.id}`} className="font-semibold text-accent underline-offset-4 hover:underline">
                    {v.fleetNumber}
                  </Link>
                </Td>
                <Td>{v.registration}</Td>
                <Td>
                  {v.make} {v.model} <span className="text-muted">{v.variant}</span>
                </Td>
                <Td>{v.depotName}</Td>
                <Td>
                  <VehicleStatePill state={v.state} />
                </Td>
                <Td numeric unit="km">
                  {v.odometerKm?.toLocaleString("en-AU")}
                </Td>
              </Tr>
            ))}
          </TBody>
        </Table>
      )}
    </div>
  );
}
