import Link from "next/link";
import { EmptyState, Table, TBody, Td, Th, THead, Tr } from "@/components/ui";
import type { JobState } from "@/lib/jobs";
import { JobStatePill } from "./status";
import { formatCalendarDay } from "@/lib/format/dates";

export type JobRow = {
  id: string;
  number: number;
  title: string;
  state: JobState;
  dueAt: Date | null;
  overdue: boolean;
  fleetNumber: string;
  depotName: string | null;
  awardedFirmName: string | null;
  offers: { firmId: string; firmName: string }[];
};

/** Jobs in a dense table: number, work, vehicle, depot, state, who does it, when it is due. */
export function JobsTable({ jobs, showVehicle = true, emptyText }: { jobs: JobRow[]; showVehicle?: boolean; emptyText: string }) {
  if (jobs.length === 0) return <EmptyState title="No jobs here">{emptyText}</EmptyState>;
  return (
    <Table label="Jobs" density="compact" data-testid="jobs-table">
      <THead>
        <Tr>
          <Th numeric>Job</Th>
          <Th>Work</Th>
          {showVehicle && <Th>Vehicle</Th>}
          <Th>Depot</Th>
          <Th>State</Th>
          <Th>Workshop</Th>
          <Th>Due</Th>
        </Tr>
      </THead>
      <TBody>
        {jobs.map((j) => (
          <Tr key={j.id} data-testid="job-row">
            <Td numeric>{j.number}</Td>
            <Td>
              <Link href={`/jobs/${j.id}`} className="font-semibold text-accent hover:underline">
                {j.title}
              </Link>
            </Td>
            {showVehicle && <Td>{j.fleetNumber}</Td>}
            <Td>{j.depotName ?? "—"}</Td>
            <Td>
              <JobStatePill state={j.state} size="sm" />
            </Td>
            <Td>{j.awardedFirmName ?? (j.offers.length ? `Asked: ${j.offers.map((o) => o.firmName).join(", ")}` : <span className="text-muted">Not offered</span>)}</Td>
            <Td className={j.overdue ? "font-semibold text-danger" : undefined}>
              {formatCalendarDay(j.dueAt)}
              {j.overdue && " (overdue)"}
            </Td>
          </Tr>
        ))}
      </TBody>
    </Table>
  );
}
