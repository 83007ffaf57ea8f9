import type { Metadata } from "next";
import Link from "next/link";
import { DefectTable } from "@/components/defects/defect-table";
import { PageHeader, cn } from "@/components/ui";
import { listDefectsQuery } from "@/lib/commands/defects";
import { DEFECT_SEVERITIES, SEVERITY_LABELS, STATE_LABELS, type DefectState } from "@/lib/defects";
import { requirePermission } from "@/lib/server/guard";
import { execute } from "@/lib/server/operation";

export const metadata: Metadata = { title: "Defects" };

const TABS: { key: string; label: string }[] = [
  { key: "open", label: "Open" },
  ...(["reported", "triaged", "in_repair", "resolved", "closed", "merged"] as DefectState[]).map((s) => ({ key: s, label: STATE_LABELS[s] })),
  { key: "", label: "All" },
];

export default async function DefectsPage({ searchParams }: { searchParams: Promise<Record<string, string | undefined>> }) {
  const user = await requirePermission("read", "Defect");
  const sp = await searchParams;
  const state = sp.state ?? "open";
  const severity = DEFECT_SEVERITIES.find((s) => s === sp.severity);
  const page = Math.max(1, Number(sp.page) || 1);
  const result = await execute(listDefectsQuery, user, { state, severity, page, pageSize: 25 }).catch(() => execute(listDefectsQuery, user, { state: "open", page: 1, pageSize: 25 }));
  const counts = result.counts;
  const openCount = (counts.reported ?? 0) + (counts.triaged ?? 0) + (counts.in_repair ?? 0);
  const href = (next: Record<string, string | undefined>) => {
    const q = new URLSearchParams();
    const merged = { state, severity, ...next };
    if (merged.state !== undefined) q.set("state", merged.state);
    if (merged.severity) q.set("severity", merged.severity);
    if (next.page) q.set("page", next.page);
    return `/defects?${q.toString()}`;
  };
  return (
    <div className="flex flex-col gap-6">
      <PageHeader title="Defects" question="Which reports from the field need a decision?" />
      <nav aria-label="Defect states" className="flex flex-wrap gap-2">
        {TABS.map((t) => {
          const n = t.key === "open" ? openCount : t.key === "" ? Object.values(counts).reduce((a, b) => a + (b ?? 0), 0) : (counts[t.key as DefectState] ?? 0);
          const active = t.key === state;
          return (
            <Link key={t.key || "all"} href={href({ state: t.key, page: undefined })} aria-current={active ? "page" : undefined} className={cn("inline-flex min-h-10 items-center gap-2 rounded-md border px-3 text-sm font-semibold", active ? "border-accent bg-accent text-on-accent" : "border-line-strong bg-surface-raised hover:bg-surface-sunken")}>
              {t.label}
              <span className="tabular-nums">{n}</span>
            </Link>
          );
        })}
      </nav>
      <nav aria-label="Severity" className="flex flex-wrap items-center gap-2 text-sm">
        <span className="font-semibold text-muted">How bad:</span>
        <Link href={href({ severity: undefined, page: undefined })} className={cn("rounded-md px-2 py-1", !severity ? "font-bold underline" : "text-accent")} aria-current={!severity ? "page" : undefined}>
          Any
        </Link>
        {DEFECT_SEVERITIES.map((s) => (
          <Link key={s} href={href({ severity: s, page: undefined })} className={cn("rounded-md px-2 py-1", severity === s ? "font-bold underline" : "text-accent")} aria-current={severity === s ? "page" : undefined}>
            {SEVERITY_LABELS[s]}
          </Link>
        ))}
      </nav>
      <DefectTable rows={result.items} empty={state === "open" ? "No open defect. Reports from drivers appear here." : "No defect in this list."} />
      {result.pageCount > 1 && (
        <nav aria-label="Pages" className="flex items-center gap-3 text-sm">
          {result.page > 1 && <Link href={href({ page: String(result.page - 1) })} className="text-accent underline">Previous</Link>}
          <span>
            Page {result.page} of {result.pageCount} · {result.total} defects
          </span>
          {result.page < result.pageCount && <Link href={href({ page: String(result.page + 1) })} className="text-accent underline">Next</Link>}
        </nav>
      )}
    </div>
  );
}
