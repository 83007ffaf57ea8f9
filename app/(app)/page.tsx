import type { Metadata } from "next";
import Link from "next/link";
import { Stat } from "@/components/landing/stat";
import { PageHeader, Card, CardBody, CardHeader, EmptyState } from "@/components/ui";
import { VehicleStatePill } from "@/components/vehicles/vehicle-state";
import { db } from "@/db/client";
import { budgetsAgainstActual } from "@/db/costs";
import { listJobRows } from "@/db/jobs";
import { contractorCounts, managerQueues, myOpenDefects, outboxCounts, peopleCounts, quoteCounts, spendSince } from "@/db/landing";
import { fleetReadinessStates, readinessByVehicle, readinessCountsOf } from "@/db/readiness";
import { countVehiclesByState, listVehicleSummaries } from "@/db/vehicles";
import { requireUser } from "@/lib/server/guard";
import type { SignedIn } from "@/lib/server/session";
import { formatCalendarDay } from "@/lib/format/dates";

export const metadata: Metadata = { title: "Home" };

const READINESS_WORDS = { ready: "Ready for remote duty", limited: "Limited: town and graded roads only", not_ready: "Not ready" } as const;

const money = (cents: number) => (cents / 100).toLocaleString("en-AU", { style: "currency", currency: "AUD" });

export default async function HomePage() {
  const user = await requireUser();
  switch (user.role) {
    case "manager":
      return <ManagerHome user={user} />;
    case "admin":
      return <AdminHome user={user} />;
    case "finance":
      return <FinanceHome user={user} />;
    case "contractor":
      return <ContractorHome user={user} />;
    case "driver":
      return <DriverHome user={user} />;
  }
}

async function ManagerHome({ user }: { user: SignedIn }) {
  const now = new Date();
  const [byState, quotesByStatus, queues, states] = await Promise.all([
    countVehiclesByState(db(), user),
    quoteCounts(db(), user),
    managerQueues(db(), user),
    fleetReadinessStates(db(), user, now),
  ]);
  const readiness = readinessCountsOf(states);
  // The states come in brief for the whole fleet; only the vehicles listed are judged in full, for their reasons.
  const notReadyIds = [...states].filter(([, state]) => state === "not_ready").slice(0, 12).map(([id]) => id);
  const judged = await readinessByVehicle(db(), user, notReadyIds, now);
  const notReady = notReadyIds.map((id) => judged.get(id)).filter((v) => v !== undefined);
  return (
    <div className="flex flex-col gap-6">
      <PageHeader title={`Good day, ${user.name.split(" ")[0]}`} question="What needs my decision, and which vehicles are not ready?" />
      <section aria-labelledby="decide-heading" className="flex flex-col gap-3">
        <h2 id="decide-heading" className="text-lg font-bold">Waiting on you</h2>
        <div className="grid grid-cols-2 gap-4 md:grid-cols-4">
          <Stat label="Quotes to decide" value={quotesByStatus.submitted ?? 0} href="/jobs" note="submitted by workshops" />
          <Stat label="Evidence to review" value={queues.evidenceToReview} href="/jobs" note="photos, certificates, tickets" />
          <Stat label="Defects to triage" value={queues.defectsToTriage} href="/defects" note="reported by drivers" />
          <Stat label="Grounded" value={byState.grounded ?? 0} href="/vehicles?state=grounded" note="vehicles off the road" />
        </div>
      </section>
      <section aria-labelledby="ready-heading" className="flex flex-col gap-3">
        <h2 id="ready-heading" className="text-lg font-bold">Trip readiness</h2>
        <div className="grid grid-cols-3 gap-4">
          <Stat label="Ready for remote duty" value={readiness.ready} />
          <Stat label="Limited" value={readiness.limited} note="town and graded roads only" />
          <Stat label="Not ready" value={readiness.notReady} />
        </div>
      </section>
      <Card>
        <CardHeader title="Vehicles not ready" description="The first reason is the one to fix first." />
        <CardBody>
          {notReady.length === 0 ? (
            <p className="text-muted">Every vehicle is ready or limited.</p>
          ) : (
            <ul className="divide-y divide-line">
              {notReady.map((v) => (
                <li key={v.vehicleId} className="flex flex-wrap items-center justify-between gap-2 py-2">
                  <Link href={`/vehicles/${v.vehicleId}`} className="font-semibold text-accent hover:underline">
                    {v.fleetNumber}
                  </Link>
                  <span className="flex-1 text-sm text-muted">{v.reasons[0]?.message}</span>
                  <VehicleStatePill state={v.vehicleState} />
                </li>
              ))}
            </ul>
          )}
        </CardBody>
      </Card>
    </div>
  );
}

async function AdminHome({ user }: { user: SignedIn }) {
  const [people, outbox, byState] = await Promise.all([peopleCounts(db(), user), outboxCounts(db(), user), countVehiclesByState(db(), user)]);
  const vehicles = Object.values(byState).reduce((a, b) => a + (b ?? 0), 0);
  return (
    <div className="flex flex-col gap-6">
      <PageHeader title="Organisation" question="Is everyone set up, and is mail getting through?" />
      <div className="grid grid-cols-2 gap-4 md:grid-cols-4">
        <Stat label="Active people" value={people.active} href="/admin/users" />
        <Stat label="Invitations open" value={people.invited} href="/admin/users" note="not yet accepted" />
        <Stat label="Mail waiting" value={outbox.pending ?? 0} note="in the outbox, retrying" />
        <Stat label="Mail failed" value={outbox.dead ?? 0} note="gave up after every retry" />
      </div>
      <p className="text-muted">
        {vehicles} vehicles in the register. <Link href="/vehicles" className="font-semibold text-accent underline">Open the register</Link>
      </p>
    </div>
  );
}

