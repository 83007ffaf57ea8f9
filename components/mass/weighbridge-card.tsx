"use client";

import { useCallback, useState } from "react";
import { recordTicketAction } from "@/app/(app)/vehicles/[id]/mass/actions";
import { FormStatus } from "@/components/forms/form-status";
import { SubmitButton } from "@/components/forms/submit-button";
import { useFormAction } from "@/components/forms/use-form-action";
import { Caution, EmptyState, Field, Input, Quantity, StatusPill, Table, TBody, Td, Th, THead, Tr } from "@/components/ui";
import type { Reconciliation } from "@/lib/commands/mass";
import type { FormState } from "@/lib/server/form-state";
import { acceptAttribute } from "@/lib/uploads/checks";
import { WEIGHBRIDGE_CAUTION } from "./cautions";
import { formatCalendarDay } from "@/lib/format/dates";

type TicketFile = { filename: string; contentType: string; sizeBytes: number; href: string };
type Ticket = { id: string; ticketNumber: string; weighedAt: string; frontKg: number; rearKg: number; grossKg: number; file: TicketFile | null };

const FILE_WORDS: Record<string, string> = { "application/pdf": "PDF", "image/jpeg": "JPEG", "image/png": "PNG" };

function sizeWords(bytes: number): string {
  return bytes < 1024 * 1024 ? `${Math.max(1, Math.round(bytes / 1024))} KB` : `${(bytes / (1024 * 1024)).toFixed(1)} MB`;
}

const WHAT = { front: "Front axle", rear: "Rear axle", gross: "Gross" } as const;

function today(): string {
  const d = new Date();
  return `${d.getFullYear()}-${String(d.getMonth() + 1).padStart(2, "0")}-${String(d.getDate()).padStart(2, "0")}`;
}

function TicketForm({ vehicleId }: { vehicleId: string }) {
  const [formKey, setFormKey] = useState(0);
  // A recorded ticket clears the form for the next one.
  const action = useCallback(async (prev: FormState, formData: FormData) => {
    const next = (await recordTicketAction(prev, formData)) as FormState;
    if (next.status === "ok") setFormKey((k) => k + 1);
    return next;
  }, []);
  const { state, formAction, errorOf, valueOf } = useFormAction(action);
  return (
    <form key={formKey} action={formAction} className="grid grid-cols-2 gap-3 md:grid-cols-5" noValidate aria-label="Record a weighbridge ticket" encType="multipart/form-data">
      <input type="hidden" name="id" value={vehicleId} />
      <div className="col-span-2 md:col-span-5">
        <FormStatus state={state} testId="ticket-status" />
      </div>
      <Field label="Weighed on" error={errorOf("weighedAt")} required>
        <Input type="date" name="weighedAt" defaultValue={valueOf("weighedAt", today())} max={today()} />
      </Field>
      <Field label="Ticket number" error={errorOf("ticketNumber")} required>
        <Input name="ticketNumber" defaultValue={valueOf("ticketNumber")} maxLength={40} />
      </Field>
      <Field label="Front axle (kg)" error={errorOf("frontKg")} required>
        <Input name="frontKg" inputMode="decimal" defaultValue={valueOf("frontKg")} />
      </Field>
      <Field label="Rear axle (kg)" error={errorOf("rearKg")} required>
        <Input name="rearKg" inputMode="decimal" defaultValue={valueOf("rearKg")} />
      </Field>
      <Field label="Gross (kg)" error={errorOf("grossKg")} required>
        <Input name="grossKg" inputMode="decimal" defaultValue={valueOf("grossKg")} />
      </Field>
      <div className="col-span-2 md:col-span-5">
        <Field label="Ticket file (optional)" hint="A PDF, or a photo of the ticket (JPEG, PNG or WebP), up to 10 MiB. Location data is removed from photos." error={errorOf("file")}>
          <Input type="file" name="file" accept={acceptAttribute("weighbridge_ticket")} />
        </Field>
      </div>
      <div className="col-span-2 md:col-span-5">
        <SubmitButton>Record ticket</SubmitButton>
      </div>
    </form>
  );
}

