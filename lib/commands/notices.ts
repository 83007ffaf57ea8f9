import "server-only";
import { and, eq } from "drizzle-orm";
import type { Tx } from "@/db/client";
import { contractorFirms, memberships, users } from "@/db/schema";
import { formatCents } from "@/lib/money";
import { renderMail } from "@/lib/mail/render";
import type { Role } from "@/lib/permissions";
import type { CommandContext } from "@/lib/server/operation";
import { appUrl } from "./links";
import { formatCalendarDay } from "@/lib/format/dates";

/**
 * E-mail notices of jobs, quotes and evidence, queued in the outbox inside the command's
 * transaction. Non-essential notices (quote and evidence updates, sign-off news) skip anyone
 * who turned them off in their profile; essential ones (a job offered to a firm, a finance
 * approval needed) always go.
 */

type Mail = CommandContext<unknown>["mail"];
type Recipient = { email: string; name: string; notifyNonEssential: boolean };

export const NOTICE_KINDS = {
  jobOffered: { kind: "job.offered", essential: true },
  quoteSubmitted: { kind: "quote.submitted", essential: false },
  quoteDecided: { kind: "quote.decided", essential: false },
  financeNeeded: { kind: "quote.finance_needed", essential: true },
  evidenceLodged: { kind: "evidence.lodged", essential: false },
  evidenceRejected: { kind: "evidence.rejected", essential: false },
  jobSignedOff: { kind: "job.signed_off", essential: false },
} as const;
type NoticeName = keyof typeof NOTICE_KINDS;

export async function peopleWithRole(tx: Tx, orgId: string, role: Role): Promise<Recipient[]> {
  return tx
    .select({ email: users.email, name: users.name, notifyNonEssential: users.notifyNonEssential })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(and(eq(memberships.orgId, orgId), eq(memberships.role, role), eq(memberships.active, true)));
}

export async function firmPeople(tx: Tx, orgId: string, firmId: string): Promise<Recipient[]> {
  return tx
    .select({ email: users.email, name: users.name, notifyNonEssential: users.notifyNonEssential })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(and(eq(memberships.orgId, orgId), eq(memberships.firmId, firmId), eq(memberships.role, "contractor"), eq(memberships.active, true)));
}

async function send(mail: Mail, name: NoticeName, to: Recipient[], content: Parameters<typeof renderMail>[0]): Promise<number> {
  const { kind, essential } = NOTICE_KINDS[name];
  const seen = new Set<string>();
  let sent = 0;
  for (const person of to) {
    if (seen.has(person.email)) continue;
    seen.add(person.email);
    if (!essential && !person.notifyNonEssential) continue;
    await mail({
      to: person.email,
      kind,
      ...renderMail({
        ...content,
        footnote: essential
          ? "You receive this because you have an account on Rigline. This notice cannot be turned off."
          : "You receive this because you have an account on Rigline. You can turn off quote and evidence updates in your profile.",
      }),
    });
    sent++;
  }
  return sent;
}

type JobRef = { id: string; number: number; title: string; fleetNumber: string };
const jobName = (job: JobRef) => `Job ${job.number} (${job.fleetNumber})`;

export async function noticeJobOffered(tx: Tx, mail: Mail, orgId: string, orgName: string, job: JobRef, firmId: string, dueAt: Date | null) {
  const people = await firmPeople(tx, orgId, firmId);
  const [firm] = await tx.select().from(contractorFirms).where(eq(contractorFirms.id, firmId)).limit(1);
  const office: Recipient[] = firm ? [{ email: firm.email, name: firm.name, notifyNonEssential: true }] : [];
  return send(mail, "jobOffered", [...people, ...office], {
    subject: `${jobName(job)} offered to your workshop`,
    heading: `${orgName} asks for your quote`,
    paragraphs: [
      `${jobName(job)}: ${job.title}.`,
      dueAt ? `Quotes are due by ${formatCalendarDay(dueAt)}.` : "No due date was set.",
    ],
    action: { label: "Open the job", url: appUrl(`/jobs/${job.id}`) },
  });
}

