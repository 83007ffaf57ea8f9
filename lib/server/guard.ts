import "server-only";
import { forbidden, redirect } from "next/navigation";
import type { Action, Subject } from "@/lib/permissions";
import { currentUser, type SignedIn } from "./session";

/** For pages: the signed-in user, or a redirect to the sign-in page. */
export async function requireUser(): Promise<SignedIn> {
  const user = await currentUser();
  if (!user) redirect("/sign-in");
  return user;
}

/** For pages: the signed-in user with this permission, or the "not allowed" page (403). */
export async function requirePermission(action: Action, subject: Subject): Promise<SignedIn> {
  const user = await requireUser();
  if (!user.ability.can(action, subject)) forbidden();
  return user;
}
