import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { dollarsOf } from "@/components/charts/format";
import { ExportLinks } from "@/components/costs/export-links";
import { LedgerTable } from "@/components/costs/ledger-table";
import { LedgerTotals } from "@/components/costs/ledger-totals";
import { buttonClasses, Card, CardBody, CardHeader, EmptyState, Table, TBody, Td, Th, THead, Tr } from "@/components/ui";
import { vehicleCosts } from "@/lib/commands/costs";
import { CATEGORY_LABELS } from "@/lib/exports";
import { AppError } from "@/lib/server/errors";
import { requirePermission } from "@/lib/server/guard";
import { execute } from "@/lib/server/operation";

export const metadata: Metadata = { title: "Vehicle costs" };

export default async function VehicleCostsPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const user = await requirePermission("read", "Cost");
  const data = await execute(vehicleCosts, user, { vehicleId: id }).catch((error: unknown) => {
    if (error instanceof AppError && (error.code === "not_found" || error.code === "validation_failed")) notFound();
    throw error;
  });
  const canBook = user.ability.can("manage", "Cost");
  const largest = Math.max(1, ...data.byCategory.map((c) => Math.abs(c.exGstCents)));
  return (
    <div className="flex flex-col gap-6">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <p className="text-muted">
          Every cost booked against {data.vehicle.fleetNumber}
          {data.vehicle.costCentre ? `, cost centre ${data.vehicle.costCentre}` : ""}.
        </p>
        <div className="flex flex-wrap gap-2">
          <ExportLinks values={{ vehicleId: data.vehicle.id }} what={`costs of ${data.vehicle.fleetNumber}`} />
          <Link href={`/costs?vehicleId=${data.vehicle.id}`} className={buttonClasses({ variant: "secondary" })}>
            Open in the ledger
          </Link>
          {canBook && (
            <Link href={`/costs/new?vehicleId=${data.vehicle.id}`} className={buttonClasses({ variant: "primary" })}>
              Enter an invoice
            </Link>
          )}
        </div>
      </div>
      <LedgerTotals totals={data.totals} />
      {data.entries.length === 0 ? (
        <EmptyState title="No costs booked yet">Costs appear here when a job on this vehicle is signed off or an invoice is entered.</EmptyState>
      ) : (
        <>
          <Card>
            <CardHeader title="By category" description="Spend before GST in each category of the standard." />
            <CardBody>
              <Table label="Costs by category">
                <THead>
                  <Tr>
                    <Th>Category</Th>
                    <Th numeric>Entries</Th>
                    <Th numeric>Ex GST</Th>
                    <Th>
                      <span className="sr-only">Share of the largest category</span>
                    </Th>
                  </Tr>
                </THead>
                <TBody>
                  {data.byCategory.map((c) => (
                    <Tr key={c.category}>
                      <Th scope="row">{CATEGORY_LABELS[c.category]}</Th>
                      <Td numeric>{c.entries}</Td>
                      <Td numeric>{dollarsOf(c.exGstCents)}</Td>
                      <Td className="w-1/3">
                        <span aria-hidden="true" className="block h-3 rounded-sm bg-night-600" style={{ width: `${Math.max(2, (Math.abs(c.exGstCents) / largest) * 100)}%` }} />
                      </Td>
                    </Tr>
                  ))}
                </TBody>
              </Table>
            </CardBody>
          </Card>
          <Card>
            <CardHeader title="Entries" description="Newest first." />
            <CardBody>
              <LedgerTable entries={data.entries} showVehicle={false} label={`Costs of ${data.vehicle.fleetNumber}`} />
            </CardBody>
          </Card>
        </>
      )}
    </div>
  );
}
