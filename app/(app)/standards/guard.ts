import "server-only";
import { forbidden } from "next/navigation";
import { isScoped } from "@/lib/permissions";
import { requirePermission } from "@/lib/server/guard";

/**
 * The standards pages are for the roles that read whole standards (admin, manager, finance).
 * Drivers and contractors see lines only through their vehicles and jobs: the 403 page.
 */
export async function requireStandardsReader() {
  const user = await requirePermission("read", "Standard");
  if (isScoped(user, "read", "Standard")) forbidden();
  return user;
}
