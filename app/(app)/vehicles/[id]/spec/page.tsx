import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { ConcessionForm, EndConcessionButton } from "@/components/fitments/concession-form";
import { FitmentForm } from "@/components/fitments/fitment-form";
import { FitmentsTable } from "@/components/fitments/fitments-table";
import { Caution, Card, CardBody, CardHeader, EmptyState, Table, TBody, Td, Th, THead, Tr } from "@/components/ui";
import { VehicleVariancePill } from "@/components/variance/line-status";
import { BuildOrderCard, CloseFigures, VarianceLinesList, VarianceLinesTable, VarianceSummaryCounts } from "@/components/variance/spec-view";
import { db } from "@/db/client";
import { loadEditionLines } from "@/db/standards";
import { listFitments } from "@/lib/commands/fitments";
import { getVehicleVariance, isDone } from "@/lib/commands/variance";
import { AppError } from "@/lib/server/errors";
import { requirePermission } from "@/lib/server/guard";
import { execute } from "@/lib/server/operation";
import { formatCalendarDay } from "@/lib/format/dates";

export const metadata: Metadata = { title: "Spec check" };

const DAY_MS = 86_400_000;
const isoDay = (d: Date) => d.toISOString().slice(0, 10);

export default async function SpecCheckPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const user = await requirePermission("read", "Variance");
  const view = await execute(getVehicleVariance, user, { vehicleId: id }).catch((error: unknown) => {
    if (error instanceof AppError && (error.code === "not_found" || error.code === "validation_failed")) notFound();
    throw error;
  });
  const canReadFitments = user.ability.can("read", "Fitment");
  const canManage = user.ability.can("manage", "Fitment");
  const deskRole = user.role === "admin" || user.role === "manager" || user.role === "finance";
  const fitted = canReadFitments ? await execute(listFitments, user, { vehicleId: id }) : null;
  const editionLines = view.editionId && canReadFitments ? await loadEditionLines(db(), view.editionId) : [];
  const now = new Date();
  const statusOf = new Map(view.lines.map((l) => [l.key, l]));
  const codeOfKey = new Map(view.lines.map((l) => [l.key, l.code]));
  const fitmentLines = editionLines.map((l) => ({
    key: l.key,
    code: l.code,
    title: l.title,
    category: l.category,
    requirement: l.requirement,
    quantity: l.quantity,
    criteria: l.criteria,
    expiryMonths: l.expiryMonths,
    statusWord: statusOf.get(l.key)?.statusWord ?? "",
  }));
  const attributeLabels = new Map(editionLines.flatMap((l) => l.criteria.map((c) => [c.attribute, c.unit ? `${c.label ?? c.attribute} (${c.unit})` : (c.label ?? c.attribute)] as const)));
  const gapLines = view.lines.filter((l) => !isDone(l.status)).map((l) => ({ key: l.key, code: l.code, title: l.title, statusWord: l.statusWord }));

  return (
    <div className="flex flex-col gap-6">
      <Card>
        <CardHeader
          title={
            view.edition ? (
              <span>
                Against{" "}
                {deskRole ? (
                  <Link href={`/standards/${view.edition.standardId}/editions/${view.edition.id}`} className="text-accent underline-offset-4 hover:underline">
                    {view.edition.standardName}, edition {view.edition.number}
                  </Link>
                ) : (
                  `${view.edition.standardName}, edition ${view.edition.number}`
                )}
              </span>
            ) : (
              "No standard assigned"
            )
          }
          description={view.edition ? "Each line of the edition, what is fitted against it and what is left to do." : undefined}
          actions={<VehicleVariancePill status={view.status} size={deskRole ? "md" : "lg"} />}
        />
        <CardBody className="flex flex-col gap-4">
          {view.summary ? (
            <>
              <VarianceSummaryCounts view={view} />
              {deskRole && <CloseFigures view={view} />}
            </>
          ) : (
            <EmptyState title="This vehicle has no fit-out standard">
              {user.ability.can("manage", "Standard") ? (
                <>
                  Roll a published edition out to it from{" "}
                  <Link href="/standards" className="font-semibold text-accent underline">
                    Standards
                  </Link>
                  .
                </>
              ) : (
                "A fleet manager assigns the standard it must meet."
              )}
            </EmptyState>
          )}
          <Caution text="Spec check compares records with the standard. Tyres, lift and mass changes are checked under local rules by an authorised vehicle engineer; weigh the fitted vehicle on a certified weighbridge." />
        </CardBody>
      </Card>

      {view.lines.length > 0 && (deskRole ? <VarianceLinesTable view={view} /> : <VarianceLinesList view={view} />)}
      {view.buildOrder.length > 0 && user.role !== "driver" && <BuildOrderCard view={view} />}

      {view.extras.length > 0 && (
        <Card>
          <CardHeader title={`Extras (${view.extras.length})`} description="Fitted, but not asked for by the standard. Their mass still counts against payload." />
          <CardBody>
            <ul className="list-disc pl-5" data-testid="extras">
              {view.extras.map((e) => (
                <li key={e.fitmentId}>{e.label}</li>
              ))}
            </ul>
          </CardBody>
        </Card>
      )}

      {fitted && (
        <Card>
          <CardHeader title="Fitted items" description="Each item answers a line of the standard by its key, so it still counts when a new edition is rolled out." />
          <CardBody className="flex flex-col gap-6">
            <FitmentsTable items={fitted.items} codeOfKey={codeOfKey} attributeLabels={attributeLabels} canManage={canManage} now={now} />
            {canManage && (
              <div className="border-t border-line pt-4">
                <h3 className="mb-3 text-base font-semibold">Record a fitment</h3>
                <FitmentForm vehicleId={id} lines={fitmentLines} today={isoDay(now)} />
              </div>
            )}
          </CardBody>
        </Card>
      )}

      {fitted && (view.editionId || fitted.concessions.length > 0) && (
        <Card>
          <CardHeader title="Concessions" description="A manager's reasoned exception to one line, until it ends. A lapsed concession covers nothing." />
          <CardBody className="flex flex-col gap-4">
            {fitted.concessions.length === 0 ? (
              <p className="text-muted">No concessions on this vehicle.</p>
            ) : (
              <Table label="Concessions">
                <THead>
                  <Tr>
                    <Th>Line</Th>
                    <Th>Reason</Th>
                    <Th>Until</Th>
                    <Th>Approved by</Th>
                    {canManage && <Th className="text-right">End</Th>}
                  </Tr>
                </THead>
                <TBody>
                  {fitted.concessions.map((c) => {
                    const current = c.expiresAt.getTime() > now.getTime();
                    return (
                      <Tr key={c.id}>
                        <Td className="font-semibold">{codeOfKey.get(c.lineKey) ?? c.lineKey}</Td>
                        <Td>{c.reason}</Td>
                        <Td className="whitespace-nowrap">
                          {formatCalendarDay(c.expiresAt)}
                          {!current && <span className="text-muted"> (ended)</span>}
                        </Td>
                        <Td>{c.approvedByName ?? "—"}</Td>
                        {canManage && <Td>{current && <EndConcessionButton concessionId={c.id} />}</Td>}
                      </Tr>
                    );
                  })}
                </TBody>
              </Table>
            )}
            {canManage && gapLines.length > 0 && (
              <div className="border-t border-line pt-4">
                <h3 className="mb-3 text-base font-semibold">Grant a concession</h3>
                <ConcessionForm vehicleId={id} lines={gapLines} defaultExpiry={isoDay(new Date(now.getTime() + 60 * DAY_MS))} />
              </div>
            )}
          </CardBody>
        </Card>
      )}
    </div>
  );
}
