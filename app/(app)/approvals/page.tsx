import type { Metadata } from "next";
import Link from "next/link";
import { financeApprovalAction } from "@/app/(app)/quotes/actions";
import { ActionForm } from "@/components/jobs/action-form";
import { Card, CardBody, CardHeader, EmptyState, PageHeader } from "@/components/ui";
import { approvalsQueue } from "@/lib/commands/quotes";
import { formatCents } from "@/lib/money";
import { requirePermission } from "@/lib/server/guard";
import { execute } from "@/lib/server/operation";
import { Instant } from "@/components/providers/time-zone";
import { formatCalendarDay } from "@/lib/format/dates";

export const metadata: Metadata = { title: "Approvals" };

export default async function ApprovalsPage() {
  const user = await requirePermission("approve", "FinanceApproval");
  const { items, thresholdCents } = await execute(approvalsQueue, user, {});
  return (
    <div className="flex flex-col gap-6">
      <PageHeader title="Approvals" question={`Which accepted quotes above ${formatCents(thresholdCents)} wait for finance?`} />
      {items.length === 0 ? (
        <EmptyState title="Nothing waits for you">Quotes a manager accepts above the threshold appear here.</EmptyState>
      ) : (
        items.map((q) => (
          <Card key={q.id} data-testid="approval-item">
            <CardHeader
              title={`${formatCents(q.totalCents)} incl. GST — ${q.firmName}`}
              description={
                <>
                  <Link href={`/jobs/${q.jobId}`} className="text-accent underline">
                    Job {q.jobNumber}: {q.jobTitle}
                  </Link>{" "}
                  on {q.fleetNumber} · GST {formatCents(q.gstCents)} · valid until {formatCalendarDay(q.validUntil)}
                  {q.acceptedBy ? (
                    <>
                      {` · accepted by ${q.acceptedBy.decidedByName} on `}
                      <Instant at={q.acceptedBy.decidedAt} show="day" />
                    </>
                  ) : null}
                </>
              }
            />
            <CardBody className="grid grid-cols-1 gap-6 md:grid-cols-2">
              <ActionForm action={financeApprovalAction} hidden={{ id: q.id, jobId: q.jobId, version: q.version, approve: "true" }} label="Approve" variant="primary" testId={`approve-${q.id}`} name={`Approve the quote of ${q.firmName}`} />
              <ActionForm
                action={financeApprovalAction}
                hidden={{ id: q.id, jobId: q.jobId, version: q.version, approve: "false" }}
                label="Decline"
                variant="danger"
                reason={{ label: "Reason for declining", required: true }}
                testId={`finance-decline-${q.id}`}
                name={`Decline the quote of ${q.firmName}`}
              />
            </CardBody>
          </Card>
        ))
      )}
    </div>
  );
}
