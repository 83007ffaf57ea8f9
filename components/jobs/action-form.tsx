"use client";

import type { ReactNode } from "react";
import { FormStatus } from "@/components/forms/form-status";
import { SubmitButton } from "@/components/forms/submit-button";
import { useFormAction } from "@/components/forms/use-form-action";
import { Field, Textarea, type ButtonProps } from "@/components/ui";
import type { FormState } from "@/lib/server/form-state";

type Action = (state: FormState, formData: FormData) => Promise<FormState>;

/**
 * One button (and optionally a reason) that runs one server action: moves of a job, decisions,
 * reviews. Hidden values say what it acts on; the message shows beside it.
 */
export function ActionForm({
  action,
  hidden,
  label,
  variant = "secondary",
  size,
  reason,
  testId,
  name,
  children,
}: {
  action: Action;
  hidden: Record<string, string | number>;
  label: string;
  variant?: ButtonProps["variant"];
  size?: ButtonProps["size"];
  reason?: { label: string; name?: string; required?: boolean; hint?: string };
  testId: string;
  /** Accessible name of the form. */
  name?: string;
  children?: ReactNode;
}) {
  const { state, formAction, errorOf, valueOf } = useFormAction(action);
  const reasonName = reason?.name ?? "reason";
  return (
    <form action={formAction} aria-label={name ?? label} className="flex flex-col gap-2" noValidate>
      {Object.entries(hidden).map(([k, v]) => (
        <input key={k} type="hidden" name={k} value={String(v)} />
      ))}
      {children}
      {reason && (
        <Field label={reason.label} hint={reason.hint} error={errorOf(reasonName)} required={reason.required} id={`${testId}-${reasonName}`}>
          <Textarea name={reasonName} rows={2} defaultValue={valueOf(reasonName)} />
        </Field>
      )}
      <div>
        <SubmitButton variant={variant} size={size}>
          {label}
        </SubmitButton>
      </div>
      <FormStatus state={state} testId={`${testId}-status`} />
    </form>
  );
}
