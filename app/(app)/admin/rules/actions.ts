"use server";

import { revalidatePath } from "next/cache";
import { chooseRuleSet, copyRuleSet, updateRuleSet } from "@/lib/commands/rules";
import { runFormAction } from "@/lib/server/actions";
import type { FormState } from "@/lib/server/form-state";

export async function chooseRuleSetAction(_prev: FormState, formData: FormData) {
  const state = await runFormAction(chooseRuleSet, formData, (r) => `${r.name} is now the organisation's rule set`);
  if (state.status === "ok") revalidatePath("/admin/rules");
  return state;
}

export async function copyRuleSetAction(_prev: FormState, formData: FormData) {
  const state = await runFormAction(copyRuleSet, formData, (r) => `${r.name} created: edit it to your local rules`);
  if (state.status === "ok") revalidatePath("/admin/rules");
  return state;
}

export async function updateRuleSetAction(_prev: FormState, formData: FormData) {
  const state = await runFormAction(updateRuleSet, formData, (r) => `${r.name} saved`);
  if (state.status === "ok") revalidatePath("/admin/rules");
  return state;
}
