"use server";

import { revalidatePath } from "next/cache";
import { endConcession, grantConcession, recordFitment, removeFitment } from "@/lib/commands/fitments";
import { runFormAction } from "@/lib/server/actions";
import type { FormState } from "@/lib/server/form-state";

const specPath = (vehicleId: string) => `/vehicles/${vehicleId}/spec`;

export async function recordFitmentAction(_prev: FormState, formData: FormData) {
  const state = await runFormAction(recordFitment, formData, (r) => `Recorded: ${r.label}`);
  if (state.status === "ok" && state.data) revalidatePath(specPath(state.data.vehicleId));
  return state;
}

export async function removeFitmentAction(_prev: FormState, formData: FormData) {
  const state = await runFormAction(removeFitment, formData, "Fitment removed; the record is kept with today's date");
  if (state.status === "ok" && state.data) revalidatePath(specPath(state.data.vehicleId));
  return state;
}

export async function grantConcessionAction(_prev: FormState, formData: FormData) {
  const state = await runFormAction(grantConcession, formData, "Concession granted");
  if (state.status === "ok" && state.data) revalidatePath(specPath(state.data.vehicleId));
  return state;
}

export async function endConcessionAction(_prev: FormState, formData: FormData) {
  const state = await runFormAction(endConcession, formData, "Concession ended");
  if (state.status === "ok" && state.data) revalidatePath(specPath(state.data.vehicleId));
  return state;
}
