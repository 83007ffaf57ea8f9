import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { EvidenceReview } from "@/components/evidence/evidence-review";
import { EvidenceUpload } from "@/components/evidence/evidence-upload";
import { ActionForm } from "@/components/jobs/action-form";
import { OfferForm } from "@/components/jobs/offer-form";
import { dateInputValue, JobStatePill, LineStatusPill, QuoteStatePill } from "@/components/jobs/status";
import { QuoteCompare } from "@/components/quotes/quote-compare";
import { Card, CardBody, CardHeader, Caution, EmptyState, PageHeader, Quantity, Table, TBody, Td, Th, THead, Tr } from "@/components/ui";
import { db } from "@/db/client";
import { contractorFirms } from "@/db/schema";
import { getJob } from "@/lib/commands/jobs";
import { formatCents } from "@/lib/money";
import { AppError } from "@/lib/server/errors";
import { requirePermission } from "@/lib/server/guard";
import { execute } from "@/lib/server/operation";
import { and, asc, eq } from "drizzle-orm";
import { cancelJobAction, closeJobAction, progressJobAction, signOffJobAction } from "../actions";
import { startQuoteAction } from "../../quotes/actions";
import { formatCalendarDay } from "@/lib/format/dates";

export const metadata: Metadata = { title: "Job" };

