"use client";

import { useActionState, useEffect, useRef } from "react";
import { toast } from "sonner";
import { initialFormState, type FormState } from "@/lib/server/form-state";

type FormAction<T> = (state: FormState<T>, formData: FormData) => Promise<FormState<T>>;

/**
 * The one form pattern: a server action that returns FormState, a toast when it succeeds,
 * and helpers that put errors beside fields and keep what the user typed after a failure.
 */
export function useFormAction<T>(action: FormAction<T>, options: { toastOnSuccess?: boolean } = {}) {
  const [state, formAction, pending] = useActionState(action, initialFormState as FormState<T>);
  const seen = useRef<FormState<T> | null>(null);
  useEffect(() => {
    if (state === seen.current) return;
    seen.current = state;
    if (state.status === "ok" && state.message && options.toastOnSuccess !== false) toast.success(state.message);
  }, [state, options.toastOnSuccess]);
  return {
    state,
    formAction,
    pending,
    errorOf: (field: string) => state.fieldErrors?.[field],
    valueOf: (field: string, fallback?: string | null) => state.values?.[field] ?? fallback ?? undefined,
  };
}
