import type { Metadata } from "next";
import Link from "next/link";
import { Stat } from "@/components/landing/stat";
import { PageHeader, Card, CardBody, CardHeader, EmptyState } from "@/components/ui";
import { VehicleStatePill } from "@/components/vehicles/vehicle-state";
import { db } from "@/db/client";
import { contractorCounts, myOpenDefects, outboxCounts, peopleCounts, quoteCounts, spendSince } from "@/db/landing";
import { countVehiclesByState, listVehicleSummaries } from "@/db/vehicles";
import { requireUser } from "@/lib/server/guard";
import type { SignedIn } from "@/lib/server/session";

export const metadata: Metadata = { title: "Home" };

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
  const [byState, quotesByStatus, grounded] = await Promise.all([
    countVehiclesByState(db(), user),
    quoteCounts(db(), user),
    listVehicleSummaries(db(), user, { state: "grounded", limit: 10 }),
  ]);
  return (
    <div className="flex flex-col gap-6">
      <PageHeader title={`Good day, ${user.name.split(" ")[0]}`} question="What needs my decision, and which vehicles are not ready?" />
      <div className="grid grid-cols-2 gap-4 md:grid-cols-4">
        <Stat label="Quotes to decide" value={quotesByStatus.submitted ?? 0} note="submitted by workshops" />
        <Stat label="Grounded" value={byState.grounded ?? 0} href="/vehicles" note="vehicles off the road" />
        <Stat label="In fit-out" value={byState.in_fitout ?? 0} href="/vehicles" />
        <Stat label="In service" value={byState.in_service ?? 0} href="/vehicles" />
      </div>
      <Card>
        <CardHeader title="Grounded vehicles" description="These cannot leave the depot until a manager returns them to service." />
        <CardBody>
          {grounded.length === 0 ? (
            <p className="text-muted">No vehicle is grounded.</p>
          ) : (
            <ul className="divide-y divide-line">
              {grounded.map((v) => (
                <li key={v.id} className="flex items-center justify-between gap-4 py-2">
                  <Link href={`/vehicles/${v.id}`} className="font-semibold text-accent hover:underline">
                    {v.fleetNumber} · {v.make} {v.model}
                  </Link>
                  <span className="text-sm text-muted">{v.depotName}</span>
                  <VehicleStatePill state={v.state} />
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
  const monthStart = new Date(Date.UTC(new Date().getUTCFullYear(), new Date().getUTCMonth(), 1));
  const [quotesByStatus, spend] = await Promise.all([quoteCounts(db(), user), spendSince(db(), user, monthStart)]);
  return (
    <div className="flex flex-col gap-6">
      <PageHeader title="Finance" question="What awaits my approval, and how is spend running?" />
      <div className="grid grid-cols-2 gap-4 md:grid-cols-3">
        <Stat label="Awaiting your approval" value={quotesByStatus.awaiting_finance ?? 0} note="quotes above the threshold" />
        <Stat label="Booked this month" value={money(spend)} note="excluding GST" />
        <Stat label="Accepted quotes" value={quotesByStatus.accepted ?? 0} />
      </div>
    </div>
  );
}

async function ContractorHome({ user }: { user: SignedIn }) {
  const counts = await contractorCounts(db(), user);
  return (
    <div className="flex flex-col gap-6">
      <PageHeader title="Workshop" question="What do I owe whom, and by when?" />
      <div className="grid grid-cols-2 gap-4">
        <Stat label="Jobs to quote" value={counts.offered} note="offered to your firm" />
        <Stat label="Jobs in hand" value={counts.awarded} note="awarded, not yet signed off" />
      </div>
      {counts.offered + counts.awarded === 0 && (
        <EmptyState title="Nothing waiting">When a fleet offers your firm a job, it appears here with its due date.</EmptyState>
      )}
    </div>
  );
}

async function DriverHome({ user }: { user: SignedIn }) {
  const [mine, openReports] = await Promise.all([listVehicleSummaries(db(), user), myOpenDefects(db(), user)]);
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
                href={`/vehicles/${v.id}`}
                className="flex min-h-16 items-center justify-between gap-4 rounded-lg border-2 border-line bg-surface-raised px-4 py-3 text-lg hover:border-accent"
              >
                <span>
                  <span className="block font-bold">{v.fleetNumber}</span>
                  <span className="block text-base text-muted">
                    {v.registration} · {v.make} {v.model}
                  </span>
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
