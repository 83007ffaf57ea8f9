import type { Metadata } from "next";
import Link from "next/link";
import { dollars } from "@/components/standards/labels";
import { Card, CardBody, CardHeader, EmptyState, PageHeader, Quantity, StatusPill, Table, TBody, Td, Th, THead, Tr } from "@/components/ui";
import { LINE_STATUS_TONES, LINE_STATUS_WORDS, VEHICLE_VARIANCE_TONES, VEHICLE_VARIANCE_WORDS } from "@/components/variance/line-status";
import { percent, ShareTable } from "@/components/variance/share-table";
import { getFleetVariance } from "@/lib/commands/variance";
import { requirePermission } from "@/lib/server/guard";
import { execute } from "@/lib/server/operation";

export const metadata: Metadata = { title: "Variance" };

export default async function FleetVariancePage() {
  const user = await requirePermission("read", "Variance");
  const fleet = await execute(getFleetVariance, user, {});
  const mine = user.role === "driver" || user.role === "contractor";
  const { overall, statusCounts, vehicleStatusCounts } = fleet;
  const desk = !mine;
  const lineCounts: [keyof typeof LINE_STATUS_WORDS, number][] = [
    ["short", statusCounts.short],
    ["off_spec", statusCounts.offSpec],
    ["unproven", statusCounts.unproven],
    ["prohibited_fitted", statusCounts.prohibitedFitted],
    ["concession", statusCounts.concession],
    ["meets", statusCounts.meets],
  ];
  return (
    <div className="flex flex-col gap-6">
      <PageHeader
        title={mine ? "Variance of my vehicles" : "Fleet variance"}
        question={mine ? "Are the vehicles in my care fitted to their standard?" : "How much of the fleet fully meets its standard, and what would closing the gaps cost?"}
        actions={
          desk ? (
            <Link href="/vehicles?variance=gaps" className="font-semibold text-accent underline-offset-4 hover:underline">
              Open the vehicles with gaps in the register
            </Link>
          ) : undefined
        }
      />
      {overall.vehicles === 0 ? (
        <EmptyState title="No vehicles to show">{mine ? "No vehicle is assigned to you yet." : "Add vehicles to the register first."}</EmptyState>
      ) : (
        <>
          <div className="grid grid-cols-1 gap-4 md:grid-cols-4">
            <Card className="md:col-span-1">
              <CardBody className="flex flex-col gap-1">
                <p className="text-sm font-semibold text-muted">Fully meeting their standard</p>
                <p className="text-4xl font-bold tabular-nums" data-testid="share-overall">
                  {percent(overall.shareFullyMeeting)}
                </p>
                <p className="text-sm text-muted">
                  {overall.fullyMeeting} of {overall.withEdition} vehicles with a standard
                  {overall.noEdition > 0 ? `; ${overall.noEdition} have none assigned` : ""}
                </p>
              </CardBody>
            </Card>
            {desk && (
              <Card className="md:col-span-1">
                <CardBody className="flex flex-col gap-1">
                  <p className="text-sm font-semibold text-muted">To close every gap</p>
                  <p className="text-3xl font-bold tabular-nums">{dollars(overall.costToCloseCents)}</p>
                  <p className="text-sm text-muted">
                    at standard cost, adding about <Quantity value={overall.massToCloseKg} unit="kg" /> of fitted mass across the fleet
                  </p>
                </CardBody>
              </Card>
            )}
            <Card className={desk ? "md:col-span-2" : "md:col-span-3"}>
              <CardHeader title="Vehicles and lines by status" as="h2" />
              <CardBody className="flex flex-col gap-3">
                <ul className="flex flex-wrap gap-2" data-testid="vehicle-status-counts">
                  {(Object.keys(VEHICLE_VARIANCE_WORDS) as (keyof typeof VEHICLE_VARIANCE_WORDS)[]).map((s) => (
                    <li key={s}>
                      <StatusPill tone={VEHICLE_VARIANCE_TONES[s]}>
                        {VEHICLE_VARIANCE_WORDS[s]}: {vehicleStatusCounts[s]}
                      </StatusPill>
                    </li>
                  ))}
                </ul>
                <ul className="flex flex-wrap gap-2" data-testid="line-status-counts">
                  {lineCounts.map(([s, n]) => (
                    <li key={s}>
                      <StatusPill tone={LINE_STATUS_TONES[s]} size="sm">
                        {LINE_STATUS_WORDS[s]} lines: {n}
                      </StatusPill>
                    </li>
                  ))}
                  <li>
                    <StatusPill tone="neutral" size="sm">
                      Extras: {statusCounts.extra}
                    </StatusPill>
                  </li>
                </ul>
              </CardBody>
            </Card>
          </div>

          {desk && (
            <>
              <section className="flex flex-col gap-2">
                <h2 className="text-lg font-semibold">By depot</h2>
                <ShareTable label="Variance by depot" groupLabel="Depot" registerParam="depotId" rows={fleet.byDepot.map((d) => ({ ...d, id: d.depotId }))} />
              </section>
              <section className="flex flex-col gap-2">
                <h2 className="text-lg font-semibold">By platform</h2>
                <ShareTable label="Variance by platform" groupLabel="Platform" registerParam="platformId" rows={fleet.byPlatform.map((p) => ({ ...p, id: p.platformId }))} />
              </section>
            </>
          )}

          <section className="flex flex-col gap-2">
            <h2 className="text-lg font-semibold">Vehicles with gaps ({fleet.vehiclesWithGaps.length})</h2>
            {fleet.vehiclesWithGaps.length === 0 ? (
              <p className="text-muted">Every vehicle with a standard meets it.</p>
            ) : (
              <Table label="Vehicles with gaps">
                <THead>
                  <Tr>
                    <Th>Vehicle</Th>
                    <Th>Depot</Th>
                    <Th numeric>Short</Th>
                    <Th numeric>Off-spec</Th>
                    <Th numeric>Unproven</Th>
                    <Th numeric>Prohibited</Th>
                    {desk && <Th numeric>Cost to close</Th>}
                    {desk && <Th numeric>Mass to close</Th>}
                  </Tr>
                </THead>
                <TBody>
                  {fleet.vehiclesWithGaps.map((v) => (
                    <Tr key={v.vehicleId}>
                      <Td>
                        <Link href={`/vehicles/${v.vehicleId}/spec`} className="font-semibold text-accent underline-offset-4 hover:underline">
                          {v.fleetNumber}
                        </Link>
                      </Td>
                      <Td>{v.depotName ?? "—"}</Td>
                      <Td numeric>{v.summary.short}</Td>
                      <Td numeric>{v.summary.offSpec}</Td>
                      <Td numeric>{v.summary.unproven}</Td>
                      <Td numeric>{v.summary.prohibitedFitted}</Td>
                      {desk && <Td numeric>{dollars(v.costToCloseCents)}</Td>}
                      {desk && (
                        <Td numeric>
                          <Quantity value={v.massToCloseKg} unit="kg" digits={1} />
                        </Td>
                      )}
                    </Tr>
                  ))}
                </TBody>
              </Table>
            )}
          </section>
        </>
      )}
    </div>
  );
}
