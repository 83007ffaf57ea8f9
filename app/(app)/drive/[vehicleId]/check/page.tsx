import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { CheckForm } from "@/components/drive/check-form";
import { PageHeader } from "@/components/ui";
import { getChecklist } from "@/lib/commands/checks";
import { AppError } from "@/lib/server/errors";
import { requirePermission } from "@/lib/server/guard";
import { execute } from "@/lib/server/operation";

export const metadata: Metadata = { title: "Pre-trip check" };

export default async function CheckPage({ params }: { params: Promise<{ vehicleId: string }> }) {
  const { vehicleId } = await params;
  const user = await requirePermission("create", "PreTripCheck");
  const checklist = await execute(getChecklist, user, { vehicleId }).catch((error: unknown) => {
    if (error instanceof AppError && (error.code === "not_found" || error.code === "validation_failed")) notFound();
    throw error;
  });
  return (
    <>
      <PageHeader
        eyebrow={<a href={`/drive/${checklist.vehicleId}`} className="underline underline-offset-4">{checklist.fleetNumber}</a>}
        title="Pre-trip check"
        question="Is everything on board and working?"
      />
      <p className="-mt-2 text-base text-muted">Engine off, on level ground. Mark each item; a fault can go straight to the managers as a defect.</p>
      <CheckForm userId={user.userId} vehicle={{ id: checklist.vehicleId, fleetNumber: checklist.fleetNumber }} items={checklist.items} />
    </>
  );
}
