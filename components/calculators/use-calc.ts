"use client";

import { useMutation } from "@tanstack/react-query";
import { CalcError, errorsByField, postCalc } from "./api";

/**
 * One calculator's request: a mutation that POSTs the body to its route. `errorOf(field)` gives
 * the API's message for a field (a dotted path such as "items.2.massKg").
 */
export function useCalc<TResult>(path: string) {
  const mutation = useMutation<TResult, CalcError, unknown>({
    mutationFn: (body) => postCalc<TResult>(path, body),
  });
  const fieldErrors = errorsByField(mutation.error);
  return {
    run: mutation.mutate,
    pending: mutation.isPending,
    result: mutation.isSuccess ? mutation.data : undefined,
    error: mutation.error ?? null,
    errorOf: (field: string): string | undefined => fieldErrors[field],
  };
}
