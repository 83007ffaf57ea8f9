"use server";

import { revalidatePath } from "next/cache";
import { triageDefect } from "@/lib/commands/defects";
import { returnVehicleToService } from "@/lib/commands/vehicles";
import { runFormAction } from "@/lib/server/actions";
import type { FormState } from "@/lib/server/form-state";

const DONE: Record<string, string> = {
  triage: "Marked as triaged",
  start_repair: "Repair job linked; the defect is in repair",
  resolve: "Marked as resolved",
  close: "Defect closed",
  merge: "Merged into the report kept",
};

export async function moveDefectAction(_prev: FormState, formData: FormData) {
  const move = String(formData.get("move") ?? "");
  const state = await runFormAction(triageDefect, formData, DONE[move] ?? "Saved");
  if (state.status === "ok") {
    revalidatePath(`/defects/${String(formData.get("id") ?? "")}`);
    revalidatePath("/defects");
  }
  return state;
}

/** Returning a grounded vehicle to service: a manager, with a reason (the register's command). */
export async function returnToServiceAction(_prev: FormState, formData: FormData) {
  const state = await runFormAction(returnVehicleToService, formData, "The vehicle is back in service");
  if (state.status === "ok") {
    const defectId = String(formData.get("defectId") ?? "");
    if (defectId) revalidatePath(`/defects/${defectId}`);
    revalidatePath("/defects");
  }
  return state;
}
