import "server-only";
import type { z } from "zod";
import type { FormState } from "./form-state";
import { executeForRequest, toAppError, type Operation } from "./operation";

/** Form fields → plain object; repeated names (checkbox groups, multi-selects) become arrays. */
export function formDataToObject(formData: FormData): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  for (const [key, value] of formData.entries()) {
    if (key.startsWith("$ACTION")) continue;
    const v = typeof value === "string" ? value : value;
    if (key.endsWith("[]")) {
      const k = key.slice(0, -2);
      out[k] = [...((out[k] as unknown[]) ?? []), v];
    } else if (key in out) {
      const prev = out[key];
      out[key] = Array.isArray(prev) ? [...prev, v] : [prev, v];
    } else {
      out[key] = v;
    }
  }
  return out;
}

function submittedValues(formData: FormData): Record<string, string> {
  const values: Record<string, string> = {};
  for (const [key, value] of formData.entries()) {
    if (typeof value === "string" && !key.startsWith("$ACTION") && !/password/i.test(key)) {
      values[key] = value;
    }
  }
  return values;
}

/**
 * Runs an operation from a form submit and reports in the one form-state shape.
 * Call `redirect`/`revalidatePath` after this returns, never inside it.
 */
export async function runFormAction<S extends z.ZodType, O>(
  op: Operation<S, O>,
  formData: FormData,
  successMessage: string | ((result: O) => string),
  extra: Record<string, unknown> = {},
): Promise<FormState<O>> {
  try {
    const result = await executeForRequest(op, { ...formDataToObject(formData), ...extra });
    return {
      status: "ok",
      message: typeof successMessage === "function" ? successMessage(result) : successMessage,
      data: result,
    };
  } catch (error) {
    const appError = toAppError(error);
    const fieldErrors: Record<string, string> = {};
    for (const d of appError.details) if (d.field && !fieldErrors[d.field]) fieldErrors[d.field] = d.message;
    return {
      status: "error",
      message: appError.message,
      fieldErrors,
      values: submittedValues(formData),
    };
  }
}
