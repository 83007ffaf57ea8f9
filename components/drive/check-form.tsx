"use client";

import { useRef, useState } from "react";
import { Button, FormMessage, StatusShape, Textarea, buttonClasses, cn } from "@/components/ui";
import { CHECK_RESULT_LABELS, CHECK_RESULTS, DEFECT_SEVERITIES, SEVERITY_LABELS, type CheckResult, type ChecklistItem, type DefectSeverity } from "@/lib/defects";
import { newClientId, submitReport, type SubmitResult } from "@/lib/offline";
import { PhotoPicker } from "./photo-picker";
import { useOutbox } from "./use-outbox";

type Vehicle = { id: string; fleetNumber: string };

type Raised = { severity: DefectSeverity; clientId: string; outcome: "sent" | "queued"; grounded: boolean };

type Answer = { result: CheckResult | null; note: string; photos: File[]; raised: Raised | null; raising: boolean; error: string | null };

const blank = (): Answer => ({ result: null, note: "", photos: [], raised: null, raising: false, error: null });

const RESULT_STYLE: Record<CheckResult, string> = {
  pass: "peer-checked:border-ok peer-checked:bg-ok-soft peer-checked:text-ok-ink",
  fail: "peer-checked:border-danger peer-checked:bg-danger-soft peer-checked:text-danger-ink",
  na: "peer-checked:border-neutral peer-checked:bg-neutral-soft peer-checked:text-neutral-ink",
};

/**
 * The pre-trip check on a phone: each item OK, fault (words, perhaps a photo) or not
 * applicable; a fault becomes a defect report with one tap on how bad it is. The finished
 * check goes through the phone's outbox like every report.
 */
