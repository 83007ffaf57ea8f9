import Link from "next/link";
import { JobsTable } from "@/components/jobs/jobs-table";
import { Button, Card, CardBody, CardHeader } from "@/components/ui";
import { listJobs } from "@/lib/commands/jobs";
import { requirePermission } from "@/lib/server/guard";
import { execute } from "@/lib/server/operation";

export default async function VehicleJobsPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const user = await requirePermission("read", "Job");
  const jobs = await execute(listJobs, user, { vehicleId: id });
  return (
    <Card>
      <CardHeader
        title="Jobs"
        description="Work raised on this vehicle, newest first"
        actions={
          user.ability.can("manage", "Job") && (
            <Button asChild>
              <Link href={`/jobs/new?vehicleId=${id}`}>Raise a job from its gaps</Link>
            </Button>
          )
        }
      />
      <CardBody>
        <JobsTable jobs={jobs} showVehicle={false} emptyText="No job has been raised on this vehicle." />
      </CardBody>
    </Card>
  );
}
