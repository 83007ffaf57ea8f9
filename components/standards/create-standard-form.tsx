"use client";

import { createStandardAction } from "@/app/(app)/standards/actions";
import { FormStatus } from "@/components/forms/form-status";
import { SubmitButton } from "@/components/forms/submit-button";
import { useFormAction } from "@/components/forms/use-form-action";
import { Field, Input, Textarea } from "@/components/ui";

export function CreateStandardForm() {
  const { state, formAction, errorOf, valueOf } = useFormAction(createStandardAction);
  return (
    <form action={formAction} noValidate className="flex flex-col gap-3">
      <FormStatus state={state} testId="create-standard-status" />
      <Field label="Name" error={errorOf("name")} required id="standard-name" hint="For example “Remote duty fit-out”">
        <Input name="name" defaultValue={valueOf("name")} />
      </Field>
      <Field label="What it is for" error={errorOf("description")} id="standard-description">
        <Textarea name="description" rows={2} defaultValue={valueOf("description")} />
      </Field>
      <div>
        <SubmitButton>Create standard</SubmitButton>
      </div>
    </form>
  );
}
