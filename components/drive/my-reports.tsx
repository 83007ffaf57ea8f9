import { DefectStatePill, SeverityPill } from "@/components/defects/defect-pills";
import { EmptyState } from "@/components/ui";
import type { DefectListRow } from "@/db/defects";
import { STATE_HINTS, defectTitle } from "@/lib/defects";
import { Instant } from "@/components/providers/time-zone";

/** What the driver reported and where each report stands. */
export function MyReports({ reports, showVehicle = true }: { reports: DefectListRow[]; showVehicle?: boolean }) {
  if (reports.length === 0) return <EmptyState title="Nothing reported">Defects you report appear here with where they stand.</EmptyState>;
  return (
    <ul className="flex flex-col gap-2" aria-label="My reports">
      {reports.map((r) => (
        <li key={r.id}>
          <a href={`/defects/${r.id}`} className="flex flex-col gap-1.5 rounded-lg border-2 border-line bg-surface-raised px-4 py-3 hover:border-accent" data-testid="my-report">
            <span className="flex flex-wrap items-center gap-2">
              <DefectStatePill state={r.state} />
              <SeverityPill severity={r.severity} size="sm" />
              {showVehicle && <span className="font-bold">{r.fleetNumber}</span>}
            </span>
            <span className="text-base font-semibold">{defectTitle(r.category, r.description, 80)}</span>
            <span className="text-sm text-muted">
              <Instant at={r.createdAt} /> · {STATE_HINTS[r.state]}
              {r.jobNumber !== null ? ` Job ${r.jobNumber}.` : ""}
            </span>
          </a>
        </li>
      ))}
    </ul>
  );
}
