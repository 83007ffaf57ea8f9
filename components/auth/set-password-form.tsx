"use client";

import { setPasswordAction } from "@/app/(auth)/actions";
import { FormStatus } from "@/components/forms/form-status";
import { SubmitButton } from "@/components/forms/submit-button";
import { useFormAction } from "@/components/forms/use-form-action";
import { Field, Input } from "@/components/ui";

export function SetPasswordForm({ token, email }: { token: string; email: string }) {
  const { state, formAction, errorOf } = useFormAction(setPasswordAction, { toastOnSuccess: false });
  return (
    <form action={formAction} className="flex flex-col gap-4" noValidate>
      <input type="hidden" name="token" value={token} />
      <input type="hidden" name="username" value={email} autoComplete="username" />
      <FormStatus state={state} testId="password-status" />
      <Field label="New password" hint="At least 10 characters." error={errorOf("password")} required>
        <Input name="password" type="password" autoComplete="new-password" size="lg" />
      </Field>
      <Field label="The same password again" error={errorOf("confirm")} required>
        <Input name="confirm" type="password" autoComplete="new-password" size="lg" />
      </Field>
      <SubmitButton size="lg" className="w-full">
        Save password
      </SubmitButton>
    </form>
  );
}
