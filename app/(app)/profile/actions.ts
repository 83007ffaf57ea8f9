"use server";

import { revalidatePath } from "next/cache";
import { updateProfile } from "@/lib/commands/profile";
import { runFormAction } from "@/lib/server/actions";
import type { FormState } from "@/lib/server/form-state";

export async function updateProfileAction(_prev: FormState, formData: FormData) {
  const state = await runFormAction(updateProfile, formData, "Profile saved");
  if (state.status === "ok") revalidatePath("/", "layout");
  return state;
}
