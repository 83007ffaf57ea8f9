"use server";

import { revalidatePath } from "next/cache";
import { createPlatform, updatePlatform } from "@/lib/commands/platforms";
import { runFormAction } from "@/lib/server/actions";
import type { FormState } from "@/lib/server/form-state";

export async function createPlatformAction(_prev: FormState, formData: FormData) {
  const state = await runFormAction(createPlatform, formData, (r) => `${r.name} added`);
  if (state.status === "ok") revalidatePath("/platforms");
  return state;
}

export async function updatePlatformAction(_prev: FormState, formData: FormData) {
  const state = await runFormAction(updatePlatform, formData, (r) =>
    r.ratingsCompleted ? `${r.name} saved; its ratings are complete` : r.ratingsMissing ? `${r.name} saved; some ratings are still missing` : `${r.name} saved`,
  );
  if (state.status === "ok") {
    revalidatePath("/platforms");
    revalidatePath(`/platforms/${state.data?.id}`);
  }
  return state;
}
