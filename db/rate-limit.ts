import { eq, sql } from "drizzle-orm";
import type { DbOrTx } from "./client";
import { rateLimits } from "./schema";

export type Limit = { max: number; windowMs: number };

/** How long until `key` may try again, or 0 when it is under its limit. */
export async function retryAfterMs(db: DbOrTx, key: string, limit: Limit, now = new Date()) {
  const row = await db.query.rateLimits.findFirst({ where: eq(rateLimits.key, key) });
  if (!row || row.resetAt <= now) return 0;
  return row.count >= limit.max ? row.resetAt.getTime() - now.getTime() : 0;
}

/** Counts one hit against `key` in a fixed window (an upsert, so concurrent hits all count). */
export async function hit(db: DbOrTx, key: string, limit: Limit, now = new Date()) {
  const resetAt = new Date(now.getTime() + limit.windowMs);
  await db
    .insert(rateLimits)
    .values({ key, count: 1, resetAt })
    .onConflictDoUpdate({
      target: rateLimits.key,
      set: {
        count: sql`CASE WHEN ${rateLimits.resetAt} <= ${now.getTime()} THEN 1 ELSE ${rateLimits.count} + 1 END`,
        resetAt: sql`CASE WHEN ${rateLimits.resetAt} <= ${now.getTime()} THEN ${resetAt.getTime()} ELSE ${rateLimits.resetAt} END`,
      },
    });
}

export async function clearHits(db: DbOrTx, key: string) {
  await db.delete(rateLimits).where(eq(rateLimits.key, key));
}
