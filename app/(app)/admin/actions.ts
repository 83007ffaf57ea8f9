"use server";

import { revalidatePath } from "next/cache";
import { changeRole, inviteUser, saveDepot, saveFirm, setMemberActive, updateSettings } from "@/lib/commands/organisation";
import { runFormAction } from "@/lib/server/actions";
import type { FormState } from "@/lib/server/form-state";

export async function inviteUserAction(_prev: FormState, formData: FormData) {
  const state = await runFormAction(inviteUser, formData, (r) => `Invitation sent to ${r.email}`);
  if (state.status === "ok") revalidatePath("/admin/users");
  return state;
}

export async function changeRoleAction(_prev: FormState, formData: FormData) {
  const state = await runFormAction(changeRole, formData, "Role saved");
  if (state.status === "ok") revalidatePath("/admin/users");
  return state;
}

export async function setActiveAction(_prev: FormState, formData: FormData) {
  const state = await runFormAction(setMemberActive, formData, (r) => (r.active ? "Account reactivated" : "Account deactivated; their sessions have ended"));
  if (state.status === "ok") revalidatePath("/admin/users");
  return state;
}

export async function saveDepotAction(_prev: FormState, formData: FormData) {
  const state = await runFormAction(saveDepot, formData, "Depot saved");
  if (state.status === "ok") revalidatePath("/admin/depots");
  return state;
}

export async function saveFirmAction(_prev: FormState, formData: FormData) {
  const state = await runFormAction(saveFirm, formData, "Workshop saved");
  if (state.status === "ok") revalidatePath("/admin/firms");
  return state;
}

export async function updateSettingsAction(_prev: FormState, formData: FormData) {
  const state = await runFormAction(updateSettings, formData, "Settings saved");
  if (state.status === "ok") revalidatePath("/admin/settings");
  return state;
}
