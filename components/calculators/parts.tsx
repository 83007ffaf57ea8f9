import type { ReactNode } from "react";
import { Button, Caution, FormMessage, StatusPill, type StatusTone } from "@/components/ui";
import { unplacedDetails, type CalcError } from "./api";

/** Severity of a finding as the lib reports it. */
export type Severity = "ok" | "check" | "exceeds";

const SEVERITY: Record<Severity, { tone: StatusTone; word: string }> = {
  ok: { tone: "ok", word: "Within" },
  check: { tone: "warn", word: "Check" },
  exceeds: { tone: "danger", word: "Exceeds" },
};

export function SeverityPill({ severity, size = "sm" }: { severity: Severity; size?: "sm" | "md" }) {
  const s = SEVERITY[severity];
  return (
    <StatusPill tone={s.tone} size={size}>
      {s.word}
    </StatusPill>
  );
}

/** "Within" or "Over" a limit by its headroom (rating minus load). */
export function LimitPill({ headroom, overWord = "Over" }: { headroom: number; overWord?: string }) {
  return headroom < 0 ? (
    <StatusPill tone="danger" size="sm">
      {overWord}
    </StatusPill>
  ) : (
    <StatusPill tone="ok" size="sm">
      Within
    </StatusPill>
  );
}

export function FindingsList({ findings }: { findings: ReadonlyArray<{ code: string; severity: Severity; message: string }> }) {
  return (
    <ul className="flex flex-col gap-2" aria-label="Findings">
      {findings.map((f, i) => (
        <li key={`${f.code}-${i}`} className="flex items-start gap-2 text-sm" data-severity={f.severity}>
          <span className="mt-0.5 shrink-0">
            <SeverityPill severity={f.severity} />
          </span>
          <span>{f.message}</span>
        </li>
      ))}
    </ul>
  );
}

/**
 * The form's overall message for a failed request: the API's message, and any detail the form
 * could not place beside a field.
 */
export function CalcFormMessage({
  error,
  shown,
  label,
}: {
  error: CalcError | null;
  shown: (field: string) => boolean;
  label: string;
}) {
  if (!error) return <FormMessage tone="error" label={label} />;
  const rest = unplacedDetails(error, shown);
  return (
    <FormMessage tone="error" label={label}>
      <p>{error.code === "validation_failed" && rest.length === 0 ? `${error.message}: see the marked fields.` : error.message}</p>
      {rest.length > 0 && (
        <ul className="mt-1 list-disc pl-5">
          {rest.map((d, i) => (
            <li key={i}>{d.field ? `${d.field}: ${d.message}` : d.message}</li>
          ))}
        </ul>
      )}
    </FormMessage>
  );
}

/** A result panel: its heading, the figures, and the caution that always goes with them. */
export function ResultPanel({ title, caution, children }: { title: string; caution: string; children: ReactNode }) {
  return (
    <section aria-label={title} className="flex flex-col gap-4 border-t border-line pt-4" data-testid="calc-result">
      <h3 className="text-base font-semibold text-ink">{title}</h3>
      {children}
      <Caution text={caution} />
    </section>
  );
}

/** A one-line answer at the top of a result ("Binding limit: rear axle, 330 kg to spare"). */
export function Verdict({ tone, word, children }: { tone: StatusTone; word: string; children: ReactNode }) {
  return (
    <p className="flex flex-wrap items-center gap-2 text-base font-medium text-ink" data-testid="calc-verdict">
      <StatusPill tone={tone}>{word}</StatusPill> <span>{children}</span>
    </p>
  );
}

/** The button that takes one row out of a list in a calculator form. */
export function RemoveRowButton({ label, onRemove, className, size }: { label: string; onRemove: () => void; className?: string; size?: "sm" }) {
  return (
    <Button type="button" variant="ghost" size={size} className={className} onClick={onRemove} aria-label={label}>
      Remove
    </Button>
  );
}
