import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { PLATFORM_FIGURE_GROUPS, PLATFORM_FIGURES, platformName } from "@/components/platforms/figures";
import { PlatformRatingsPill } from "@/components/platforms/platform-pill";
import { Button, Card, CardBody, CardHeader, Caution, PageHeader, Quantity } from "@/components/ui";
import { getPlatform } from "@/lib/commands/platforms";
import { AppError } from "@/lib/server/errors";
import { requirePermission } from "@/lib/server/guard";
import { execute } from "@/lib/server/operation";

export const metadata: Metadata = { title: "Platform" };

export default async function PlatformPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const user = await requirePermission("read", "Platform");
  const platform = await execute(getPlatform, user, { id }).catch((error: unknown) => {
    if (error instanceof AppError && (error.code === "not_found" || error.code === "validation_failed")) notFound();
    throw error;
  });
  const canManage = user.ability.can("manage", "Platform");
  const missing = PLATFORM_FIGURES.filter((f) => platform.missingRatings.includes(f.key));
  const payload = platform.gvmKg !== null && platform.kerbMassKg !== null ? platform.gvmKg - platform.kerbMassKg : null;
  return (
    <div className="flex flex-col gap-6">
      <PageHeader
        eyebrow={<Link href="/platforms" className="hover:underline">Platforms</Link>}
        title={platformName(platform)}
        question={platform.ratingsMissing ? "Which of the maker's ratings are still missing?" : "What has the maker rated this vehicle for?"}
        actions={
          <>
            <PlatformRatingsPill ratingsMissing={platform.ratingsMissing} />
            {canManage && (
              <Button asChild variant={platform.ratingsMissing ? "primary" : "secondary"}>
                <Link href={`/platforms/${platform.id}/edit`}>{platform.ratingsMissing ? "Enter the missing ratings" : "Edit figures"}</Link>
              </Button>
            )}
          </>
        }
      />
      {platform.ratingsMissing && (
        <Card data-testid="missing-ratings">
          <CardHeader title="Ratings missing" description="This platform came in from an import. Mass and payload checks cannot run for its vehicles until these are entered." />
          <CardBody>
            <ul className="list-inside list-disc">
              {missing.map((f) => (
                <li key={f.key}>
                  {f.label} ({f.unit})
                </li>
              ))}
            </ul>
          </CardBody>
        </Card>
      )}
      <div className="grid grid-cols-1 gap-4 md:grid-cols-2">
        {PLATFORM_FIGURE_GROUPS.map((group) => (
          <Card key={group.group}>
            <CardHeader title={group.title} />
            <CardBody>
              <dl className="grid grid-cols-2 gap-x-6 gap-y-2">
                {PLATFORM_FIGURES.filter((f) => f.group === group.group).map((f) => {
                  const v = platform[f.key];
                  return (
                    <div key={f.key} className="contents">
                      <dt className="text-sm text-muted">{f.label}</dt>
                      <dd className="text-right font-medium tabular-nums">{v === null ? <span className="text-muted">not entered</span> : <Quantity value={v} unit={f.unit} />}</dd>
                    </div>
                  );
                })}
                {group.group === "mass" && payload !== null && (
                  <div className="contents">
                    <dt className="text-sm text-muted">Payload at kerb (GVM − kerb)</dt>
                    <dd className="text-right font-medium tabular-nums">
                      <Quantity value={payload} unit="kg" />
                    </dd>
                  </div>
                )}
                {group.group === "other" && (
                  <div className="contents">
                    <dt className="text-sm text-muted">Standard tyre size</dt>
                    <dd className="text-right font-medium">{platform.standardTyreSize ?? <span className="text-muted">not entered</span>}</dd>
                  </div>
                )}
              </dl>
            </CardBody>
          </Card>
        ))}
      </div>
      <p>
        {platform.vehicleCount === 0 ? (
          "No vehicle uses this platform yet."
        ) : (
          <Link href={`/vehicles?platformId=${platform.id}`} className="font-semibold text-accent hover:underline">
            {platform.vehicleCount} vehicle{platform.vehicleCount === 1 ? "" : "s"} on this platform
          </Link>
        )}
      </p>
      <Caution text="These are the maker's ratings. A loaded vehicle is checked on a certified weighbridge, and changes to its ratings (a GVM upgrade) need an authorised vehicle engineer under local rules." />
    </div>
  );
}
