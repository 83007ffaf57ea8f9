import { and, asc, count, eq, inArray, sql } from "drizzle-orm";
import type { Actor } from "@/lib/permissions";
import type { DbOrTx } from "./client";
import { platforms, vehicles } from "./schema";
import { vehicleScope } from "./scope";

export type PlatformRow = typeof platforms.$inferSelect;

const scoped = (actor: Actor) => actor.role === "driver" || actor.role === "contractor";

/**
 * Platforms of the organisation with how many vehicles (that the actor may see) use each.
 * Drivers and contractors see only the platforms of the vehicles assigned to them.
 */
export async function listPlatformsWithUse(db: DbOrTx, actor: Actor): Promise<(PlatformRow & { vehicleCount: number })[]> {
  const use = db
    .select({ platformId: vehicles.platformId, n: count().as("n") })
    .from(vehicles)
    .where(vehicleScope(actor))
    .groupBy(vehicles.platformId)
    .as("use");
  const rows = await db
    .select({ platform: platforms, vehicleCount: sql<number>`coalesce(${use.n}, 0)` })
    .from(platforms)
    .leftJoin(use, eq(use.platformId, platforms.id))
    .where(
      scoped(actor)
        ? and(eq(platforms.orgId, actor.orgId), sql`${use.n} > 0`)
        : eq(platforms.orgId, actor.orgId),
    )
    .orderBy(asc(platforms.make), asc(platforms.model), asc(platforms.variant));
  return rows.map((r) => ({ ...r.platform, vehicleCount: Number(r.vehicleCount) }));
}

/** One platform the actor may see, with its vehicle count, or null (another organisation's id is not found). */
export async function findPlatform(db: DbOrTx, actor: Actor, id: string): Promise<(PlatformRow & { vehicleCount: number }) | null> {
  const platform = await db.query.platforms.findFirst({ where: and(eq(platforms.id, id), eq(platforms.orgId, actor.orgId)) });
  if (!platform) return null;
  const [use] = await db
    .select({ n: count() })
    .from(vehicles)
    .where(and(vehicleScope(actor), eq(vehicles.platformId, id)));
  const vehicleCount = use?.n ?? 0;
  if (scoped(actor) && vehicleCount === 0) return null;
  return { ...platform, vehicleCount };
}

/** Platforms by id inside the organisation (for checking references in a batch). */
export async function platformsByIds(db: DbOrTx, orgId: string, ids: string[]): Promise<PlatformRow[]> {
  if (ids.length === 0) return [];
  return db.select().from(platforms).where(and(eq(platforms.orgId, orgId), inArray(platforms.id, ids)));
}

/** Short options for selects and filters: id and name. */
export async function platformOptions(db: DbOrTx, actor: Actor): Promise<{ id: string; make: string; model: string; variant: string; ratingsMissing: boolean }[]> {
  const rows = await listPlatformsWithUse(db, actor);
  return rows.map((p) => ({ id: p.id, make: p.make, model: p.model, variant: p.variant, ratingsMissing: p.ratingsMissing }));
}
