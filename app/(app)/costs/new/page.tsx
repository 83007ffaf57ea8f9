import type { Metadata } from "next";
import { ManualCostForm } from "@/components/costs/manual-cost-form";
import { Card, CardBody, CardHeader, PageHeader } from "@/components/ui";
import { ledgerFilterOptions } from "@/lib/commands/costs";
import { requirePermission } from "@/lib/server/guard";
import { execute } from "@/lib/server/operation";

export const metadata: Metadata = { title: "Enter an invoice" };

export default async function NewCostPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const user = await requirePermission("manage", "Cost");
  const params = await searchParams;
  const vehicleId = typeof params.vehicleId === "string" ? params.vehicleId : undefined;
  const options = await execute(ledgerFilterOptions, user, {});
  const today = new Date().toISOString().slice(0, 10);
  return (
    <div className="flex flex-col gap-6">
      <PageHeader eyebrow="Costs" title="Enter an invoice" question="Which invoice from outside Rigline needs booking, and to what?" />
      <Card>
        <CardHeader title="Invoice or adjustment" description="Costs of signed-off jobs are booked automatically; enter here what was bought or serviced outside Rigline. A credit note is an adjustment with a negative amount." />
        <CardBody>
          <ManualCostForm options={options} today={today} vehicleId={vehicleId && options.vehicles.some((v) => v.id === vehicleId) ? vehicleId : undefined} />
        </CardBody>
      </Card>
    </div>
  );
}