async function FinanceHome({ user }: { user: SignedIn }) {
  const now = new Date();
  const monthStart = new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth(), 1));
  const [quotesByStatus, spend, budgets] = await Promise.all([
    quoteCounts(db(), user),
    spendSince(db(), user, monthStart),
    budgetsAgainstActual(db(), user, { from: now, to: now }),
  ]);
  const budgeted = budgets.reduce((a, b) => a + b.budgetCents, 0);
  const actual = budgets.reduce((a, b) => a + b.actualCents, 0);
  return (
    <div className="flex flex-col gap-6">
      <PageHeader title="Finance" question="What awaits my approval, and how is spend running?" />
      <div className="grid grid-cols-2 gap-4 md:grid-cols-4">
        <Stat label="Awaiting your approval" value={quotesByStatus.awaiting_finance ?? 0} href="/approvals" note="quotes above the threshold" />
        <Stat label="Booked this month" value={money(spend)} href="/costs" note="excluding GST" />
        <Stat label="Current budgets" value={money(budgeted)} href="/budgets" note={`${budgets.length} cost centres`} />
        <Stat label="Spent against them" value={money(actual)} href="/budgets" note={budgeted > 0 ? `${Math.round((actual / budgeted) * 100)} % of budget` : "no current budget"} />
      </div>
    </div>
  );
}

async function ContractorHome({ user }: { user: SignedIn }) {
  const now = new Date();
  const [counts, jobRows] = await Promise.all([contractorCounts(db(), user), listJobRows(db(), user, {}, now)]);
  const owed = jobRows
    .filter((j) => ["open", "quoting", "awarded", "in_workshop"].includes(j.state))
    .map((j) => ({ ...j, due: j.awardedFirmId === user.firmId ? j.dueAt : (j.offers[0]?.dueAt ?? j.dueAt) }))
    .sort((a, b) => (a.due?.getTime() ?? Infinity) - (b.due?.getTime() ?? Infinity));
  return (
    <div className="flex flex-col gap-6">
      <PageHeader title="Workshop" question="What do I owe whom, and by when?" />
      <div className="grid grid-cols-2 gap-4">
        <Stat label="Jobs to quote" value={counts.offered} href="/jobs" note="offered to your firm" />
        <Stat label="Jobs in hand" value={counts.awarded} href="/jobs" note="awarded, not yet signed off" />
      </div>
      {owed.length === 0 ? (
        <EmptyState title="Nothing waiting">When a fleet offers your firm a job, it appears here with its due date.</EmptyState>
      ) : (
        <Card>
          <CardHeader title="Due next" description={user.orgName} />
          <CardBody>
            <ul className="divide-y divide-line">
              {owed.slice(0, 10).map((j) => (
                <li key={j.id} className="flex flex-wrap items-center justify-between gap-2 py-3">
                  <Link href={`/jobs/${j.id}`} className="text-lg font-semibold text-accent hover:underline">
                    Job {j.number} · {j.fleetNumber}
                  </Link>
                  <span className="text-muted">{j.awardedFirmId === user.firmId ? "Work to finish" : "Quote to send"}</span>
                  <span className="font-semibold tabular-nums">{j.due ? `due ${formatCalendarDay(j.due)}` : "no due date"}</span>
                </li>
              ))}
            </ul>
          </CardBody>
        </Card>
      )}
    </div>
  );
}

async function DriverHome({ user }: { user: SignedIn }) {
  const mine = await listVehicleSummaries(db(), user);
  const [openReports, readiness] = await Promise.all([myOpenDefects(db(), user), readinessByVehicle(db(), user, mine.map((v) => v.id))]);
  return (
    <div className="flex flex-col gap-6">
      <PageHeader title="My vehicles" question="Is my vehicle ready, and what did I report?" />
      {mine.length === 0 ? (
        <EmptyState title="No vehicle assigned">Ask your fleet manager to assign you a vehicle.</EmptyState>
      ) : (
        <ul className="flex flex-col gap-3">
          {mine.map((v) => (
            <li key={v.id}>
              <Link
                href={`/drive/${v.id}`}
                className="flex min-h-16 items-center justify-between gap-4 rounded-lg border-2 border-line bg-surface-raised px-4 py-3 text-lg hover:border-accent"
              >
                <span>
                  <span className="block font-bold">{v.fleetNumber}</span>
                  <span className="block text-base text-muted">
                    {v.registration} · {v.make} {v.model}
                  </span>
                  <span className="block text-base font-semibold">{READINESS_WORDS[readiness.get(v.id)?.state ?? "not_ready"]}</span>
                </span>
                <VehicleStatePill state={v.state} size="lg" />
              </Link>
            </li>
          ))}
        </ul>
      )}
      <Stat label="My open reports" value={openReports} note="defects not yet resolved" />
    </div>
  );
}
