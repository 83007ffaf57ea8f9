import type { Metadata } from "next";
import Link from "next/link";
import { PageHeader } from "@/components/ui";
import { VehicleForm } from "@/components/vehicles/vehicle-form";
import { vehicleFormOptions } from "@/lib/commands/vehicles";
import { requirePermission } from "@/lib/server/guard";
import { execute } from "@/lib/server/operation";

export const metadata: Metadata = { title: "Add vehicle" };

export default async function NewVehiclePage() {
  const user = await requirePermission("manage", "Vehicle");
  const options = await execute(vehicleFormOptions, user, {});
  return (
    <div className="flex flex-col gap-6">
      <PageHeader
        eyebrow={<Link href="/vehicles" className="hover:underline">Vehicles</Link>}
        title="Add vehicle"
        question="Which vehicle joins the register, and where does it belong?"
      />
      <VehicleForm options={options} />
    </div>
  );
}
