import { notFound } from "next/navigation";
import type { ReactNode } from "react";
import { PageHeader } from "@/components/ui";
import { VehicleStatePill } from "@/components/vehicles/vehicle-state";
import { VehicleTabs, type VehicleTab } from "@/components/vehicles/vehicle-tabs";
import { getVehicle } from "@/lib/commands/vehicles";
import { AppError } from "@/lib/server/errors";
import { requirePermission } from "@/lib/server/guard";
import { execute } from "@/lib/server/operation";

const ALL_TABS: (VehicleTab & { roles?: string[] })[] = [
  { segment: "", label: "Details" },
  { segment: "spec", label: "Spec check" },
  { segment: "mass", label: "Mass & fit-out", roles: ["admin", "manager", "finance", "contractor"] },
  { segment: "jobs", label: "Jobs", roles: ["admin", "manager", "finance", "contractor"] },
  { segment: "defects", label: "Defects" },
  { segment: "costs", label: "Costs", roles: ["admin", "manager", "finance"] },
];

export default async function VehicleLayout({ children, params }: { children: ReactNode; params: Promise<{ id: string }> }) {
  const { id } = await params;
  const user = await requirePermission("read", "Vehicle");
  const vehicle = await execute(getVehicle, user, { id }).catch((error: unknown) => {
    if (error instanceof AppError && (error.code === "not_found" || error.code === "validation_failed")) notFound();
    throw error;
  });
  const tabs = ALL_TABS.filter((t) => !t.roles || t.roles.includes(user.role));
  return (
    <div className="flex flex-col gap-6">
      <PageHeader
        eyebrow={`${vehicle.platform.make} ${vehicle.platform.model} ${vehicle.platform.variant}`}
        title={vehicle.fleetNumber}
        question="Is this vehicle fitted to its standard and fit for the track?"
        actions={<VehicleStatePill state={vehicle.state} />}
      />
      <VehicleTabs vehicleId={vehicle.id} tabs={tabs} />
      {children}
    </div>
  );
}
