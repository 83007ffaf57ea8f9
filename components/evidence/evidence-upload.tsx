"use client";

import { useRouter } from "next/navigation";
import { useRef, useState, type FormEvent } from "react";
import { Button, Field, FormMessage, Input, Select } from "@/components/ui";
import { acceptAttribute, type EvidenceUploadKind } from "@/lib/uploads/checks";

type Criterion = { attribute: string; label?: string; unit?: string; op: string; value: unknown };
type Line = { lineKey: string; description: string; criteria: Criterion[]; evidenceNeeded: string[] };

const KINDS = [
  { value: "photo", label: "Photo of the fitted item" },
  { value: "certificate", label: "Certificate (PDF or photo)" },
  { value: "engineering_signoff", label: "Engineering sign-off" },
  { value: "weighbridge_ticket", label: "Weighbridge ticket" },
] as const;

type ErrorBody = { error?: { message?: string; details?: { field?: string; message: string }[] } };

/**
 * Lodge one piece of evidence with upload progress (the file goes straight to the API as
 * multipart form data). For a spec line, the measured values its criteria ask for are typed in.
 */
export function EvidenceUpload({ jobId, lines }: { jobId: string; lines: Line[] }) {
  const router = useRouter();
  const formRef = useRef<HTMLFormElement>(null);
  const [lineKey, setLineKey] = useState(lines[0]?.lineKey ?? "");
  const [kind, setKind] = useState<EvidenceUploadKind>("photo");
  const [progress, setProgress] = useState<number | null>(null);
  const [message, setMessage] = useState<{ tone: "success" | "error"; text: string } | null>(null);
  const [fieldErrors, setFieldErrors] = useState<Record<string, string>>({});
  const line = lines.find((l) => l.lineKey === lineKey);

  function submit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const data = new FormData(event.currentTarget);
    setMessage(null);
    setFieldErrors({});
    setProgress(0);
    const request = new XMLHttpRequest();
    request.open("POST", `/api/jobs/${jobId}/evidence`);
    request.upload.onprogress = (e) => {
      if (e.lengthComputable) setProgress(Math.round((e.loaded / e.total) * 100));
    };
    request.onerror = () => {
      setProgress(null);
      setMessage({ tone: "error", text: "The upload did not reach the server. Check the connection and try again." });
    };
    request.onload = () => {
      setProgress(null);
      if (request.status === 201) {
        setMessage({ tone: "success", text: "Evidence lodged; the fleet manager will review it" });
        formRef.current?.reset();
        setKind("photo");
        router.refresh();
        return;
      }
      let body: ErrorBody = {};
      try {
        body = JSON.parse(request.responseText) as ErrorBody;
      } catch {
        /* not JSON */
      }
      const errors: Record<string, string> = {};
      for (const d of body.error?.details ?? []) if (d.field && !errors[d.field]) errors[d.field] = d.message;
      setFieldErrors(errors);
      setMessage({ tone: "error", text: body.error?.message ?? `The upload failed (${request.status})` });
    };
    request.send(data);
  }

  return (
    <form ref={formRef} onSubmit={submit} aria-label="Lodge evidence" className="flex flex-col gap-4" noValidate>
      <div className="grid grid-cols-1 gap-4 md:grid-cols-2">
        <Field label="For line" id="evidence-line" error={fieldErrors.lineKey}>
          <Select size="lg" name="lineKey" value={lineKey} onChange={(e) => setLineKey(e.target.value)}>
            {lines.map((l) => (
              <option key={l.lineKey} value={l.lineKey}>
                {l.description}
              </option>
            ))}
            <option value="">The whole job (no single line)</option>
          </Select>
        </Field>
        <Field label="Kind of evidence" id="evidence-kind" error={fieldErrors.kind} hint={line?.evidenceNeeded.length ? `This line needs: ${line.evidenceNeeded.map((k) => k.replace("_", " ")).join(", ")}` : undefined}>
          <Select size="lg" name="kind" value={kind} onChange={(e) => setKind(e.target.value as EvidenceUploadKind)}>
            {KINDS.map((k) => (
              <option key={k.value} value={k.value}>
                {k.label}
              </option>
            ))}
          </Select>
        </Field>
      </div>
      {line && line.criteria.length > 0 && kind !== "weighbridge_ticket" && (
        <fieldset className="grid grid-cols-1 gap-4 md:grid-cols-2">
          <legend className="mb-1 font-semibold">What you fitted</legend>
          {line.criteria.map((c) => (
            <Field key={c.attribute} label={`${c.label ?? c.attribute}${c.unit ? ` (${c.unit})` : ""}`} hint={`Standard: ${c.op} ${Array.isArray(c.value) ? c.value.join("–") : String(c.value)}`} id={`evidence-attr-${c.attribute}`}>
              <Input size="lg" name={`attr.${c.attribute}`} />
            </Field>
          ))}
        </fieldset>
      )}
      {kind === "weighbridge_ticket" && (
        <fieldset className="grid grid-cols-1 gap-4 md:grid-cols-3">
          <legend className="mb-1 font-semibold">From the ticket</legend>
          <Field label="Ticket number" id="wb-number" error={fieldErrors.ticketNumber} required>
            <Input size="lg" name="ticketNumber" />
          </Field>
          <Field label="Weighed on" id="wb-date" error={fieldErrors.weighedAt}>
            <Input size="lg" type="date" name="weighedAt" />
          </Field>
          <div />
          <Field label="Front axle (kg)" id="wb-front" error={fieldErrors.frontKg} required>
            <Input size="lg" name="frontKg" inputMode="decimal" />
          </Field>
          <Field label="Rear axle (kg)" id="wb-rear" error={fieldErrors.rearKg} required>
            <Input size="lg" name="rearKg" inputMode="decimal" />
          </Field>
          <Field label="Gross (kg)" id="wb-gross" error={fieldErrors.grossKg} required>
            <Input size="lg" name="grossKg" inputMode="decimal" />
          </Field>
        </fieldset>
      )}
      <Field label="File" hint={`${kind === "photo" ? "A photo (JPEG, PNG or WebP)" : "A photo (JPEG, PNG or WebP) or a PDF"}, up to 10 MiB. Photos are stored without their location data.`} id="evidence-file" error={fieldErrors.file} required>
        <Input size="lg" type="file" name="file" accept={acceptAttribute(kind)} />
      </Field>
      {progress !== null && (
        <div className="flex items-center gap-3">
          <progress max={100} value={progress} aria-label="Upload progress" className="h-3 w-64" />
          <span className="tabular-nums text-sm">{progress} %</span>
        </div>
      )}
      <div>
        <Button type="submit" size="lg" disabled={progress !== null} loading={progress !== null}>
          Upload evidence
        </Button>
      </div>
      <FormMessage tone={message?.tone ?? "info"} data-testid="evidence-upload-status">
        {message?.text}
      </FormMessage>
    </form>
  );
}
