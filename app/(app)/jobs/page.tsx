import type { Metadata } from "next";
import Link from "next/link";
import { and, asc, eq } from "drizzle-orm";
import { JobsTable } from "@/components/jobs/jobs-table";
import { Button, Card, CardBody, Checkbox, Field, PageHeader, Select } from "@/components/ui";
import { db } from "@/db/client";
import { contractorFirms, depots } from "@/db/schema";
import { listJobs } from "@/lib/commands/jobs";
import { JOB_STATE_LABELS, JOB_STATES } from "@/lib/jobs";
import { AppError } from "@/lib/server/errors";
import { requirePermission } from "@/lib/server/guard";
import { execute } from "@/lib/server/operation";

export const metadata: Metadata = { title: "Jobs" };

type Search = { state?: string; firmId?: string; depotId?: string; overdue?: string };

export default async function JobsPage({ searchParams }: { searchParams: Promise<Search> }) {
  const user = await requirePermission("read", "Job");
  const search = await searchParams;
  const filters = {
    state: search.state || undefined,
    firmId: search.firmId || undefined,
    depotId: search.depotId || undefined,
    overdue: search.overdue === "1" ? "1" : undefined,
  };
  const jobs = await execute(listJobs, user, filters).catch((error: unknown) => {
    if (error instanceof AppError && error.code === "validation_failed") return [];
    throw error;
  });
  const isContractor = user.role === "contractor";
  const [firms, depotRows] = isContractor
    ? [[], []]
    : await Promise.all([
        db().select({ id: contractorFirms.id, name: contractorFirms.name }).from(contractorFirms).where(eq(contractorFirms.orgId, user.orgId)).orderBy(asc(contractorFirms.name)),
        db().select({ id: depots.id, name: depots.name }).from(depots).where(and(eq(depots.orgId, user.orgId))).orderBy(asc(depots.name)),
      ]);
  // For a workshop: jobs still open for its quote, and work awarded to it that is not finished.
  const waiting = jobs.filter((j) => j.state === "quoting" || (["awarded", "in_workshop"].includes(j.state) && j.awardedFirmId === user.firmId));
  return (
    <div className="flex flex-col gap-6">
      <PageHeader
        title={isContractor ? "Our job queue" : "Jobs"}
        question={isContractor ? "What is offered or awarded to our workshop, and what is due first?" : "Which work is open, with whom, and what is overdue?"}
        actions={
          user.ability.can("manage", "Job") && (
            <Button asChild>
              <Link href="/jobs/new">Raise a job</Link>
            </Button>
          )
        }
      />
      {isContractor && (
        <p className="text-lg" data-testid="queue-count">
          {waiting.length === 0 ? "Nothing is waiting for your workshop." : `${waiting.length} ${waiting.length === 1 ? "job is" : "jobs are"} waiting for your workshop.`}
        </p>
      )}
      <Card>
        <CardBody>
          <form method="get" aria-label="Filter jobs" className="grid grid-cols-1 items-end gap-4 md:grid-cols-5">
            <Field label="State" id="filter-state">
              <Select name="state" defaultValue={filters.state ?? ""} size={isContractor ? "lg" : "md"}>
                <option value="">Any state</option>
                {JOB_STATES.map((s) => (
                  <option key={s} value={s}>
                    {JOB_STATE_LABELS[s]}
                  </option>
                ))}
              </Select>
            </Field>
            {!isContractor && (
              <>
                <Field label="Workshop" id="filter-firm">
                  <Select name="firmId" defaultValue={filters.firmId ?? ""}>
                    <option value="">Any workshop</option>
                    {firms.map((f) => (
                      <option key={f.id} value={f.id}>
                        {f.name}
                      </option>
                    ))}
                  </Select>
                </Field>
                <Field label="Depot" id="filter-depot">
                  <Select name="depotId" defaultValue={filters.depotId ?? ""}>
                    <option value="">Any depot</option>
                    {depotRows.map((d) => (
                      <option key={d.id} value={d.id}>
                        {d.name}
                      </option>
                    ))}
                  </Select>
                </Field>
              </>
            )}
            <Checkbox name="overdue" value="1" defaultChecked={filters.overdue === "1"} label="Overdue only" />
            <div className="flex gap-2">
              <Button type="submit" variant="secondary" size={isContractor ? "lg" : "md"}>
                Show
              </Button>
              <Button asChild variant="ghost" size={isContractor ? "lg" : "md"}>
                <Link href="/jobs">Clear</Link>
              </Button>
            </div>
          </form>
        </CardBody>
      </Card>
      <JobsTable jobs={jobs} emptyText={isContractor ? "No job is offered to your workshop right now." : "No job matches these filters."} />
    </div>
  );
}
