"use client";

import { useEffect, useRef, useState } from "react";
import { Button, Field, FormMessage, Input, Select, StatusShape, Textarea, buttonClasses } from "@/components/ui";
import { CATEGORY_LABELS, DEFECT_CATEGORIES, STATE_HINTS, defectReportSchema, isCategory, isSeverity, type DefectCategory, type DefectSeverity } from "@/lib/defects";
import { newClientId, submitReport, type SubmitResult } from "@/lib/offline";
import { LocationField, type Position } from "./location-field";
import { PhotoPicker } from "./photo-picker";
import { SeverityChoice } from "./severity-choice";
import { useOutbox } from "./use-outbox";

type Vehicle = { id: string; fleetNumber: string; registration: string | null; odometerKm: number | null };

type Sent = { defect?: { id: string; state: "reported" }; grounded?: boolean; managersNotified?: number; created?: boolean };

/**
 * The defect report, made for a phone: how bad, what, where, photos. It is validated here,
 * put in the phone's outbox and sent at once when there is signal, later when there is not.
 */
export function DefectForm({ userId, vehicle }: { userId: string; vehicle: Vehicle }) {
  const [severity, setSeverity] = useState<DefectSeverity | null>(null);
  const [category, setCategory] = useState<DefectCategory | "">("");
  const [description, setDescription] = useState("");
  const [odometer, setOdometer] = useState("");
  const [photos, setPhotos] = useState<File[]>([]);
  const [position, setPosition] = useState<Position | null>(null);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [message, setMessage] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const [result, setResult] = useState<SubmitResult | null>(null);
  const [queuedId, setQueuedId] = useState<string | null>(null);
  const pendingId = useRef<string | null>(null);
  const { items: outbox } = useOutbox(userId);
  // A report saved without signal leaves the outbox once it is sent (from this page or another).
  const sentLater = result?.state === "queued" && queuedId !== null && outbox !== null && !outbox.some((i) => i.id === queuedId);

  // A defect raised from a check item arrives with its category and words filled in.
  useEffect(() => {
    const q = new URLSearchParams(window.location.search);
    const c = q.get("category");
    const d = q.get("description");
    const s = q.get("severity");
    const t = setTimeout(() => {
      if (isCategory(c)) setCategory(c);
      if (d) setDescription(d.slice(0, 2000));
      if (isSeverity(s)) setSeverity(s);
    }, 0);
    return () => clearTimeout(t);
  }, []);

  const reset = () => {
    setSeverity(null);
    setCategory("");
    setDescription("");
    setOdometer("");
    setPhotos([]);
    setPosition(null);
    setErrors({});
    setMessage(null);
    setResult(null);
    setQueuedId(null);
    pendingId.current = null;
  };

  const submit = async (event: React.FormEvent) => {
    event.preventDefault();
    const clientId = (pendingId.current ??= newClientId());
    const fields: Record<string, string> = {
      clientId,
      vehicleId: vehicle.id,
      severity: severity ?? "",
      category,
      description,
      odometerKm: odometer.replace(/[\s,]/g, ""),
      latitude: position ? String(position.latitude) : "",
      longitude: position ? String(position.longitude) : "",
      reportedAt: new Date().toISOString(),
    };
    const parsed = defectReportSchema.safeParse(fields);
    if (!parsed.success) {
      const next: Record<string, string> = {};
      for (const issue of parsed.error.issues) {
        const key = String(issue.path[0] ?? "form");
        next[key] ??= issue.message;
      }
      setErrors(next);
      setMessage("Some answers need attention.");
      return;
    }
    setErrors({});
    setMessage(null);
    setBusy(true);
    try {
      const outcome = await submitReport({
        id: clientId,
        kind: "defect",
        userId,
        url: "/api/defects",
        fields,
        files: photos.map((p, i) => ({ field: "photos", blob: p, name: p.name || `photo-${i + 1}.jpg` })),
        label: `Defect on ${vehicle.fleetNumber}: ${CATEGORY_LABELS[parsed.data.category]}`,
      });
      if (outcome.state === "refused") {
        setErrors(Object.fromEntries(Object.entries(outcome.fieldErrors).map(([k, v]) => [k.split(".")[0]!, v])));
        setMessage(outcome.message);
        return;
      }
      setResult(outcome);
      setQueuedId(outcome.state === "queued" ? clientId : null);
      pendingId.current = null;
    } catch {
      setMessage("This phone could not save the report. Check its storage and try again.");
    } finally {
      setBusy(false);
    }
  };

  if (result) {
    const sent = result.state === "sent" ? ((result.body ?? {}) as Sent) : null;
    return (
      <section aria-label="Report" data-testid="defect-result" className="flex flex-col gap-4 rounded-lg border-2 border-line bg-surface-raised p-4">
        {sent ? (
          <>
            <p className="flex items-center gap-2 text-xl font-bold">
              <StatusShape tone="ok" sizePx={18} /> Sent
            </p>
            <p className="text-lg">Status: Reported. {STATE_HINTS.reported}</p>
            {sent.grounded && (
              <p className="rounded-md border-l-4 border-danger bg-danger-soft px-3 py-2 text-lg font-semibold text-danger-ink" data-testid="grounded-notice">
                {vehicle.fleetNumber} is now grounded. Do not drive it. The managers have been e-mailed.
              </p>
            )}
            {sent.defect && (
              <a href={`/defects/${sent.defect.id}`} className={buttonClasses({ variant: "secondary", size: "lg", className: "self-start" })}>
                See its status
              </a>
            )}
          </>
        ) : sentLater ? (
          <>
            <p className="flex items-center gap-2 text-xl font-bold">
              <StatusShape tone="ok" sizePx={18} /> Sent
            </p>
            <p className="text-lg">The phone had signal again and sent it. Status: Reported. {STATE_HINTS.reported}</p>
          </>
        ) : (
          <>
            <p className="flex items-center gap-2 text-xl font-bold">
              <StatusShape tone="warn" sizePx={18} /> Saved on this phone
            </p>
            <p className="text-lg">No signal now. It is sent by itself when the phone has signal again — keep Rigline open or open it later.</p>
            {severity === "stop" && (
              <p className="rounded-md border-l-4 border-danger bg-danger-soft px-3 py-2 text-lg font-semibold text-danger-ink">
                Do not drive {vehicle.fleetNumber}. If you can, phone your manager: the report reaches them only when it is sent.
              </p>
            )}
          </>
        )}
        <div className="flex flex-wrap gap-3">
          <Button size="lg" onClick={reset}>
            Report another
          </Button>
          <a href={`/drive/${vehicle.id}`} className={buttonClasses({ variant: "secondary", size: "lg" })}>
            Back to {vehicle.fleetNumber}
          </a>
        </div>
      </section>
    );
  }

  return (
    <form onSubmit={(e) => void submit(e)} noValidate aria-label="Report a defect" className="flex flex-col gap-5">
      <SeverityChoice value={severity} onChange={setSeverity} error={errors.severity} />
      <Field label="What is it about?" required error={errors.category} id="defect-category">
        <Select size="lg" value={category} onChange={(e) => setCategory(e.target.value as DefectCategory | "")}>
          <option value="">Pick one</option>
          {DEFECT_CATEGORIES.map((c) => (
            <option key={c} value={c}>
              {CATEGORY_LABELS[c]}
            </option>
          ))}
        </Select>
      </Field>
      <Field label="What is wrong?" hint="Where on the vehicle, what you see, hear or feel." required error={errors.description} id="defect-description">
        <Textarea size="lg" rows={4} value={description} onChange={(e) => setDescription(e.target.value)} maxLength={2000} />
      </Field>
      <Field label="Odometer (km)" hint={vehicle.odometerKm !== null ? `Last known: ${vehicle.odometerKm.toLocaleString("en-AU")} km` : undefined} error={errors.odometerKm} id="defect-odometer">
        <Input size="lg" inputMode="numeric" autoComplete="off" value={odometer} onChange={(e) => setOdometer(e.target.value)} />
      </Field>
      <div className="flex flex-col gap-2">
        <span className="text-sm font-semibold">Photos (optional)</span>
        <PhotoPicker photos={photos} onChange={setPhotos} idPrefix="defect-photo" error={errors.photos} />
      </div>
      <LocationField value={position} onChange={setPosition} />
      <FormMessage tone="error" label="Report problems" data-testid="defect-form-status">
        {message}
      </FormMessage>
      <Button type="submit" size="lg" variant={severity === "stop" ? "danger" : "primary"} loading={busy} className="w-full text-lg">
        {severity === "stop" ? "Send — ground the vehicle" : "Send report"}
      </Button>
    </form>
  );
}
