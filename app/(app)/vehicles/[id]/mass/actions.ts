"use server";

import { revalidatePath } from "next/cache";
import { addPlannedItem, planEdition, recordWeighbridgeTicket, removePlannedItem, saveElectricalPlan, updatePlannedItem } from "@/lib/commands/mass";
import { runFormAction } from "@/lib/server/actions";
import type { FormState } from "@/lib/server/form-state";

const tabPath = (formData: FormData) => `/vehicles/${String(formData.get("id") ?? "")}/mass`;

export async function addPlannedItemAction(_prev: FormState, formData: FormData) {
  const state = await runFormAction(addPlannedItem, formData, (item) => `${item.label} added to the plan`);
  if (state.status === "ok") revalidatePath(tabPath(formData));
  return state;
}

export async function updatePlannedItemAction(_prev: FormState, formData: FormData) {
  const state = await runFormAction(updatePlannedItem, formData, (item) => `${item.label} updated`);
  if (state.status === "ok") revalidatePath(tabPath(formData));
  return state;
}

export async function removePlannedItemAction(_prev: FormState, formData: FormData) {
  const state = await runFormAction(removePlannedItem, formData, "Removed from the plan");
  if (state.status === "ok") revalidatePath(tabPath(formData));
  return state;
}

export async function planEditionAction(_prev: FormState, formData: FormData) {
  const state = await runFormAction(planEdition, formData, (r) =>
    r.added.length === 0
      ? `Nothing to add: ${r.edition.label} has no short lines with mass that are not planned already`
      : `${r.added.length} short line${r.added.length === 1 ? "" : "s"} of ${r.edition.label} added to the plan`,
  );
  if (state.status === "ok") revalidatePath(tabPath(formData));
  return state;
}

export async function recordTicketAction(_prev: FormState, formData: FormData) {
  const state = await runFormAction(recordWeighbridgeTicket, formData, (r) =>
    r.measuredUpdated ? `Ticket ${r.ticket.ticketNumber} recorded; the vehicle's measured masses are updated` : `Ticket ${r.ticket.ticketNumber} recorded (older than the last weighing, so the measured masses stay)`,
  );
  if (state.status === "ok") revalidatePath(tabPath(formData));
  return state;
}

export async function saveElectricalPlanAction(_prev: FormState, formData: FormData) {
  const state = await runFormAction(saveElectricalPlan, formData, (r) => `12 V plan saved (version ${r.version})`);
  if (state.status === "ok") revalidatePath(tabPath(formData));
  return state;
}