export async function noticeQuoteSubmitted(tx: Tx, mail: Mail, orgId: string, job: JobRef, quote: { id: string; firmName: string; totalCents: number; revision: number }) {
  return send(mail, "quoteSubmitted", await peopleWithRole(tx, orgId, "manager"), {
    subject: `Quote from ${quote.firmName} for ${jobName(job)}`,
    heading: `${quote.firmName} submitted a quote`,
    paragraphs: [
      `${jobName(job)}: ${job.title}.`,
      `Total ${formatCents(quote.totalCents)} incl. GST${quote.revision > 1 ? ` (revision ${quote.revision})` : ""}.`,
    ],
    action: { label: "Compare the quotes", url: appUrl(`/jobs/${job.id}`) },
  });
}

export async function noticeQuoteDecided(
  tx: Tx,
  mail: Mail,
  orgId: string,
  job: JobRef,
  quote: { id: string; firmId: string; totalCents: number },
  outcome: { word: string; reason: string | null },
) {
  return send(mail, "quoteDecided", await firmPeople(tx, orgId, quote.firmId), {
    subject: `Your quote for ${jobName(job)}: ${outcome.word.toLowerCase()}`,
    heading: `Quote ${outcome.word.toLowerCase()}`,
    paragraphs: [
      `${jobName(job)}: ${job.title}. Your quote of ${formatCents(quote.totalCents)} incl. GST is ${outcome.word.toLowerCase()}.`,
      ...(outcome.reason ? [`Reason: ${outcome.reason}`] : []),
    ],
    action: { label: "Open the quote", url: appUrl(`/quotes/${quote.id}`) },
  });
}

export async function noticeFinanceNeeded(tx: Tx, mail: Mail, orgId: string, job: JobRef, quote: { id: string; firmName: string; totalCents: number }, thresholdCents: number) {
  return send(mail, "financeNeeded", await peopleWithRole(tx, orgId, "finance"), {
    subject: `Finance approval needed: ${formatCents(quote.totalCents)} for ${jobName(job)}`,
    heading: "A quote above the approval threshold waits for you",
    paragraphs: [
      `A manager accepted the quote of ${quote.firmName} for ${jobName(job)}: ${job.title}.`,
      `Its total of ${formatCents(quote.totalCents)} incl. GST is above the approval threshold of ${formatCents(thresholdCents)}, so it needs your approval before the work is awarded.`,
    ],
    action: { label: "Open the approvals", url: appUrl("/approvals") },
  });
}

export async function noticeEvidenceLodged(tx: Tx, mail: Mail, orgId: string, job: JobRef, what: string) {
  return send(mail, "evidenceLodged", await peopleWithRole(tx, orgId, "manager"), {
    subject: `Evidence lodged for ${jobName(job)}`,
    heading: "New evidence to review",
    paragraphs: [`${jobName(job)}: ${job.title}.`, `Lodged: ${what}.`],
    action: { label: "Review the evidence", url: appUrl(`/jobs/${job.id}`) },
  });
}

export async function noticeEvidenceRejected(tx: Tx, mail: Mail, orgId: string, job: JobRef, firmId: string, what: string, reason: string) {
  return send(mail, "evidenceRejected", await firmPeople(tx, orgId, firmId), {
    subject: `Evidence rejected for ${jobName(job)}`,
    heading: "Evidence rejected",
    paragraphs: [`${jobName(job)}: ${job.title}.`, `Rejected: ${what}.`, `Reason: ${reason}`, "Please lodge new evidence for this line."],
    action: { label: "Open the job", url: appUrl(`/jobs/${job.id}`) },
  });
}

export async function noticeJobSignedOff(tx: Tx, mail: Mail, orgId: string, job: JobRef, firmId: string | null, costCents: number) {
  const to = [...(await peopleWithRole(tx, orgId, "manager")), ...(await peopleWithRole(tx, orgId, "finance")), ...(firmId ? await firmPeople(tx, orgId, firmId) : [])];
  return send(mail, "jobSignedOff", to, {
    subject: `${jobName(job)} signed off`,
    heading: `${jobName(job)} is signed off`,
    paragraphs: [`${job.title}.`, `Cost booked: ${formatCents(costCents)} incl. GST.`],
    action: { label: "Open the job", url: appUrl(`/jobs/${job.id}`) },
  });
}
