import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { RaiseJobForm } from "@/components/jobs/raise-job-form";
import { Button, Card, CardBody, CardHeader, Field, PageHeader, Select } from "@/components/ui";
import { db } from "@/db/client";
import { findDefect } from "@/db/defects";
import { listVehicleSummaries } from "@/db/vehicles";
import { vehiclePlan } from "@/lib/commands/jobs";
import { defectTitle } from "@/lib/defects";
import { AppError } from "@/lib/server/errors";
import { requirePermission } from "@/lib/server/guard";
import { execute } from "@/lib/server/operation";

export const metadata: Metadata = { title: "Raise a job" };

export default async function NewJobPage({ searchParams }: { searchParams: Promise<{ vehicleId?: string; defectId?: string }> }) {
  const user = await requirePermission("manage", "Job");
  const { vehicleId, defectId } = await searchParams;
  if (!vehicleId) {
    const vehicles = await listVehicleSummaries(db(), user, { limit: 500 });
    return (
      <div className="flex flex-col gap-6">
        <PageHeader title="Raise a job" question="Which vehicle needs work?" />
        <Card>
          <CardBody>
            <form method="get" aria-label="Choose a vehicle" className="flex flex-wrap items-end gap-4">
              <Field label="Vehicle" id="new-job-vehicle">
                <Select name="vehicleId">
                  {vehicles
                    .filter((v) => v.state !== "retired")
                    .map((v) => (
                      <option key={v.id} value={v.id}>
                        {v.fleetNumber} · {v.make} {v.model} · {v.depotName ?? "no depot"}
                      </option>
                    ))}
                </Select>
              </Field>
              <Button type="submit">See its gaps</Button>
            </form>
          </CardBody>
        </Card>
      </div>
    );
  }
  const plan = await execute(vehiclePlan, user, { vehicleId }).catch((error: unknown) => {
    if (error instanceof AppError && (error.code === "not_found" || error.code === "validation_failed")) notFound();
    throw error;
  });
  // Raised from a triaged defect on this vehicle: the job starts from its words and links it.
  const found = defectId && user.ability.can("triage", "Defect") ? await findDefect(db(), user, defectId) : null;
  const repairFor =
    found && found.defect.vehicleId === plan.vehicle.id && found.defect.state === "triaged"
      ? {
          id: found.defect.id,
          title: defectTitle(found.defect.category, found.defect.description, 150),
          description: found.defect.description.replace(/\s+/g, " ").trim().slice(0, 400),
        }
      : null;
  return (
    <div className="flex flex-col gap-6">
      <PageHeader
        eyebrow={
          <Link href={`/vehicles/${plan.vehicle.id}/jobs`} className="hover:underline">
            {plan.vehicle.fleetNumber} · {plan.vehicle.make} {plan.vehicle.model}
          </Link>
        }
        title="Raise a job"
        question="Which of this vehicle's gaps should the job close?"
      />
      <Card>
        <CardHeader title="From the vehicle's variance" description="Short, off-spec and unproven lines, in the order they can be fitted" />
        <CardBody>
          <RaiseJobForm vehicleId={plan.vehicle.id} fleetNumber={plan.vehicle.fleetNumber} lines={plan.lines} repairFor={repairFor} />
        </CardBody>
      </Card>
    </div>
  );
}
