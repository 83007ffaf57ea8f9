"use client";

import { offerJobAction } from "@/app/(app)/jobs/actions";
import { FormStatus } from "@/components/forms/form-status";
import { SubmitButton } from "@/components/forms/submit-button";
import { useFormAction } from "@/components/forms/use-form-action";
import { Checkbox, Field, Input } from "@/components/ui";

/** Offer the job to one or more workshops, with the date quotes are due. */
export function OfferForm({ jobId, firms, dueAt }: { jobId: string; firms: { id: string; name: string; offered: boolean }[]; dueAt: string }) {
  const { state, formAction, errorOf, valueOf } = useFormAction(offerJobAction);
  const open = firms.filter((f) => !f.offered);
  if (open.length === 0) return <p className="text-muted">Every workshop taking work has been asked.</p>;
  return (
    <form action={formAction} aria-label="Offer to workshops" className="flex flex-col gap-3" noValidate>
      <input type="hidden" name="id" value={jobId} />
      <fieldset className="flex flex-col gap-1">
        <legend className="mb-1 font-semibold">Workshops</legend>
        {open.map((f) => (
          <Checkbox key={f.id} name="firmIds[]" value={f.id} label={f.name} />
        ))}
        {errorOf("firmIds") && <p className="text-sm font-semibold text-danger">{errorOf("firmIds")}</p>}
      </fieldset>
      <Field label="Quotes due by" error={errorOf("dueAt")} id={`offer-due-${jobId}`}>
        <Input name="dueAt" type="date" defaultValue={valueOf("dueAt", dueAt)} />
      </Field>
      <div>
        <SubmitButton>Send the offer</SubmitButton>
      </div>
      <FormStatus state={state} testId="offer-status" />
    </form>
  );
}
