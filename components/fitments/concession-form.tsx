"use client";

import { endConcessionAction, grantConcessionAction } from "@/app/(app)/vehicles/[id]/spec/actions";
import { FormStatus } from "@/components/forms/form-status";
import { SubmitButton } from "@/components/forms/submit-button";
import { useFormAction } from "@/components/forms/use-form-action";
import { Field, Input, Select, Textarea } from "@/components/ui";

/** A manager's reasoned, expiring exception to one line of the vehicle's edition. */
export function ConcessionForm({ vehicleId, lines, defaultExpiry }: { vehicleId: string; lines: { key: string; code: string; title: string; statusWord: string }[]; defaultExpiry: string }) {
  const { state, formAction, errorOf, valueOf } = useFormAction(grantConcessionAction);
  return (
    <form action={formAction} noValidate className="flex flex-col gap-3" aria-label="Grant a concession">
      <input type="hidden" name="vehicleId" value={vehicleId} />
      <FormStatus state={state} testId="concession-status" />
      <Field label="Line" error={errorOf("lineKey")} required id="concession-line">
        <Select name="lineKey" defaultValue={valueOf("lineKey", lines[0]?.key)}>
          {lines.map((l) => (
            <option key={l.key} value={l.key}>
              {l.code} {l.title} — {l.statusWord}
            </option>
          ))}
        </Select>
      </Field>
      <Field label="Reason" error={errorOf("reason")} required id="concession-reason" hint="Why the vehicle may go without it, and any limit meanwhile">
        <Textarea name="reason" rows={2} defaultValue={valueOf("reason")} />
      </Field>
      <Field label="Until" error={errorOf("expiresAt")} required id="concession-expires" hint="At most twelve months">
        <Input name="expiresAt" type="date" defaultValue={valueOf("expiresAt", defaultExpiry)} />
      </Field>
      <div>
        <SubmitButton variant="secondary">Grant concession</SubmitButton>
      </div>
    </form>
  );
}

export function EndConcessionButton({ concessionId }: { concessionId: string }) {
  const { state, formAction } = useFormAction(endConcessionAction);
  return (
    <form action={formAction} className="flex flex-col items-end gap-1">
      <input type="hidden" name="id" value={concessionId} />
      <SubmitButton variant="ghost" size="sm">
        End now
      </SubmitButton>
      {state.status === "error" && <FormStatus state={state} testId={`end-${concessionId}-status`} />}
    </form>
  );
}
