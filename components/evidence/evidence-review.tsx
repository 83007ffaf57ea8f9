import { reviewEvidenceAction } from "@/app/(app)/jobs/actions";
import { ActionForm } from "@/components/jobs/action-form";
import { EvidenceStatePill } from "@/components/jobs/status";
import { formatBytes } from "@/lib/uploads";
import { Instant } from "@/components/providers/time-zone";

type Item = {
  id: string;
  kind: string;
  status: "lodged" | "accepted" | "rejected";
  filename: string;
  contentType: string;
  sizeBytes: number;
  sha256: string;
  line: string;
  uploadedBy: string;
  createdAt: string;
  reviewReason: string | null;
  ticket: { ticketNumber: string; frontKg: number; rearKg: number; grossKg: number } | null;
};

const KIND_WORDS: Record<string, string> = {
  photo: "Photo",
  certificate: "Certificate",
  weighbridge_ticket: "Weighbridge ticket",
  engineering_signoff: "Engineering sign-off",
};

/** Each piece of evidence with its file (served through the app only), and the manager's review. */
export function EvidenceReview({ jobId, items, canReview }: { jobId: string; items: Item[]; canReview: boolean }) {
  return (
    <ul className="grid grid-cols-1 gap-4 md:grid-cols-2">
      {items.map((e) => {
        const url = `/api/evidence/${e.id}/file`;
        return (
          <li key={e.id} className="flex flex-col gap-3 rounded-md border border-line p-4" data-testid="evidence-item">
            <div className="flex items-start justify-between gap-3">
              <div>
                <p className="font-semibold">
                  {KIND_WORDS[e.kind] ?? e.kind} · {e.line}
                </p>
                <p className="text-sm text-muted">
                  {e.filename} · {formatBytes(e.sizeBytes)} · {e.uploadedBy} · <Instant at={e.createdAt} show="day" />
                </p>
                <p className="font-mono text-xs text-muted" title="SHA-256 of the stored file">
                  SHA-256 {e.sha256.slice(0, 16)}…
                </p>
              </div>
              <EvidenceStatePill state={e.status} />
            </div>
            {e.contentType.startsWith("image/") ? (
              <a href={url} target="_blank" rel="noreferrer">
                {/* eslint-disable-next-line @next/next/no-img-element -- served through the app with access checks, not the image optimiser */}
                <img src={url} alt={`${KIND_WORDS[e.kind] ?? e.kind} for ${e.line}`} className="max-h-48 rounded border border-line" />
              </a>
            ) : (
              <a href={url} target="_blank" rel="noreferrer" className="font-semibold text-accent underline">
                Open the PDF
              </a>
            )}
            {e.ticket && (
              <p className="text-sm tabular-nums" data-testid="ticket-masses">
                Ticket {e.ticket.ticketNumber}: front {e.ticket.frontKg} kg, rear {e.ticket.rearKg} kg, gross {e.ticket.grossKg} kg
              </p>
            )}
            {e.reviewReason && <p className="text-sm">Review: “{e.reviewReason}”</p>}
            {canReview && e.status === "lodged" && (
              <div className="grid grid-cols-1 gap-3 sm:grid-cols-2">
                <ActionForm action={reviewEvidenceAction} hidden={{ id: e.id, jobId, decision: "accept" }} label="Accept" variant="primary" testId={`accept-evidence-${e.id}`} name={`Accept ${e.filename}`} />
                <ActionForm
                  action={reviewEvidenceAction}
                  hidden={{ id: e.id, jobId, decision: "reject" }}
                  label="Reject"
                  variant="danger"
                  reason={{ label: "Why it is rejected", required: true }}
                  testId={`reject-evidence-${e.id}`}
                  name={`Reject ${e.filename}`}
                />
              </div>
            )}
          </li>
        );
      })}
    </ul>
  );
}
