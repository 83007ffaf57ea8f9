"use server";

import { revalidatePath } from "next/cache";
import { createManualCost } from "@/lib/commands/costs";
import { runFormAction } from "@/lib/server/actions";
import type { FormState } from "@/lib/server/form-state";

export async function createManualCostAction(_prev: FormState, formData: FormData) {
  const state = await runFormAction(createManualCost, formData, (r) => `Booked ${(r.totalCents / 100).toLocaleString("en-AU", { style: "currency", currency: "AUD" })} incl. GST to ${r.costCentre}`);
  if (state.status === "ok") {
    revalidatePath("/costs");
    revalidatePath("/budgets");
  }
  return state;
}
