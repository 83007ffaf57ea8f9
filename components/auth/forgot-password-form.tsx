"use client";

import { requestResetAction } from "@/app/(auth)/actions";
import { FormStatus } from "@/components/forms/form-status";
import { SubmitButton } from "@/components/forms/submit-button";
import { useFormAction } from "@/components/forms/use-form-action";
import { Field, Input } from "@/components/ui";

export function ForgotPasswordForm() {
  const { state, formAction, errorOf, valueOf } = useFormAction(requestResetAction, { toastOnSuccess: false });
  return (
    <form action={formAction} className="flex flex-col gap-4" noValidate>
      <FormStatus state={state} testId="reset-status" />
      <Field label="E-mail" error={errorOf("email")} required>
        <Input name="email" type="email" autoComplete="username" defaultValue={valueOf("email")} size="lg" />
      </Field>
      <SubmitButton size="lg" className="w-full">
        Send me a reset link
      </SubmitButton>
    </form>
  );
}
