"use server";

import { revalidatePath } from "next/cache";
import { createVehicle, groundVehicle, returnVehicleToService, updateVehicle } from "@/lib/commands/vehicles";
import { runFormAction } from "@/lib/server/actions";
import type { FormState } from "@/lib/server/form-state";

export async function createVehicleAction(_prev: FormState, formData: FormData) {
  const state = await runFormAction(createVehicle, formData, (r) => `${r.fleetNumber} added to the register`);
  if (state.status === "ok") revalidatePath("/vehicles");
  return state;
}

export async function updateVehicleAction(_prev: FormState, formData: FormData) {
  const state = await runFormAction(updateVehicle, formData, (r) => (r.changed.length === 0 ? "Nothing had changed" : "Vehicle saved"));
  if (state.status === "ok") revalidatePath(`/vehicles/${state.data?.id}`, "layout");
  return state;
}

export async function groundVehicleAction(_prev: FormState, formData: FormData) {
  const state = await runFormAction(groundVehicle, formData, "Vehicle grounded");
  if (state.status === "ok") revalidatePath(`/vehicles/${state.data?.id}`, "layout");
  return state;
}

export async function returnToServiceAction(_prev: FormState, formData: FormData) {
  const state = await runFormAction(returnVehicleToService, formData, "Vehicle returned to service");
  if (state.status === "ok") revalidatePath(`/vehicles/${state.data?.id}`, "layout");
  return state;
}
