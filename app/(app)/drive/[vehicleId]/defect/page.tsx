import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { DefectForm } from "@/components/drive/defect-form";
import { PageHeader } from "@/components/ui";
import { db } from "@/db/client";
import { driverVehicles } from "@/db/defects";
import { requirePermission } from "@/lib/server/guard";

export const metadata: Metadata = { title: "Report a defect" };

export default async function DefectPage({ params }: { params: Promise<{ vehicleId: string }> }) {
  const { vehicleId } = await params;
  const user = await requirePermission("create", "Defect");
  const vehicle = (await driverVehicles(db(), user)).find((v) => v.id === vehicleId);
  if (!vehicle) notFound();
  return (
    <>
      <PageHeader
        eyebrow={<a href={`/drive/${vehicle.id}`} className="underline underline-offset-4">{vehicle.fleetNumber}</a>}
        title="Report a defect"
        question="What is wrong with the vehicle?"
      />
      <DefectForm userId={user.userId} vehicle={{ id: vehicle.id, fleetNumber: vehicle.fleetNumber, registration: vehicle.registration, odometerKm: vehicle.odometerKm }} />
    </>
  );
}
