"use client";

import { removeFitmentAction } from "@/app/(app)/vehicles/[id]/spec/actions";
import { FormStatus } from "@/components/forms/form-status";
import { SubmitButton } from "@/components/forms/submit-button";
import { useFormAction } from "@/components/forms/use-form-action";

export function RemoveFitmentButton({ fitmentId, label }: { fitmentId: string; label: string }) {
  const { state, formAction } = useFormAction(removeFitmentAction);
  return (
    <form action={formAction} className="flex flex-col items-end gap-1">
      <input type="hidden" name="id" value={fitmentId} />
      <SubmitButton variant="ghost" size="sm" aria-label={`Remove ${label}`}>
        Remove
      </SubmitButton>
      {state.status === "error" && <FormStatus state={state} testId={`remove-${fitmentId}-status`} />}
    </form>
  );
}
