import { StatusPill, type StatusTone } from "@/components/ui";
import type { Finding, Severity } from "@/lib/rules";

export const SEVERITY: Record<Severity, { tone: StatusTone; word: string }> = {
  ok: { tone: "ok", word: "Within" },
  check: { tone: "warn", word: "Check" },
  exceeds: { tone: "danger", word: "Exceeds" },
};

/** Plain-language findings, each with its severity as word, shape and colour. */
export function FindingList({ findings, label }: { findings: Finding[]; label: string }) {
  return (
    <ul className="flex flex-col gap-2" aria-label={label}>
      {findings.map((f, i) => (
        <li key={`${f.code}-${i}`} className="flex items-start gap-3" data-code={f.code} data-severity={f.severity}>
          <StatusPill tone={SEVERITY[f.severity].tone} size="sm" className="mt-0.5 w-20 justify-center">
            {SEVERITY[f.severity].word}
          </StatusPill>
          <span className="text-sm">{f.message}</span>
        </li>
      ))}
    </ul>
  );
}
