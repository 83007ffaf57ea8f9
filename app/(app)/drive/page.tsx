import type { Metadata } from "next";
import { EmptyState, PageHeader } from "@/components/ui";
import { db } from "@/db/client";
import { driverVehicles, latestChecksByVehicle, listDefects } from "@/db/defects";
import { readinessByVehicle } from "@/db/readiness";
import { requirePermission } from "@/lib/server/guard";
import { MyReports } from "@/components/drive/my-reports";
import { DriveVehicleCard } from "@/components/drive/vehicle-card";

export const metadata: Metadata = { title: "My checks" };

export default async function DrivePage() {
  const user = await requirePermission("create", "PreTripCheck");
  const vehicles = await driverVehicles(db(), user);
  const ids = vehicles.map((v) => v.id);
  const [readiness, checks, reports] = await Promise.all([readinessByVehicle(db(), user, ids), latestChecksByVehicle(db(), user, ids), listDefects(db(), user, { limit: 20 })]);
  return (
    <>
      <PageHeader title="My vehicles" question="Is my vehicle ready, and what did I report?" />
      {vehicles.length === 0 ? (
        <EmptyState title="No vehicle assigned">Ask your fleet manager to assign you a vehicle.</EmptyState>
      ) : (
        <div className="flex flex-col gap-4">
          {vehicles.map((v) => (
            <DriveVehicleCard key={v.id} vehicle={v} readiness={readiness.get(v.id) ?? null} lastCheck={checks.get(v.id) ?? null} />
          ))}
        </div>
      )}
      <section aria-labelledby="my-reports-heading" className="flex flex-col gap-3">
        <h2 id="my-reports-heading" className="text-xl font-bold">
          My reports
        </h2>
        <MyReports reports={reports} />
      </section>
    </>
  );
}
