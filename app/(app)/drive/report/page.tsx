import type { Metadata } from "next";
import { EmptyState, PageHeader } from "@/components/ui";
import { VehicleStatePill } from "@/components/vehicles/vehicle-state";
import { db } from "@/db/client";
import { driverVehicles } from "@/db/defects";
import { requirePermission } from "@/lib/server/guard";

export const metadata: Metadata = { title: "Report a defect" };

/** "Report a defect" from the menu: pick the vehicle, then the form. */
export default async function ReportPickPage() {
  const user = await requirePermission("create", "Defect");
  const vehicles = await driverVehicles(db(), user);
  return (
    <>
      <PageHeader title="Report a defect" question="Which vehicle is it on?" />
      {vehicles.length === 0 ? (
        <EmptyState title="No vehicle assigned">Ask your fleet manager to assign you a vehicle.</EmptyState>
      ) : (
        <ul className="flex flex-col gap-3">
          {vehicles.map((v) => (
            <li key={v.id}>
              <a href={`/drive/${v.id}/defect`} className="flex min-h-16 items-center justify-between gap-4 rounded-lg border-2 border-line bg-surface-raised px-4 py-3 text-lg hover:border-accent">
                <span>
                  <span className="block font-bold">{v.fleetNumber}</span>
                  <span className="block text-base text-muted">
                    {v.registration ?? "No registration"} · {v.make} {v.model}
                  </span>
                </span>
                {v.state !== "in_service" && <VehicleStatePill state={v.state} />}
              </a>
            </li>
          ))}
        </ul>
      )}
    </>
  );
}
