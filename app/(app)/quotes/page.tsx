import type { Metadata } from "next";
import Link from "next/link";
import { QuoteStatePill } from "@/components/jobs/status";
import { EmptyState, PageHeader, Table, TBody, Td, Th, THead, Tr } from "@/components/ui";
import { listQuotes } from "@/lib/commands/quotes";
import { formatCents } from "@/lib/money";
import { requirePermission } from "@/lib/server/guard";
import { execute } from "@/lib/server/operation";
import { formatCalendarDay } from "@/lib/format/dates";

export const metadata: Metadata = { title: "Quotes" };

export default async function QuotesPage() {
  const user = await requirePermission("read", "Quote");
  const quotes = await execute(listQuotes, user, {});
  const mine = user.role === "contractor";
  return (
    <div className="flex flex-col gap-6">
      <PageHeader title={mine ? "Our quotes" : "Quotes"} question={mine ? "Where does each of our quotes stand?" : "Which quotes are waiting, and what has been decided?"} />
      {quotes.length === 0 ? (
        <EmptyState title="No quotes yet">{mine ? "Open a job offered to your workshop to start a quote." : "Quotes appear here when workshops write them."}</EmptyState>
      ) : (
        <Table label="Quotes" density="compact">
          <THead>
            <Tr>
              <Th numeric>Job</Th>
              <Th>Work</Th>
              <Th>Vehicle</Th>
              {!mine && <Th>Workshop</Th>}
              <Th>Status</Th>
              <Th numeric>Total incl. GST</Th>
              <Th>Valid until</Th>
            </Tr>
          </THead>
          <TBody>
            {quotes.map((q) => (
              <Tr key={q.id}>
                <Td numeric>{q.jobNumber}</Td>
                <Td>
                  <Link href={`/quotes/${q.id}`} className="font-semibold text-accent hover:underline">
                    {q.jobTitle}
                  </Link>
                </Td>
                <Td>{q.fleetNumber}</Td>
                {!mine && <Td>{q.firmName}</Td>}
                <Td>
                  <QuoteStatePill state={q.status} size="sm" />
                </Td>
                <Td numeric>{formatCents(q.totalCents)}</Td>
                <Td>{formatCalendarDay(q.validUntil)}</Td>
              </Tr>
            ))}
          </TBody>
        </Table>
      )}
    </div>
  );
}
