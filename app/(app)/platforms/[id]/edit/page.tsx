import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { platformName } from "@/components/platforms/figures";
import { PlatformForm } from "@/components/platforms/platform-form";
import { PlatformRatingsPill } from "@/components/platforms/platform-pill";
import { PageHeader } from "@/components/ui";
import { getPlatform } from "@/lib/commands/platforms";
import { AppError } from "@/lib/server/errors";
import { requirePermission } from "@/lib/server/guard";
import { execute } from "@/lib/server/operation";

export const metadata: Metadata = { title: "Edit platform" };

export default async function EditPlatformPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const user = await requirePermission("manage", "Platform");
  const platform = await execute(getPlatform, user, { id }).catch((error: unknown) => {
    if (error instanceof AppError && (error.code === "not_found" || error.code === "validation_failed")) notFound();
    throw error;
  });
  return (
    <div className="flex flex-col gap-6">
      <PageHeader
        eyebrow={<Link href={`/platforms/${platform.id}`} className="hover:underline">{platformName(platform)}</Link>}
        title="Edit platform"
        question={platform.ratingsMissing ? "Enter the ratings that are still missing; the flag clears when they are all in." : "Are these the maker's figures?"}
        actions={<PlatformRatingsPill ratingsMissing={platform.ratingsMissing} />}
      />
      <PlatformForm platform={platform} />
    </div>
  );
}