/** Weighbridge tickets of the vehicle and the newest one reconciled against the computed figures. */
export function WeighbridgeCard({
  vehicleId,
  tickets,
  reconciliation,
  canRecord,
}: {
  vehicleId: string;
  tickets: Ticket[];
  reconciliation: Reconciliation | null;
  canRecord: boolean;
}) {
  return (
    <div className="flex flex-col gap-4">
      {reconciliation && "unavailable" in reconciliation && <p className="text-sm text-muted">{reconciliation.unavailable}</p>}
      {reconciliation && "rows" in reconciliation && (
        <div className="flex flex-col gap-2" data-testid="reconciliation">
          <div className="flex flex-wrap items-center gap-3">
            <h3 className="font-semibold">Last ticket against the plan</h3>
            <StatusPill tone={reconciliation.ok ? "ok" : "warn"} size="sm">
              {reconciliation.ok ? "Matches" : "Differs"}
            </StatusPill>
            <span className="text-sm text-muted">Tolerance ±{reconciliation.toleranceKg} kg (organisation setting)</span>
          </div>
          <Table label="Weighed against computed">
            <THead>
              <Tr>
                <Th />
                <Th numeric>Computed</Th>
                <Th numeric>Weighed</Th>
                <Th numeric>Difference</Th>
                <Th>Status</Th>
              </Tr>
            </THead>
            <TBody>
              {reconciliation.rows.map((row) => (
                <Tr key={row.what}>
                  <Th scope="row">{WHAT[row.what]}</Th>
                  <Td numeric>
                    <Quantity value={row.computedKg} unit="kg" />
                  </Td>
                  <Td numeric>
                    <Quantity value={row.measuredKg} unit="kg" />
                  </Td>
                  <Td numeric>
                    <Quantity value={row.differenceKg} unit="kg" signed />
                  </Td>
                  <Td>
                    <StatusPill tone={row.withinTolerance ? "ok" : "warn"} size="sm">
                      {row.withinTolerance ? "Within tolerance" : "Beyond tolerance"}
                    </StatusPill>
                  </Td>
                </Tr>
              ))}
            </TBody>
          </Table>
          <p className="text-sm text-muted">{reconciliation.computedFrom}</p>
          {reconciliation.flags.length > 0 && (
            <ul className="list-disc pl-5 text-sm">
              {reconciliation.flags.map((f) => (
                <li key={f.code}>{f.message}</li>
              ))}
            </ul>
          )}
        </div>
      )}
      {tickets.length === 0 ? (
        <EmptyState title="No weighbridge ticket yet">The figures start from the maker&apos;s kerb masses until the fitted vehicle is weighed.</EmptyState>
      ) : (
        <Table label="Weighbridge tickets">
          <THead>
            <Tr>
              <Th>Weighed on</Th>
              <Th>Ticket</Th>
              <Th numeric>Front</Th>
              <Th numeric>Rear</Th>
              <Th numeric>Gross</Th>
              <Th>File</Th>
            </Tr>
          </THead>
          <TBody>
            {tickets.map((t) => (
              <Tr key={t.id}>
                <Td>{formatCalendarDay(t.weighedAt)}</Td>
                <Td>{t.ticketNumber}</Td>
                <Td numeric>
                  <Quantity value={t.frontKg} unit="kg" />
                </Td>
                <Td numeric>
                  <Quantity value={t.rearKg} unit="kg" />
                </Td>
                <Td numeric>
                  <Quantity value={t.grossKg} unit="kg" />
                </Td>
                <Td>
                  {t.file ? (
                    <a href={t.file.href} download={t.file.filename} className="font-semibold text-accent underline underline-offset-2 hover:text-accent-hover" data-testid="ticket-file">
                      {t.file.filename}
                      <span className="sr-only"> (ticket {t.ticketNumber})</span>
                      <span className="ml-1 text-sm text-muted">
                        {FILE_WORDS[t.file.contentType] ?? "file"}, {sizeWords(t.file.sizeBytes)}
                      </span>
                    </a>
                  ) : (
                    <span className="text-sm text-muted">No file</span>
                  )}
                </Td>
              </Tr>
            ))}
          </TBody>
        </Table>
      )}
      {canRecord && <TicketForm vehicleId={vehicleId} />}
      <Caution text={WEIGHBRIDGE_CAUTION} />
    </div>
  );
}