export function CheckForm({ userId, vehicle, items }: { userId: string; vehicle: Vehicle; items: ChecklistItem[] }) {
  const [answers, setAnswers] = useState<Record<string, Answer>>(() => Object.fromEntries(items.map((i) => [i.key, blank()])));
  const [message, setMessage] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const [result, setResult] = useState<{ outcome: SubmitResult; counts: Record<CheckResult, number>; clientId: string } | null>(null);
  const pendingId = useRef<string | null>(null);
  const { items: outbox } = useOutbox(userId);
  /** A report saved without signal counts as sent once it has left the outbox. */
  const leftOutbox = (id: string) => outbox !== null && !outbox.some((i) => i.id === id);

  const patch = (key: string, change: Partial<Answer>) => setAnswers((prev) => ({ ...prev, [key]: { ...(prev[key] ?? blank()), ...change } }));
  const answered = items.filter((i) => answers[i.key]?.result).length;

  const raise = async (item: ChecklistItem, severity: DefectSeverity) => {
    const a = answers[item.key] ?? blank();
    if (a.note.trim().length < 3) {
      patch(item.key, { error: "Say what is wrong first (a few words)" });
      return;
    }
    patch(item.key, { raising: true, error: null });
    const clientId = newClientId();
    const fields = {
      clientId,
      vehicleId: vehicle.id,
      severity,
      category: item.defectCategory,
      description: `${item.label}: ${a.note.trim()}`,
      reportedAt: new Date().toISOString(),
    };
    try {
      const outcome = await submitReport({
        id: clientId,
        kind: "defect",
        userId,
        url: "/api/defects",
        fields,
        files: a.photos.map((p, i) => ({ field: "photos", blob: p, name: p.name || `photo-${i + 1}.jpg` })),
        label: `Defect on ${vehicle.fleetNumber}: ${item.label}`,
      });
      if (outcome.state === "refused") {
        patch(item.key, { raising: false, error: outcome.message });
        return;
      }
      const grounded = outcome.state === "sent" && Boolean((outcome.body as { grounded?: boolean } | null)?.grounded);
      patch(item.key, { raising: false, raised: { severity, clientId, outcome: outcome.state, grounded } });
    } catch {
      patch(item.key, { raising: false, error: "This phone could not save the report; try again" });
    }
  };

  const finish = async () => {
    let problem = false;
    const next = { ...answers };
    for (const item of items) {
      const a = next[item.key] ?? blank();
      if (!a.result) {
        next[item.key] = { ...a, error: "Answer OK, fault or N/A" };
        problem = true;
      } else if (a.result === "fail" && a.note.trim() === "") {
        next[item.key] = { ...a, error: "Say what is wrong" };
        problem = true;
      }
    }
    if (problem) {
      setAnswers(next);
      setMessage("Some items need an answer.");
      const first = items.find((i) => next[i.key]?.error);
      if (first) document.getElementById(`item-${first.key}`)?.scrollIntoView({ block: "center" });
      return;
    }
    setMessage(null);
    setBusy(true);
    const clientId = (pendingId.current ??= newClientId());
    const list = items.map((item) => {
      const a = answers[item.key]!;
      return { key: item.key, label: item.label, result: a.result!, ...(a.note.trim() ? { note: a.note.trim() } : {}), ...(a.raised ? { defectClientId: a.raised.clientId } : {}) };
    });
    const counts: Record<CheckResult, number> = { pass: 0, fail: 0, na: 0 };
    for (const a of list) counts[a.result] += 1;
    try {
      const outcome = await submitReport({
        id: clientId,
        kind: "check",
        userId,
        url: "/api/checks",
        fields: { clientId, vehicleId: vehicle.id, items: JSON.stringify(list), completedAt: new Date().toISOString() },
        files: items.flatMap((item) => (answers[item.key]?.result === "fail" ? (answers[item.key]?.photos ?? []) : []).map((p, i) => ({ field: `photos.${item.key}`, blob: p, name: p.name || `photo-${i + 1}.jpg` }))),
        label: `Pre-trip check of ${vehicle.fleetNumber}`,
      });
      if (outcome.state === "refused") {
        setMessage(outcome.message);
        return;
      }
      pendingId.current = null;
      setResult({ outcome, counts, clientId });
    } catch {
      setMessage("This phone could not save the check. Check its storage and try again.");
    } finally {
      setBusy(false);
    }
  };

  if (result) {
    const sent = result.outcome.state === "sent" || leftOutbox(result.clientId);
    const { pass, fail, na } = result.counts;
    return (
      <section aria-label="Check" data-testid="check-result" className="flex flex-col gap-4 rounded-lg border-2 border-line bg-surface-raised p-4">
        <p className="flex items-center gap-2 text-xl font-bold">
          <StatusShape tone={sent ? "ok" : "warn"} sizePx={18} /> {sent ? "Check sent" : "Check saved on this phone"}
        </p>
        <p className="text-lg">
          {pass} OK · {fail} {fail === 1 ? "fault" : "faults"} · {na} N/A
        </p>
        {!sent && <p className="text-lg">It is sent by itself when the phone has signal again.</p>}
        <a href={`/drive/${vehicle.id}`} className={buttonClasses({ size: "lg", className: "self-start" })}>
          Back to {vehicle.fleetNumber}
        </a>
      </section>
    );
  }

  return (
    <form
      aria-label="Pre-trip check"
      noValidate
      className="flex flex-col gap-4"
      onSubmit={(e) => {
        e.preventDefault();
        void finish();
      }}
    >
      <p className="text-base font-semibold" aria-live="polite" data-testid="check-progress">
        {answered} of {items.length} answered
      </p>
      <ol className="flex flex-col gap-4">
        {items.map((item, index) => {
          const a = answers[item.key] ?? blank();
          const name = `result-${index}`;
          return (
            <li key={item.key} id={`item-${item.key}`}>
              <fieldset className={cn("flex flex-col gap-3 rounded-lg border-2 bg-surface-raised p-4", a.error ? "border-danger" : "border-line")} data-testid={`check-item-${item.key}`}>
                <legend className="sr-only">{item.label}</legend>
                <div aria-hidden="true">
                  <p className="text-lg font-bold">{item.label}</p>
                  <p className="text-base text-muted">{item.hint}</p>
                </div>
                <div className="grid grid-cols-3 gap-2" role="radiogroup" aria-label={item.label}>
                  {CHECK_RESULTS.map((r) => (
                    <label key={r} className="relative">
                      <input
                        type="radio"
                        name={name}
                        value={r}
                        checked={a.result === r}
                        onChange={() => patch(item.key, { result: r, error: null })}
                        className="peer sr-only"
                        aria-label={`${item.label}: ${CHECK_RESULT_LABELS[r]}`}
                      />
                      <span className={cn("flex min-h-14 cursor-pointer items-center justify-center rounded-md border-2 border-line-strong bg-surface text-lg font-bold peer-focus-visible:outline-3 peer-focus-visible:outline-focus", RESULT_STYLE[r])}>
                        {CHECK_RESULT_LABELS[r]}
                      </span>
                    </label>
                  ))}
                </div>
                {a.result === "fail" && (
                  <div className="flex flex-col gap-3">
                    <label className="flex flex-col gap-1.5">
                      <span className="text-sm font-semibold">
                        What is wrong?<span aria-hidden="true" className="ml-0.5 text-danger">*</span>
                      </span>
                      <Textarea size="lg" rows={2} value={a.note} onChange={(e) => patch(item.key, { note: e.target.value, error: null })} maxLength={1000} />
                    </label>
                    <PhotoPicker photos={a.photos} onChange={(photos) => patch(item.key, { photos })} max={3} idPrefix={`check-photo-${index}`} />
                    {a.raised ? (
                      <p className="flex items-start gap-2 rounded-md bg-surface-sunken px-3 py-2 text-base font-semibold" data-testid={`raised-${item.key}`}>
                        <StatusShape tone={a.raised.outcome === "sent" || leftOutbox(a.raised.clientId) ? "ok" : "warn"} sizePx={16} className="mt-1" />
                        <span>
                          Defect raised ({SEVERITY_LABELS[a.raised.severity]}) — {a.raised.outcome === "sent" || leftOutbox(a.raised.clientId) ? "sent" : "waiting to send"}.
                          {a.raised.grounded && ` ${vehicle.fleetNumber} is now grounded: do not drive it.`}
                        </span>
                      </p>
                    ) : (
                      <div className="flex flex-col gap-2">
                        <span className="text-sm font-semibold">Raise a defect — how bad is it?</span>
                        <div className="flex flex-wrap gap-2">
                          {DEFECT_SEVERITIES.map((s) => (
                            <Button key={s} type="button" size="lg" variant={s === "stop" ? "danger" : "secondary"} loading={a.raising} onClick={() => void raise(item, s)}>
                              {SEVERITY_LABELS[s]}
                            </Button>
                          ))}
                        </div>
                      </div>
                    )}
                  </div>
                )}
                {a.error && (
                  <p className="flex items-center gap-2 text-base font-semibold text-danger" role="alert">
                    <StatusShape tone="danger" sizePx={14} /> {a.error}
                  </p>
                )}
              </fieldset>
            </li>
          );
        })}
      </ol>
      <FormMessage tone="error" label="Check problems" data-testid="check-form-status">
        {message}
      </FormMessage>
      <Button type="submit" size="lg" loading={busy} className="w-full text-lg">
        Finish check
      </Button>
    </form>
  );
}
