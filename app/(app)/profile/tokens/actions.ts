"use server";

import { revalidatePath } from "next/cache";
import { createApiToken, revokeApiToken } from "@/lib/commands/tokens";
import { runFormAction } from "@/lib/server/actions";
import type { FormState } from "@/lib/server/form-state";

export async function createTokenAction(_prev: FormState, formData: FormData) {
  const state = await runFormAction(createApiToken, formData, (r) => `Token "${r.name}" created`);
  if (state.status === "ok") revalidatePath("/profile/tokens");
  return state;
}

export async function revokeTokenAction(_prev: FormState, formData: FormData) {
  const state = await runFormAction(revokeApiToken, formData, "Token revoked; it no longer works");
  if (state.status === "ok") revalidatePath("/profile/tokens");
  return state;
}
