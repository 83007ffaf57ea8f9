"use server";

import { revalidatePath } from "next/cache";
import { redirect } from "next/navigation";
import { createQuote, decideQuote, financeApproval, submitQuote, updateQuote, withdrawQuote } from "@/lib/commands/quotes";
import { runFormAction } from "@/lib/server/actions";
import type { FormState } from "@/lib/server/form-state";

const idOf = (formData: FormData) => String(formData.get("id") ?? "");

function refresh(formData: FormData) {
  const jobId = String(formData.get("jobId") ?? "");
  revalidatePath(`/quotes/${idOf(formData)}`);
  revalidatePath("/quotes");
  revalidatePath("/approvals");
  if (jobId) revalidatePath(`/jobs/${jobId}`);
}

export async function startQuoteAction(_prev: FormState, formData: FormData) {
  const state = await runFormAction(createQuote, formData, "Draft quote started");
  if (state.status === "ok" && state.data) redirect(`/quotes/${(state.data as { id: string }).id}`);
  return state;
}

/**
 * Saves the quote's lines; with intent=submit it then submits the saved quote in the same request.
 * The submit names the version just saved, so if anything changed the quote in between (another
 * tab, another request) it is refused with a clear 409 instead of submitting other lines.
 */
export async function saveQuoteAction(_prev: FormState, formData: FormData) {
  const state = await saveThenMaybeSubmit(formData, formData.get("intent") === "submit");
  if (state.status === "ok") refresh(formData);
  return state;
}

async function saveThenMaybeSubmit(formData: FormData, submit: boolean): Promise<FormState> {
  const saved = await runFormAction(updateQuote, formData, "Quote saved");
  if (saved.status !== "ok" || !submit) return saved;
  const body = new FormData();
  body.set("id", idOf(formData));
  const version = (saved.data as { version?: number } | undefined)?.version;
  if (version !== undefined) body.set("version", String(version));
  const sent = await runFormAction(submitQuote, body, (r) => (r.revision > 1 ? `Revision ${r.revision} submitted` : "Quote submitted"));
  return sent.status === "ok" ? sent : { ...sent, values: saved.values ?? {} };
}

export async function submitQuoteAction(_prev: FormState, formData: FormData) {
  const state = await runFormAction(submitQuote, formData, (r) => (r.revision > 1 ? `Revision ${r.revision} submitted` : "Quote submitted"));
  if (state.status === "ok") refresh(formData);
  return state;
}

export async function withdrawQuoteAction(_prev: FormState, formData: FormData) {
  const state = await runFormAction(withdrawQuote, formData, "Quote withdrawn");
  if (state.status === "ok") refresh(formData);
  return state;
}

export async function decideQuoteAction(_prev: FormState, formData: FormData) {
  const state = await runFormAction(decideQuote, formData, (r) =>
      r.status === "awaiting_finance" ? "Accepted; it now waits for a finance approval" : r.status === "accepted" ? "Quote accepted; the job is awarded" : r.status === "returned" ? "Quote returned for changes" : "Quote declined",
    );
  if (state.status === "ok") refresh(formData);
  return state;
}

export async function financeApprovalAction(_prev: FormState, formData: FormData) {
  const state = await runFormAction(financeApproval, formData, (r) => (r.status === "accepted" ? "Approved; the job is awarded" : "Declined"));
  if (state.status === "ok") refresh(formData);
  return state;
}
