import Link from "next/link";
import { dollarsOf } from "@/components/charts/format";
import { Table, TBody, Td, Th, THead, Tr } from "@/components/ui";
import type { LedgerListEntry } from "@/db/costs";
import { CATEGORY_LABELS, KIND_LABELS, SOURCE_LABELS } from "@/lib/exports";
import { formatCalendarDay } from "@/lib/format/dates";

/** Ledger entries, newest first; amounts right-aligned in tabular figures. */
export function LedgerTable({ entries, showVehicle = true, label = "Cost ledger" }: { entries: LedgerListEntry[]; showVehicle?: boolean; label?: string }) {
  return (
    <Table label={label} data-testid="ledger-table">
      <THead>
        <Tr>
          <Th>Date</Th>
          {showVehicle && <Th>Vehicle</Th>}
          <Th>
            Cost centre<span className="block font-normal normal-case">Depot</span>
          </Th>
          <Th>
            Category<span className="block font-normal normal-case">Capital or operating</span>
          </Th>
          <Th>Description</Th>
          <Th>Source</Th>
          <Th numeric>Ex GST</Th>
          <Th numeric>GST</Th>
          <Th numeric>Total</Th>
        </Tr>
      </THead>
      <TBody>
        {entries.map((e) => (
          <Tr key={e.id} data-testid="ledger-row">
            <Td className="whitespace-nowrap">{formatCalendarDay(e.incurredOn)}</Td>
            {showVehicle && (
              <Td className="whitespace-nowrap">
                {e.vehicleId && e.fleetNumber ? (
                  <Link href={`/vehicles/${e.vehicleId}/costs`} className="font-semibold text-accent underline-offset-4 hover:underline">
                    {e.fleetNumber}
                  </Link>
                ) : (
                  <span className="text-muted">None</span>
                )}
              </Td>
            )}
            <Td className="whitespace-nowrap">
              {e.costCentre}
              <span className="block text-xs text-muted">{e.depotName ?? "No depot"}</span>
            </Td>
            <Td>
              {CATEGORY_LABELS[e.category]}
              <span className="block text-xs text-muted">{KIND_LABELS[e.kind]}</span>
            </Td>
            <Td className="min-w-48">
              {e.description}
              {e.reference && <span className="block text-xs text-muted">Ref. {e.reference}</span>}
            </Td>
            <Td className="whitespace-nowrap">{e.source === "job" && e.jobNumber ? `Job ${e.jobNumber}` : SOURCE_LABELS[e.source]}</Td>
            <Td numeric>{dollarsOf(e.amountExGstCents)}</Td>
            <Td numeric>{dollarsOf(e.gstCents)}</Td>
            <Td numeric className="font-semibold">
              {dollarsOf(e.amountExGstCents + e.gstCents)}
            </Td>
          </Tr>
        ))}
      </TBody>
    </Table>
  );
}
