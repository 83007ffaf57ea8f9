import { eq } from "drizzle-orm";
import type { Actor } from "@/lib/permissions";
import { RevisionCache } from "@/lib/revision-cache";
import type { Database, DbOrTx } from "./client";
import { registerRevision } from "./schema";
import { computeRegisterPage, type RegisterPage, type VehicleListParams } from "./vehicles";

/**
 * Register pages are read far more often than the fleet changes (every open register refetches
 * its page), so each server process keeps the pages it computed, for the register revision they
 * were computed at. Triggers raise that revision with every change to anything a page shows or
 * filters by (migrations 0007 and 0010: defects too, for the readiness filter), in this process
 * or any other using the same database, so a kept page is served only while nothing it shows
 * has changed, and only until the first instant time alone could change it (a variance status
 * or, when filtered by it, a readiness state turning as something expires).
 */
const pagesByDatabase = new WeakMap<Database, RevisionCache<RegisterPage>>();

/** The pages kept for one database (tests open several; a revision means nothing across them). */
function pagesOf(database: Database): RevisionCache<RegisterPage> {
  let pages = pagesByDatabase.get(database);
  if (!pages) {
    pages = new RevisionCache<RegisterPage>({
      maxEntries: 2_000,
      // Counted in vehicle rows (a row of the answer is about 0.75 kB of JSON).
      maxSize: 20_000,
      sizeOf: (page) => page.items.length,
    });
    pagesByDatabase.set(database, pages);
  }
  return pages;
}

/** The register's revision: it rises with every change a register page could show. */
export async function readRegisterRevision(db: DbOrTx): Promise<number> {
  const [row] = await db.select({ revision: registerRevision.revision }).from(registerRevision).where(eq(registerRevision.id, 1));
  return row?.revision ?? 0;
}

/**
 * Who sees what decides the page (the organisation, the role and its scope), then every
 * parameter of the request, whatever parameters the register grows.
 */
function pageKey(actor: Actor, p: VehicleListParams): string {
  const params = Object.entries(p)
    .filter(([, value]) => value !== undefined)
    .sort(([a], [b]) => (a < b ? -1 : 1));
  return JSON.stringify([actor.orgId, actor.role, actor.userId, actor.firmId ?? null, actor.depotId ?? null, params]);
}

/**
 * One page of the register as the app serves it. Takes the database itself, never a
 * transaction: a page read inside a transaction could show writes that are later rolled back.
 * The page returned may be shared with other requests: treat it as read-only.
 */
export async function registerPage(database: Database, actor: Actor, p: VehicleListParams, now: Date): Promise<RegisterPage> {
  const nowMs = now.getTime();
  const pages = pagesOf(database);
  const key = pageKey(actor, p);
  // The revision is read before the page: a change landing while the page is computed raises it
  // past the one the page is kept under, so the page is not served again.
  const revision = await readRegisterRevision(database);
  const kept = pages.get(key, revision, nowMs);
  if (kept) return kept;
  const { page, validUntil } = await computeRegisterPage(database, actor, p, now);
  pages.set(key, revision, nowMs, validUntil, page);
  return page;
}

/** Forgets every page kept for the database (tests measure the computation itself). */
export function clearRegisterPages(database: Database): void {
  pagesByDatabase.get(database)?.clear();
}
