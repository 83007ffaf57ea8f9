import type { ReactNode } from "react";
import { OfflineSupport } from "@/components/drive/offline-support";
import { db } from "@/db/client";
import { driverVehicles } from "@/db/defects";
import { requireUser } from "@/lib/server/guard";

/**
 * The driver's screens: one narrow column for a phone, with the signal and outbox bar on top.
 * The service worker is asked to keep every page a driver needs without signal: this list, and
 * for each assigned vehicle its page, its checklist and its defect form.
 */
export default async function DriveLayout({ children }: { children: ReactNode }) {
  const user = await requireUser();
  const mine = user.role === "driver" ? await driverVehicles(db(), user) : [];
  const warmUrls = ["/drive", "/drive/report", ...mine.flatMap((v) => [`/drive/${v.id}`, `/drive/${v.id}/check`, `/drive/${v.id}/defect`])];
  return (
    <div className="mx-auto flex w-full max-w-xl flex-col gap-5 text-base">
      {user.role === "driver" && <OfflineSupport userId={user.userId} warmUrls={warmUrls} />}
      {children}
    </div>
  );
}
