"use client";

import { StatusShape, cn, type StatusTone } from "@/components/ui";
import { DEFECT_SEVERITIES, SEVERITY_HINTS, SEVERITY_LABELS, type DefectSeverity } from "@/lib/defects";

const TONE: Record<DefectSeverity, StatusTone> = { stop: "danger", before_next_trip: "warn", watch: "info" };

/** How bad is it: three big choices, each with what it will do. A native radio group. */
export function SeverityChoice({ value, onChange, name = "severity", error }: { value: DefectSeverity | null; onChange: (s: DefectSeverity) => void; name?: string; error?: string | undefined }) {
  return (
    <fieldset className="flex flex-col gap-2" aria-describedby={error ? `${name}-error` : undefined}>
      <legend className="mb-1 text-sm font-semibold">
        How bad is it?<span aria-hidden="true" className="ml-0.5 text-danger">*</span>
      </legend>
      {DEFECT_SEVERITIES.map((s) => (
        <label
          key={s}
          className={cn(
            "flex min-h-16 cursor-pointer items-start gap-3 rounded-lg border-2 bg-surface-raised px-4 py-3",
            value === s ? (s === "stop" ? "border-danger bg-danger-soft" : "border-accent bg-accent-soft") : "border-line-strong",
          )}
        >
          <input type="radio" name={name} value={s} checked={value === s} onChange={() => onChange(s)} className="mt-1 size-6 shrink-0 accent-accent" />
          <span className="flex flex-col">
            <span className="flex items-center gap-2 text-lg font-bold">
              <StatusShape tone={TONE[s]} sizePx={16} />
              {SEVERITY_LABELS[s]}
            </span>
            <span className="text-base text-muted">{SEVERITY_HINTS[s]}</span>
          </span>
        </label>
      ))}
      {error && (
        <p id={`${name}-error`} className="text-sm font-semibold text-danger">
          {error}
        </p>
      )}
    </fieldset>
  );
}
