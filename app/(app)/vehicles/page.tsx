import type { Metadata } from "next";
import Link from "next/link";
import { Suspense } from "react";
import { Button, PageHeader, Skeleton } from "@/components/ui";
import { VehicleRegister } from "@/components/vehicles/vehicle-register";
import { registerOptions } from "@/lib/commands/vehicles";
import { requirePermission } from "@/lib/server/guard";
import { execute } from "@/lib/server/operation";

export const metadata: Metadata = { title: "Vehicles" };

export default async function VehiclesPage() {
  const user = await requirePermission("read", "Vehicle");
  const options = await execute(registerOptions, user, {});
  const mine = user.role === "driver" || user.role === "contractor";
  const canManage = user.ability.can("manage", "Vehicle");
  return (
    <div className="flex flex-col gap-6">
      <PageHeader
        title={mine ? "My vehicles" : "Vehicles"}
        question={mine ? "Which vehicles are in my care?" : "What is in the fleet, where is each vehicle, and does it meet its standard?"}
        actions={
          canManage && (
            <>
              <Button asChild variant="secondary">
                <Link href="/imports">Import from a spreadsheet</Link>
              </Button>
              <Button asChild>
                <Link href="/vehicles/new">Add vehicle</Link>
              </Button>
            </>
          )
        }
      />
      <Suspense fallback={<Skeleton className="h-64 w-full" />}>
        <VehicleRegister options={options} canManage={canManage} mine={mine} />
      </Suspense>
    </div>
  );
}
