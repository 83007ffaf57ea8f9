"use server";

import { AuthError } from "next-auth";
import { redirect } from "next/navigation";
import { requestPasswordReset, setPasswordWithToken } from "@/lib/commands/passwords";
import { signIn, signOut } from "@/lib/server/auth";
import { toAppError } from "@/lib/server/errors";
import type { FormState } from "@/lib/server/form-state";

function safeNext(value: FormDataEntryValue | null): string {
  const next = typeof value === "string" ? value : "";
  // Only paths inside the app, never another site.
  return next.startsWith("/") && !next.startsWith("//") ? next : "/";
}

export async function signInAction(_prev: FormState, formData: FormData): Promise<FormState> {
  const email = String(formData.get("email") ?? "").trim();
  const password = String(formData.get("password") ?? "");
  const fieldErrors: Record<string, string> = {};
  if (!email) fieldErrors.email = "Enter your e-mail address";
  if (!password) fieldErrors.password = "Enter your password";
  if (Object.keys(fieldErrors).length) {
    return { status: "error", message: "Enter your e-mail and password", fieldErrors, values: { email } };
  }
  try {
    await signIn("credentials", { email, password, redirect: false });
  } catch (error) {
    if (error instanceof AuthError) {
      const code = (error as AuthError & { code?: string }).code;
      if (code === "rate_limited") {
        return {
          status: "error",
          message: "Too many sign-in attempts. Wait 15 minutes, then try again, or reset your password.",
          values: { email },
        };
      }
      return { status: "error", message: "That e-mail and password do not match an active account.", values: { email } };
    }
    throw error;
  }
  redirect(safeNext(formData.get("next")));
}

export async function signOutAction(): Promise<void> {
  await signOut({ redirect: false });
  redirect("/sign-in?signedOut=1");
}

export async function requestResetAction(_prev: FormState, formData: FormData): Promise<FormState> {
  const email = String(formData.get("email") ?? "");
  try {
    await requestPasswordReset(email);
  } catch (error) {
    const appError = toAppError(error);
    return { status: "error", message: "Enter a valid e-mail address", fieldErrors: { email: appError.details[0]?.message ?? "Enter a valid e-mail address" }, values: { email } };
  }
  return {
    status: "ok",
    message: "If that address belongs to an account, a reset link is on its way. It works once and for one hour.",
  };
}

export async function setPasswordAction(_prev: FormState, formData: FormData): Promise<FormState> {
  try {
    await setPasswordWithToken({
      token: formData.get("token"),
      password: formData.get("password"),
      confirm: formData.get("confirm"),
    });
  } catch (error) {
    const appError = toAppError(error);
    const fieldErrors: Record<string, string> = {};
    for (const d of appError.details) if (d.field) fieldErrors[d.field] = d.message;
    return { status: "error", message: appError.message, fieldErrors };
  }
  redirect("/sign-in?passwordSet=1");
}
