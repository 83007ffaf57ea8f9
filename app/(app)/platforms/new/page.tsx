import type { Metadata } from "next";
import { PlatformForm } from "@/components/platforms/platform-form";
import { PageHeader } from "@/components/ui";
import { requirePermission } from "@/lib/server/guard";

export const metadata: Metadata = { title: "Add platform" };

export default async function NewPlatformPage() {
  await requirePermission("manage", "Platform");
  return (
    <div className="flex flex-col gap-6">
      <PageHeader eyebrow="Platforms" title="Add platform" question="What has the maker rated this vehicle for?" />
      <PlatformForm />
    </div>
  );
}
