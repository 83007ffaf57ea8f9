"use client";

import { updateProfileAction } from "@/app/(app)/profile/actions";
import { FormStatus } from "@/components/forms/form-status";
import { SubmitButton } from "@/components/forms/submit-button";
import { useFormAction } from "@/components/forms/use-form-action";
import { Checkbox, Field, Input } from "@/components/ui";

export function ProfileForm({ name, notifyNonEssential }: { name: string; notifyNonEssential: boolean }) {
  const { state, formAction, errorOf, valueOf } = useFormAction(updateProfileAction);
  return (
    <form action={formAction} className="flex max-w-lg flex-col gap-4" noValidate>
      <FormStatus state={state} testId="profile-status" />
      <Field label="Name" error={errorOf("name")} required>
        <Input name="name" defaultValue={valueOf("name", name)} />
      </Field>
      <Checkbox name="notifyNonEssential" defaultChecked={notifyNonEssential} label="E-mail me non-essential notices (quote and evidence updates). Grounding and safety notices always arrive." />
      <div>
        <SubmitButton>Save</SubmitButton>
      </div>
    </form>
  );
}
