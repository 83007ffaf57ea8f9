"use client";

import { publishEditionAction, retireEditionAction, startDraftAction } from "@/app/(app)/standards/actions";
import { FormStatus } from "@/components/forms/form-status";
import { SubmitButton } from "@/components/forms/submit-button";
import { useFormAction } from "@/components/forms/use-form-action";

type Props = { standardId: string; editionId: string; number: number };

export function PublishButton({ standardId, editionId, number }: Props) {
  const { state, formAction } = useFormAction(publishEditionAction);
  return (
    <form action={formAction} className="flex flex-col items-end gap-2">
      <input type="hidden" name="standardId" value={standardId} />
      <input type="hidden" name="id" value={editionId} />
      <SubmitButton>Publish edition {number}</SubmitButton>
      {state.status === "error" && <FormStatus state={state} testId="publish-status" />}
    </form>
  );
}

export function StartDraftButton({ standardId, editionId, label = "Start new draft" }: Props & { label?: string }) {
  const { state, formAction } = useFormAction(startDraftAction);
  return (
    <form action={formAction} className="flex flex-col items-end gap-2">
      <input type="hidden" name="standardId" value={standardId} />
      <input type="hidden" name="fromEditionId" value={editionId} />
      <SubmitButton variant="secondary">{label}</SubmitButton>
      {state.status === "error" && <FormStatus state={state} testId="draft-status" />}
    </form>
  );
}

export function RetireButton({ standardId, editionId, number }: Props) {
  const { state, formAction } = useFormAction(retireEditionAction);
  return (
    <form action={formAction} className="flex flex-col items-end gap-2">
      <input type="hidden" name="standardId" value={standardId} />
      <input type="hidden" name="id" value={editionId} />
      <SubmitButton variant="ghost">Retire edition {number}</SubmitButton>
      {state.status === "error" && <FormStatus state={state} testId="retire-status" />}
    </form>
  );
}