export default async function JobPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const user = await requirePermission("read", "Job");
  const detail = await execute(getJob, user, { id }).catch((error: unknown) => {
    if (error instanceof AppError && (error.code === "not_found" || error.code === "validation_failed")) notFound();
    throw error;
  });
  const { job, vehicle, lines, offers, quotes, evidence } = detail;
  const isManager = user.ability.can("manage", "Job");
  const isContractor = user.role === "contractor";
  const awardedToMe = isContractor && job.awardedFirmId === user.firmId;
  const myQuote = isContractor ? quotes.find((q) => q.firmId === user.firmId && q.status !== "withdrawn") ?? quotes.find((q) => q.firmId === user.firmId) : undefined;
  const firms = isManager
    ? await db().select({ id: contractorFirms.id, name: contractorFirms.name }).from(contractorFirms).where(and(eq(contractorFirms.orgId, user.orgId), eq(contractorFirms.active, true))).orderBy(asc(contractorFirms.name))
    : [];
  const specLines = lines.filter((l) => l.lineKey && l.spec);
  const canLodge = awardedToMe && ["awarded", "in_workshop", "evidence_lodged"].includes(job.state);

  return (
    <div className="flex flex-col gap-6">
      <PageHeader
        eyebrow={
          <Link href={isContractor ? "/jobs" : `/vehicles/${vehicle.id}/jobs`} className="hover:underline">
            {vehicle.fleetNumber} · {vehicle.make} {vehicle.model} {vehicle.variant}
          </Link>
        }
        title={`Job ${job.number}: ${job.title}`}
        question={isContractor ? "What is asked of our workshop, and what must we prove?" : "What does this job still need, and who should do it?"}
        actions={<JobStatePill state={job.state} size="lg" />}
      />

      <div className="grid grid-cols-1 gap-6 lg:grid-cols-3">
        <Card className="lg:col-span-2">
          <CardHeader
            title="Work"
            description={
              job.dueAt ? (
                <span className={job.overdue ? "font-semibold text-danger" : undefined}>
                  Wanted by {formatCalendarDay(job.dueAt)}
                  {job.overdue ? " — overdue" : ""}
                </span>
              ) : (
                "No due date"
              )
            }
          />
          <CardBody className="flex flex-col gap-3">
            <Table label="Lines of this job in build order" density="compact">
              <THead>
                <Tr>
                  <Th>Line</Th>
                  <Th>Now</Th>
                  <Th numeric>Stage</Th>
                  <Th>Waits for</Th>
                  {!isContractor && <Th numeric>Standard cost</Th>}
                </Tr>
              </THead>
              <TBody>
                {lines.map((l) => (
                  <Tr key={l.id} data-testid="job-line">
                    <Td>{l.description}</Td>
                    <Td>{l.spec ? <LineStatusPill status={l.spec.status} /> : <span className="text-muted">Free-text work</span>}</Td>
                    <Td numeric>{l.stage === null ? "—" : l.stage + 1}</Td>
                    <Td>
                      {l.awardBlockedBy.length > 0 ? (
                        <span className="text-warn-ink" data-testid="line-blocked">
                          Blocked:{" "}
                          {l.awardBlockedBy.map((b) => `${b.label}${b.reason === "awaiting-sign-off" ? " (engineering sign-off first)" : " (add it to this job)"}`).join(", ")}
                        </span>
                      ) : l.blockedBy.length > 0 ? (
                        <span className="text-muted">After {l.blockedBy.join(", ")} (in this job)</span>
                      ) : (
                        <span className="text-muted">Can start now</span>
                      )}
                    </Td>
                    {!isContractor && <Td numeric>{l.spec ? formatCents(l.spec.standardCostCents) : "—"}</Td>}
                  </Tr>
                ))}
              </TBody>
            </Table>
            {!detail.canAwardLines && (
              <p className="text-sm font-semibold text-warn-ink" data-testid="award-blocked">
                Some lines wait on work outside this job: the job cannot be awarded until their prerequisites are met or added.
              </p>
            )}
            {job.state === "cancelled" && job.cancelReason && <p className="text-danger">Cancelled: {job.cancelReason}</p>}
          </CardBody>
        </Card>

        <Card>
          <CardHeader title="Vehicle" />
          <CardBody>
            <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-sm">
              <dt className="text-muted">Fleet number</dt>
              <dd>{vehicle.fleetNumber}</dd>
              <dt className="text-muted">Registration</dt>
              <dd>{vehicle.registration ?? "—"}</dd>
              <dt className="text-muted">VIN</dt>
              <dd className="font-mono text-xs">{vehicle.vin ?? "—"}</dd>
              <dt className="text-muted">Depot</dt>
              <dd>{vehicle.depotName ?? "—"}</dd>
              <dt className="text-muted">Odometer</dt>
              <dd>{vehicle.odometerKm === null ? "—" : <Quantity value={vehicle.odometerKm} unit="km" digits={0} />}</dd>
              <dt className="text-muted">Standard tyres</dt>
              <dd>{vehicle.standardTyreSize ?? "—"}</dd>
              <dt className="text-muted">GVM</dt>
              <dd>{vehicle.gvmKg === null ? "—" : <Quantity value={vehicle.gvmKg} unit="kg" digits={0} />}</dd>
              <dt className="text-muted">Last weighed</dt>
              <dd data-testid="measured-mass">
                {vehicle.measuredGrossKg === null ? (
                  "Not yet"
                ) : (
                  <>
                    <Quantity value={vehicle.measuredGrossKg} unit="kg" digits={0} /> gross ({vehicle.measuredFrontKg} front, {vehicle.measuredRearKg} rear) on {formatCalendarDay(vehicle.measuredAt)}
                  </>
                )}
              </dd>
            </dl>
          </CardBody>
        </Card>
      </div>

      {isManager && (
        <Card>
          <CardHeader title="Workshops asked" description={offers.length ? `${offers.length} ${offers.length === 1 ? "workshop" : "workshops"} asked for a quote` : "Not offered yet"} />
          <CardBody className="flex flex-col gap-4">
            {offers.length > 0 && (
              <ul className="text-sm">
                {offers.map((o) => (
                  <li key={o.firmId}>
                    {o.firmName} — quotes due {formatCalendarDay(o.dueAt)}
                  </li>
                ))}
              </ul>
            )}
            {(job.state === "open" || job.state === "quoting") && (
              <OfferForm jobId={job.id} dueAt={dateInputValue(job.dueAt)} firms={firms.map((f) => ({ ...f, offered: offers.some((o) => o.firmId === f.id) }))} />
            )}
          </CardBody>
        </Card>
      )}

      {!isContractor && user.ability.can("read", "Quote") && (
        <Card>
          <CardHeader title="Quotes compared" description="Per spec line against its standard cost, with totals incl. GST and how long each quote holds" />
          <CardBody>
            {quotes.length === 0 ? (
              <EmptyState title="No quotes yet">The workshops asked have not quoted yet.</EmptyState>
            ) : (
              <QuoteCompare
                jobId={job.id}
                jobState={job.state}
                canDecide={user.ability.can("decide", "QuoteDecision")}
                specLines={specLines.map((l) => ({ lineKey: l.lineKey!, description: l.description, standardCostCents: l.spec!.standardCostCents }))}
                quotes={quotes.map((q) => ({
                  id: q.id,
                  firmName: q.firmName,
                  status: q.status,
                  revision: q.revision,
                  version: q.version,
                  validUntil: q.validUntil ? q.validUntil.toISOString() : null,
                  expired: q.expired,
                  subtotalCents: q.subtotalCents,
                  gstCents: q.gstCents,
                  totalCents: q.totalCents,
                  byLine: Object.fromEntries(specLines.map((l) => [l.lineKey!, q.lines.filter((x) => x.lineKey === l.lineKey).reduce((n, x) => n + x.amountCents, 0)])),
                  otherCents: q.lines.filter((x) => !x.lineKey || !specLines.some((l) => l.lineKey === x.lineKey)).reduce((n, x) => n + x.amountCents, 0),
                  lastReason: q.decisions.at(-1)?.reason ?? null,
                }))}
              />
            )}
          </CardBody>
        </Card>
      )}

      {isContractor && (
        <Card>
          <CardHeader title="Your quote" />
          <CardBody className="flex flex-col gap-3">
            {myQuote ? (
              <div className="flex flex-wrap items-center gap-4">
                <QuoteStatePill state={myQuote.status} size="lg" />
                <span className="tabular-nums">{formatCents(myQuote.totalCents)} incl. GST</span>
                <Link href={`/quotes/${myQuote.id}`} className="font-semibold text-accent underline" data-testid="open-my-quote">
                  {myQuote.status === "draft" || myQuote.status === "returned" ? "Open and edit the quote" : "Open the quote"}
                </Link>
              </div>
            ) : job.state === "quoting" ? (
              <ActionForm action={startQuoteAction} hidden={{ jobId: job.id }} label="Start a quote" variant="primary" size="lg" testId="start-quote" />
            ) : (
              <p className="text-muted">This job is not taking quotes.</p>
            )}
          </CardBody>
        </Card>
      )}

      {(canLodge || evidence.length > 0) && (
        <Card>
          <CardHeader title="Evidence" description="Photos, certificates, engineering sign-offs and weighbridge tickets, reviewed line by line" />
          <CardBody className="flex flex-col gap-6">
            <Caution text="A weighbridge ticket records what was weighed on the day; check axle loads and GVM against the maker's ratings and local rules with an authorised vehicle engineer." />
            {evidence.length > 0 && (
              <EvidenceReview
                jobId={job.id}
                canReview={user.ability.can("review", "Evidence") && ["in_workshop", "evidence_lodged"].includes(job.state)}
                items={evidence.map((e) => ({
                  id: e.id,
                  kind: e.kind,
                  status: e.status,
                  filename: e.filename,
                  contentType: e.contentType,
                  sizeBytes: e.sizeBytes,
                  sha256: e.sha256,
                  line: lines.find((l) => l.lineKey && l.lineKey === e.lineKey)?.description ?? "Whole job",
                  uploadedBy: e.uploadedByName ?? "",
                  createdAt: e.createdAt.toISOString(),
                  reviewReason: e.reviewReason,
                  ticket: e.ticket ? { ticketNumber: e.ticket.ticketNumber, frontKg: e.ticket.frontKg, rearKg: e.ticket.rearKg, grossKg: e.ticket.grossKg } : null,
                }))}
              />
            )}
            {canLodge && (
              <div className="flex flex-col gap-2">
                <h3 className="font-semibold">Lodge evidence</h3>
                <EvidenceUpload
                  jobId={job.id}
                  lines={specLines.map((l) => ({ lineKey: l.lineKey!, description: l.description, criteria: l.spec!.criteria, evidenceNeeded: l.spec!.evidenceNeeded }))}
                />
              </div>
            )}
          </CardBody>
        </Card>
      )}

      {(isManager || awardedToMe) && <JobMoves jobId={job.id} state={job.state} isManager={isManager} awardedToMe={awardedToMe} version={job.version} />}
    </div>
  );
}

