import type { Metadata } from "next";
import Link from "next/link";
import { PlatformRatingsPill } from "@/components/platforms/platform-pill";
import { platformName } from "@/components/platforms/figures";
import { Button, EmptyState, PageHeader, Quantity, Table, TBody, Td, Th, THead, Tr } from "@/components/ui";
import { listPlatforms } from "@/lib/commands/platforms";
import { requirePermission } from "@/lib/server/guard";
import { execute } from "@/lib/server/operation";

export const metadata: Metadata = { title: "Platforms" };

const kg = (v: number | null) => (v === null ? <span className="text-muted">—</span> : <Quantity value={v} unit="kg" />);

export default async function PlatformsPage() {
  const user = await requirePermission("read", "Platform");
  const platforms = await execute(listPlatforms, user, {});
  const canManage = user.ability.can("manage", "Platform");
  const missing = platforms.filter((p) => p.ratingsMissing).length;
  return (
    <div className="flex flex-col gap-6">
      <PageHeader
        title="Platforms"
        question={missing > 0 ? `${missing} platform${missing === 1 ? " lacks" : "s lack"} the maker's ratings that mass checks need.` : "Which makes and models does the fleet run, and what are they rated for?"}
        actions={
          canManage && (
            <Button asChild>
              <Link href="/platforms/new">Add platform</Link>
            </Button>
          )
        }
      />
      {platforms.length === 0 ? (
        <EmptyState title="No platforms yet" action={canManage && <Button asChild><Link href="/platforms/new">Add platform</Link></Button>}>
          A platform is a make, model and variant with the maker&apos;s figures. Vehicles point at one.
        </EmptyState>
      ) : (
        <Table label="Platforms">
          <THead>
            <Tr>
              <Th>Platform</Th>
              <Th>Ratings</Th>
              <Th numeric>Kerb mass</Th>
              <Th numeric>GVM</Th>
              <Th numeric>GCM</Th>
              <Th numeric>Front / rear axle</Th>
              <Th>Standard tyre</Th>
              <Th numeric>Vehicles</Th>
            </Tr>
          </THead>
          <TBody>
            {platforms.map((p) => (
              <Tr key={p.id}>
                <Td>
                  <Link href={`/platforms/${p.id}`} className="font-semibold text-accent underline-offset-4 hover:underline">
                    {platformName(p)}
                  </Link>
                </Td>
                <Td>
                  <PlatformRatingsPill ratingsMissing={p.ratingsMissing} size="sm" />
                </Td>
                <Td numeric>{kg(p.kerbMassKg)}</Td>
                <Td numeric>{kg(p.gvmKg)}</Td>
                <Td numeric>{kg(p.gcmKg)}</Td>
                <Td numeric>
                  {kg(p.frontAxleRatingKg)} / {kg(p.rearAxleRatingKg)}
                </Td>
                <Td>{p.standardTyreSize ?? <span className="text-muted">—</span>}</Td>
                <Td numeric>
                  {p.vehicleCount > 0 ? (
                    <Link href={`/vehicles?platformId=${p.id}`} className="font-semibold text-accent hover:underline" aria-label={`${p.vehicleCount} vehicles on ${platformName(p)}`}>
                      {p.vehicleCount}
                    </Link>
                  ) : (
                    0
                  )}
                </Td>
              </Tr>
            ))}
          </TBody>
        </Table>
      )}
    </div>
  );
}
