"use server";

import { revalidatePath } from "next/cache";
import { createBudget, deleteBudget, updateBudget } from "@/lib/commands/costs";
import { runFormAction } from "@/lib/server/actions";
import type { FormState } from "@/lib/server/form-state";

export async function createBudgetAction(_prev: FormState, formData: FormData) {
  const state = await runFormAction(createBudget, formData, (r) => `Budget saved for ${r.costCentre}`);
  if (state.status === "ok") revalidatePath("/budgets");
  return state;
}

export async function updateBudgetAction(_prev: FormState, formData: FormData) {
  const state = await runFormAction(updateBudget, formData, (r) => `Budget for ${r.costCentre} changed`);
  if (state.status === "ok") revalidatePath("/budgets");
  return state;
}

export async function deleteBudgetAction(_prev: FormState, formData: FormData) {
  const state = await runFormAction(deleteBudget, formData, "Budget removed");
  if (state.status === "ok") revalidatePath("/budgets");
  return state;
}
