import Link from "next/link";
import { EmptyState, TBody, Table, Td, Th, THead, Tr } from "@/components/ui";
import type { DefectListRow } from "@/db/defects";
import { categoryLabel } from "@/lib/defects";
import { DefectStatePill, SeverityPill } from "./defect-pills";
import { Instant } from "@/components/providers/time-zone";

/** Defects for people at desks: most urgent first, each row opening the report. */
export function DefectTable({ rows, empty, showVehicle = true, compactEmpty = false }: { rows: DefectListRow[]; empty: string; showVehicle?: boolean; compactEmpty?: boolean }) {
  if (rows.length === 0) return compactEmpty ? <p className="text-sm text-muted">{empty}</p> : <EmptyState title={empty} />;
  return (
    <Table label="Defects">
      <THead>
        <Tr>
          <Th>How bad</Th>
          {showVehicle && <Th>Vehicle</Th>}
          <Th>What</Th>
          <Th>Reported</Th>
          <Th>State</Th>
          <Th>Job</Th>
          <Th numeric>Photos</Th>
        </Tr>
      </THead>
      <TBody>
        {rows.map((r) => (
          <Tr key={r.id} data-testid={`defect-row-${r.id}`}>
            <Td>
              <SeverityPill severity={r.severity} size="sm" />
            </Td>
            {showVehicle && (
              <Td>
                <Link href={`/vehicles/${r.vehicleId}/defects`} className="font-semibold text-accent hover:underline">
                  {r.fleetNumber}
                </Link>
                {r.vehicleState === "grounded" && <span className="ml-1 text-xs font-semibold text-danger">grounded</span>}
              </Td>
            )}
            <Td className="max-w-md">
              <Link href={`/defects/${r.id}`} className="font-semibold text-accent hover:underline">
                {categoryLabel(r.category)}
              </Link>
              <span className="block truncate text-muted">{r.description}</span>
            </Td>
            <Td className="whitespace-nowrap">
              <Instant at={r.createdAt} />
              <span className="block text-muted">{r.reporterName ?? "—"}</span>
            </Td>
            <Td>
              <DefectStatePill state={r.state} size="sm" />
            </Td>
            <Td>{r.jobNumber !== null ? `Job ${r.jobNumber}` : "—"}</Td>
            <Td numeric>{r.photoCount}</Td>
          </Tr>
        ))}
      </TBody>
    </Table>
  );
}
