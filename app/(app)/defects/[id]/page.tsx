import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { DefectStatePill, SeverityPill } from "@/components/defects/defect-pills";
import { ReturnToServicePanel, TriagePanel } from "@/components/defects/triage-panel";
import { Card, CardBody, CardHeader, PageHeader } from "@/components/ui";
import { db } from "@/db/client";
import { countDefects } from "@/db/defects";
import { getDefect } from "@/lib/commands/defects";
import { CATEGORY_LABELS, SEVERITY_LABELS, STATE_HINTS, categoryLabel, defectTitle, isCategory } from "@/lib/defects";
import { AppError } from "@/lib/server/errors";
import { requirePermission } from "@/lib/server/guard";
import { execute } from "@/lib/server/operation";
import { Instant } from "@/components/providers/time-zone";

export const metadata: Metadata = { title: "Defect" };

export default async function DefectDetailPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const user = await requirePermission("read", "Defect");
  const found = await execute(getDefect, user, { id }).catch((error: unknown) => {
    if (error instanceof AppError && (error.code === "not_found" || error.code === "validation_failed")) notFound();
    throw error;
  });
  const { defect } = found;
  const isDriver = user.role === "driver";
  const vehicleHref = isDriver ? `/drive/${defect.vehicleId}` : `/vehicles/${defect.vehicleId}/defects`;
  const canGround = user.ability.can("update", "Grounding");
  const openStops = canGround && found.vehicleState === "grounded" ? await countDefects(db(), user, { vehicleId: defect.vehicleId, severity: "stop", states: ["reported", "triaged", "in_repair"] }) : 0;
  const canReadJobs = user.ability.can("read", "Job") && !isDriver;
  const facts: [string, React.ReactNode][] = [
    ["Vehicle", <Link key="v" href={vehicleHref} className="font-semibold text-accent underline underline-offset-4">{found.fleetNumber}{found.registration ? ` · ${found.registration}` : ""}</Link>],
    ["How bad", SEVERITY_LABELS[defect.severity]],
    ["About", isCategory(defect.category) ? CATEGORY_LABELS[defect.category] : categoryLabel(defect.category)],
    ["Reported by", <span key="r">{found.reporterName ?? "Unknown"} · <Instant at={defect.createdAt} /></span>],
    ["Odometer", defect.odometerKm !== null ? `${defect.odometerKm.toLocaleString("en-AU")} km` : "Not given"],
    ["Location", defect.latitude !== null && defect.longitude !== null ? `${defect.latitude.toFixed(5)}, ${defect.longitude.toFixed(5)}` : "Not given"],
  ];
  if (found.jobNumber !== null && defect.jobId) {
    facts.push([
      "Repair job",
      canReadJobs ? (
        <Link key="j" href={`/jobs/${defect.jobId}`} className="font-semibold text-accent underline underline-offset-4">
          Job {found.jobNumber} · {found.jobTitle} ({(found.jobState ?? "").replace("_", " ")})
        </Link>
      ) : (
        `Job ${found.jobNumber} · ${(found.jobState ?? "").replace("_", " ")}`
      ),
    ]);
  }
  if (defect.closeReason) facts.push(["Closed because", defect.closeReason]);
  if (found.mergedInto) {
    facts.push([
      "Merged into",
      <Link key="m" href={`/defects/${found.mergedInto.id}`} className="font-semibold text-accent underline underline-offset-4">
        {defectTitle(found.mergedInto.category, found.mergedInto.description)}
      </Link>,
    ]);
  }
  const raiseJobHref = user.ability.can("manage", "Job") ? `/jobs/new?vehicleId=${encodeURIComponent(defect.vehicleId)}&defectId=${encodeURIComponent(defect.id)}` : null;
  return (
    <div className={isDriver ? "mx-auto flex w-full max-w-xl flex-col gap-5 text-base" : "flex flex-col gap-6"}>
      <PageHeader
        eyebrow={isDriver ? <Link href="/drive" className="underline underline-offset-4">My vehicles</Link> : <Link href="/defects" className="underline underline-offset-4">Defects</Link>}
        title={defectTitle(defect.category, defect.description, 70)}
        question={isDriver ? "Where does my report stand?" : "What should happen to this report?"}
        actions={
          <span className="flex flex-wrap gap-2">
            <SeverityPill severity={defect.severity} size="lg" />
            <DefectStatePill state={defect.state} size="lg" />
          </span>
        }
      />
      {isDriver && (
        <p className="text-lg font-semibold" data-testid="defect-state-hint">
          {STATE_HINTS[defect.state]}
        </p>
      )}
      {found.vehicleState === "grounded" && (
        <p className="rounded-lg border-l-8 border-danger bg-danger-soft px-4 py-3 font-semibold text-danger-ink" data-testid="vehicle-grounded">
          {found.fleetNumber} is grounded{found.groundedReason ? `: ${found.groundedReason}` : "."}
        </p>
      )}
      <div className={isDriver ? "flex flex-col gap-5" : "grid grid-cols-1 gap-6 lg:grid-cols-[3fr_2fr]"}>
        <div className="flex flex-col gap-6">
          <Card>
            <CardHeader title="The report" />
            <CardBody className="flex flex-col gap-4">
              <p className="whitespace-pre-wrap text-base">{defect.description}</p>
              <dl className="grid grid-cols-1 gap-x-8 gap-y-3 sm:grid-cols-2">
                {facts.map(([label, value]) => (
                  <div key={label} className="flex flex-col">
                    <dt className="text-sm text-muted">{label}</dt>
                    <dd className="font-medium">{value}</dd>
                  </div>
                ))}
              </dl>
            </CardBody>
          </Card>
          <Card>
            <CardHeader title="Photos" description={found.photos.length === 0 ? "No photo with this report" : `${found.photos.length} from the phone, without the camera's location data`} />
            {found.photos.length > 0 && (
              <CardBody>
                <ul className="grid grid-cols-2 gap-3 sm:grid-cols-3">
                  {found.photos.map((p, i) => (
                    <li key={p.id}>
                      <a href={`/api/defects/${defect.id}/photos/${p.id}`} target="_blank" rel="noreferrer">
                        {/* Served by our own route with its access check; not optimised by next/image. */}
                        {/* eslint-disable-next-line @next/next/no-img-element */}
                        <img src={`/api/defects/${defect.id}/photos/${p.id}`} alt={`Photo ${i + 1} of the defect`} className="aspect-[4/3] w-full rounded-md border border-line object-cover" />
                      </a>
                    </li>
                  ))}
                </ul>
              </CardBody>
            )}
          </Card>
          {found.mergedIn.length > 0 && (
            <Card>
              <CardHeader title="Reports merged into this one" />
              <CardBody>
                <ul className="flex flex-col gap-2">
                  {found.mergedIn.map((m) => (
                    <li key={m.id}>
                      <Link href={`/defects/${m.id}`} className="text-accent underline underline-offset-4">
                        {defectTitle(m.category, m.description)}
                      </Link>{" "}
                      <span className="text-sm text-muted">· <Instant at={m.createdAt} /></span>
                    </li>
                  ))}
                </ul>
              </CardBody>
            </Card>
          )}
        </div>
        <div className="flex flex-col gap-6">
          <TriagePanel defect={{ id: defect.id, version: defect.version, vehicleId: defect.vehicleId }} moves={found.moves} candidates={found.mergeCandidates} jobs={found.linkableJobs} raiseJobHref={raiseJobHref} />
          {canGround && found.vehicleState === "grounded" && <ReturnToServicePanel vehicleId={defect.vehicleId} fleetNumber={found.fleetNumber} defectId={defect.id} openStopDefects={openStops} />}
        </div>
      </div>
    </div>
  );
}
