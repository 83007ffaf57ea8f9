import type { Metadata } from "next";
import { DefectTable } from "@/components/defects/defect-table";
import { VehicleReadinessPanel } from "@/components/readiness";
import { Card, CardBody, CardHeader, TBody, Table, Td, Th, THead, Tr } from "@/components/ui";
import { db } from "@/db/client";
import { listChecks, listDefects } from "@/db/defects";
import { requirePermission } from "@/lib/server/guard";
import { Instant } from "@/components/providers/time-zone";

export const metadata: Metadata = { title: "Vehicle defects" };

/** The vehicle's defects (each role sees those it may) and, for managers, its recent checks. */
export default async function VehicleDefectsPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  // The layout above has already answered 404 for a vehicle this user may not see.
  const user = await requirePermission("read", "Defect");
  const [open, past] = await Promise.all([
    listDefects(db(), user, { vehicleId: id, states: ["reported", "triaged", "in_repair"], limit: 100 }),
    listDefects(db(), user, { vehicleId: id, states: ["resolved", "closed", "merged"], limit: 50 }),
  ]);
  const canReadChecks = user.ability.can("read", "PreTripCheck");
  const checks = canReadChecks ? await listChecks(db(), user, { vehicleId: id, limit: 10 }) : [];
  return (
    <div className="flex flex-col gap-6">
      {user.ability.can("read", "Variance") && <VehicleReadinessPanel actor={user} vehicleId={id} />}
      <Card>
        <CardHeader title="Open defects" description="Reported, triaged or in repair: these count against the vehicle's readiness." />
        <CardBody>
          <DefectTable rows={open} empty="No open defect on this vehicle." showVehicle={false} compactEmpty />
        </CardBody>
      </Card>
      <Card>
        <CardHeader title="Resolved, closed and merged" />
        <CardBody>
          <DefectTable rows={past} empty="None yet." showVehicle={false} compactEmpty />
        </CardBody>
      </Card>
      {canReadChecks && (
        <Card>
          <CardHeader title="Recent pre-trip checks" />
          <CardBody>
            {checks.length === 0 ? (
              <p className="text-sm text-muted">No pre-trip check yet.</p>
            ) : (
              <Table label="Pre-trip checks">
                <THead>
                  <Tr>
                    <Th>Done</Th>
                    <Th>Driver</Th>
                    <Th numeric>Items</Th>
                    <Th numeric>Faults</Th>
                    <Th>Faults found</Th>
                  </Tr>
                </THead>
                <TBody>
                  {checks.map((c) => (
                    <Tr key={c.id}>
                      <Td className="whitespace-nowrap"><Instant at={c.completedAt} /></Td>
                      <Td>{c.driverName ?? "—"}</Td>
                      <Td numeric>{c.items.length}</Td>
                      <Td numeric>{c.faults}</Td>
                      <Td>
                        {c.items
                          .filter((i) => i.result === "fail")
                          .map((i) => `${i.label}${i.note ? `: ${i.note}` : ""}`)
                          .join("; ") || "—"}
                      </Td>
                    </Tr>
                  ))}
                </TBody>
              </Table>
            )}
          </CardBody>
        </Card>
      )}
    </div>
  );
}
