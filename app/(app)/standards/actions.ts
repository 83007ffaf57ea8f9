"use server";

import { revalidatePath } from "next/cache";
import { redirect } from "next/navigation";
import {
  addLine,
  confirmRollout,
  createStandard,
  deleteLine,
  previewRollout,
  publishEdition,
  retireEdition,
  startDraft,
  updateLine,
} from "@/lib/commands/standards";
import { runFormAction } from "@/lib/server/actions";
import type { FormState } from "@/lib/server/form-state";

const editionPath = (standardId: FormDataEntryValue | null, editionId: string) => `/standards/${String(standardId)}/editions/${editionId}`;

export async function createStandardAction(_prev: FormState, formData: FormData) {
  const state = await runFormAction(createStandard, formData, "Standard created with a draft edition 1");
  if (state.status === "ok" && state.data) {
    revalidatePath("/standards");
    redirect(editionPath(state.data.id, state.data.editionId));
  }
  return state;
}

export async function startDraftAction(_prev: FormState, formData: FormData) {
  const state = await runFormAction(startDraft, formData, (r) => `Edition ${r.number} started as a draft with ${r.lines} lines`);
  if (state.status === "ok" && state.data) {
    revalidatePath(`/standards/${String(formData.get("standardId"))}`);
    redirect(editionPath(formData.get("standardId"), state.data.id));
  }
  return state;
}

export async function addLineAction(_prev: FormState, formData: FormData) {
  const state = await runFormAction(addLine, formData, (r) => `Line added (key ${r.key})`);
  if (state.status === "ok" && state.data) revalidatePath(editionPath(formData.get("standardId"), state.data.editionId));
  return state;
}

export async function updateLineAction(_prev: FormState, formData: FormData) {
  const state = await runFormAction(updateLine, formData, "Line saved", { full: "true" });
  if (state.status === "ok" && state.data) revalidatePath(editionPath(formData.get("standardId"), state.data.editionId));
  return state;
}

export async function deleteLineAction(_prev: FormState, formData: FormData) {
  const state = await runFormAction(deleteLine, formData, "Line deleted");
  if (state.status === "ok" && state.data) revalidatePath(editionPath(formData.get("standardId"), state.data.editionId));
  return state;
}

export async function publishEditionAction(_prev: FormState, formData: FormData) {
  const state = await runFormAction(publishEdition, formData, (r) => `Edition ${r.number} published with ${r.lines} lines; it can no longer change`);
  if (state.status === "ok" && state.data) {
    revalidatePath(editionPath(formData.get("standardId"), state.data.id));
    revalidatePath(`/standards/${String(formData.get("standardId"))}`);
  }
  return state;
}

export async function retireEditionAction(_prev: FormState, formData: FormData) {
  const state = await runFormAction(retireEdition, formData, "Edition retired");
  if (state.status === "ok" && state.data) revalidatePath(editionPath(formData.get("standardId"), state.data.id));
  return state;
}

export async function previewRolloutAction(_prev: FormState, formData: FormData) {
  return runFormAction(previewRollout, formData, (r) => `Preview for ${r.totals.vehicles} ${r.totals.vehicles === 1 ? "vehicle" : "vehicles"}: nothing has changed yet`, { dryRun: "true" });
}

export async function confirmRolloutAction(_prev: FormState, formData: FormData) {
  const state = await runFormAction(confirmRollout, formData, (r) => `Edition ${r.edition.number} assigned to ${r.assigned} ${r.assigned === 1 ? "vehicle" : "vehicles"}`, { dryRun: "false" });
  if (state.status === "ok" && state.data) {
    revalidatePath(editionPath(formData.get("standardId"), state.data.edition.id));
    for (const v of state.data.vehicles) revalidatePath(`/vehicles/${v.vehicleId}/spec`);
  }
  return state;
}