function JobMoves({ jobId, state, isManager, awardedToMe, version }: { jobId: string; state: string; isManager: boolean; awardedToMe: boolean; version: number }) {
  const moves = [
    awardedToMe && state === "awarded" && <ActionForm key="start" action={progressJobAction} hidden={{ id: jobId, to: "in_workshop" }} label="Start the work" variant="primary" size="lg" testId="start-work" />,
    awardedToMe && state === "in_workshop" && <ActionForm key="done" action={progressJobAction} hidden={{ id: jobId, to: "evidence_lodged" }} label="Work done: evidence is lodged" variant="primary" size="lg" testId="evidence-done" />,
    isManager && state === "evidence_lodged" && <ActionForm key="sign" action={signOffJobAction} hidden={{ id: jobId, version }} label="Sign off and book the cost" variant="primary" testId="sign-off" />,
    isManager && state === "signed_off" && <ActionForm key="close" action={closeJobAction} hidden={{ id: jobId }} label="Close the job" testId="close-job" />,
    isManager && ["open", "quoting", "awarded"].includes(state) && (
      <ActionForm key="cancel" action={cancelJobAction} hidden={{ id: jobId }} label="Cancel the job" variant="danger" reason={{ label: "Reason for cancelling", required: true }} testId="cancel-job" />
    ),
  ].filter(Boolean);
  if (moves.length === 0) return null;
  return (
    <Card>
      <CardHeader title="Next step" />
      <CardBody className="grid grid-cols-1 gap-6 md:grid-cols-2">{moves}</CardBody>
    </Card>
  );
}
