"use server";

import { revalidatePath } from "next/cache";
import { redirect } from "next/navigation";
import { reviewEvidence } from "@/lib/commands/evidence";
import { cancelJob, closeJob, offerJob, progressJob, raiseJob, signOffJob } from "@/lib/commands/jobs";
import { runFormAction } from "@/lib/server/actions";
import type { FormState } from "@/lib/server/form-state";

const idOf = (formData: FormData) => String(formData.get("id") ?? "");

function refresh(jobId: string) {
  revalidatePath(`/jobs/${jobId}`);
  revalidatePath("/jobs");
}

export async function raiseJobAction(_prev: FormState, formData: FormData) {
  // The "other work" box holds one item per line.
  const freeText = String(formData.get("freeTextBlock") ?? "")
    .split(/\r?\n/)
    .map((t) => t.trim())
    .filter(Boolean);
  const state = await runFormAction(raiseJob, formData, (r) => `Job ${r.number} raised`, { freeText });
  if (state.status === "ok" && state.data) {
    revalidatePath("/jobs");
    redirect(`/jobs/${(state.data as { id: string }).id}`);
  }
  return state;
}

export async function offerJobAction(_prev: FormState, formData: FormData) {
  const state = await runFormAction(offerJob, formData, (r) => `Offered to ${r.offeredTo} ${r.offeredTo === 1 ? "workshop" : "workshops"}`);
  if (state.status === "ok") refresh(idOf(formData));
  return state;
}

export async function cancelJobAction(_prev: FormState, formData: FormData) {
  const state = await runFormAction(cancelJob, formData, "Job cancelled");
  if (state.status === "ok") refresh(idOf(formData));
  return state;
}

export async function progressJobAction(_prev: FormState, formData: FormData) {
  const state = await runFormAction(progressJob, formData, (r) => (r.state === "in_workshop" ? "Work started" : "Evidence marked as lodged"));
  if (state.status === "ok") refresh(idOf(formData));
  return state;
}

export async function signOffJobAction(_prev: FormState, formData: FormData) {
  const state = await runFormAction(signOffJob, formData, "Job signed off; the cost is booked");
  if (state.status === "ok") {
    refresh(idOf(formData));
    revalidatePath("/costs");
  }
  return state;
}

export async function closeJobAction(_prev: FormState, formData: FormData) {
  const state = await runFormAction(closeJob, formData, "Job closed");
  if (state.status === "ok") refresh(idOf(formData));
  return state;
}

export async function reviewEvidenceAction(_prev: FormState, formData: FormData) {
  const state = await runFormAction(reviewEvidence, formData, (r) => (r.status === "accepted" ? "Evidence accepted" : "Evidence rejected"));
  const jobId = String(formData.get("jobId") ?? "");
  if (state.status === "ok" && jobId) refresh(jobId);
  return state;
}
