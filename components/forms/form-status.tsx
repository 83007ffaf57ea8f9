"use client";

import { FormMessage } from "@/components/ui";
import type { FormState } from "@/lib/server/form-state";

/** The form-level message of a FormState, in a named live region. */
export function FormStatus({ state, testId = "form-status" }: { state: FormState<unknown>; testId?: string }) {
  if (state.status === "idle" || !state.message) return <FormMessage tone="info" data-testid={testId} />;
  return (
    <FormMessage tone={state.status === "ok" ? "success" : "error"} data-testid={testId}>
      {state.message}
    </FormMessage>
  );
}
