"use client";

import Link from "next/link";
import { signInAction } from "@/app/(auth)/actions";
import { FormStatus } from "@/components/forms/form-status";
import { SubmitButton } from "@/components/forms/submit-button";
import { useFormAction } from "@/components/forms/use-form-action";
import { Field, Input } from "@/components/ui";

export function SignInForm({ next }: { next?: string }) {
  const { state, formAction, errorOf, valueOf } = useFormAction(signInAction, { toastOnSuccess: false });
  return (
    <form action={formAction} className="flex flex-col gap-4" noValidate>
      <input type="hidden" name="next" value={next ?? "/"} />
      <FormStatus state={state} testId="sign-in-status" />
      <Field label="E-mail" error={errorOf("email")} required>
        <Input name="email" type="email" autoComplete="username" defaultValue={valueOf("email")} size="lg" />
      </Field>
      <Field label="Password" error={errorOf("password")} required>
        <Input name="password" type="password" autoComplete="current-password" size="lg" />
      </Field>
      <SubmitButton size="lg" className="w-full">
        Sign in
      </SubmitButton>
      <Link href="/forgot-password" className="self-center text-sm font-medium text-accent underline underline-offset-4">
        Forgot your password?
      </Link>
    </form>
  );
}
