import { and, asc, count, desc, eq, inArray, isNotNull, sql } from "drizzle-orm";
import type { EditionLine } from "@/lib/variance";
import type { DbOrTx } from "./client";
import { depots, editionLines, editions, lineDependencies, platforms, standards, users, vehicles } from "./schema";
import { toEditionLine } from "./variance";

/**
 * Reads of standards, editions and their lines, always inside one organisation (an id of
 * another organisation is simply not found).
 */

export type EditionRow = typeof editions.$inferSelect;
export type StandardRow = typeof standards.$inferSelect;
export type LineRow = typeof editionLines.$inferSelect;

export type EditionSummary = Pick<EditionRow, "id" | "number" | "status" | "notes" | "publishedAt" | "copiedFromId" | "createdAt"> & {
  lineCount: number;
  vehicleCount: number;
  publishedByName: string | null;
};

/** Editions of the given standards with their line and vehicle counts, newest first. */
export async function editionSummaries(db: DbOrTx, orgId: string, standardIds: string[]): Promise<Map<string, EditionSummary[]>> {
  const out = new Map<string, EditionSummary[]>();
  if (standardIds.length === 0) return out;
  const [rows, lineCounts, vehicleCounts] = await Promise.all([
    db
      .select({ edition: editions, publishedByName: users.name })
      .from(editions)
      .leftJoin(users, eq(users.id, editions.publishedBy))
      .where(and(eq(editions.orgId, orgId), inArray(editions.standardId, standardIds)))
      .orderBy(desc(editions.number)),
    db
      .select({ editionId: editionLines.editionId, n: count() })
      .from(editionLines)
      .where(eq(editionLines.orgId, orgId))
      .groupBy(editionLines.editionId),
    db
      .select({ editionId: vehicles.editionId, n: count() })
      .from(vehicles)
      .where(and(eq(vehicles.orgId, orgId), isNotNull(vehicles.editionId)))
      .groupBy(vehicles.editionId),
  ]);
  const lines = new Map(lineCounts.map((r) => [r.editionId, r.n]));
  const fleet = new Map(vehicleCounts.map((r) => [r.editionId, r.n]));
  for (const { edition: e, publishedByName } of rows) {
    const list = out.get(e.standardId) ?? [];
    list.push({
      id: e.id,
      number: e.number,
      status: e.status,
      notes: e.notes,
      publishedAt: e.publishedAt,
      copiedFromId: e.copiedFromId,
      createdAt: e.createdAt,
      lineCount: lines.get(e.id) ?? 0,
      vehicleCount: fleet.get(e.id) ?? 0,
      publishedByName,
    });
    out.set(e.standardId, list);
  }
  return out;
}

export async function listStandards(db: DbOrTx, orgId: string) {
  const rows = await db.select().from(standards).where(eq(standards.orgId, orgId)).orderBy(asc(standards.name));
  const summaries = await editionSummaries(db, orgId, rows.map((r) => r.id));
  return rows.map((s) => ({ ...s, editions: summaries.get(s.id) ?? [] }));
}

export async function findStandard(db: DbOrTx, orgId: string, id: string) {
  const [row] = await db.select().from(standards).where(and(eq(standards.orgId, orgId), eq(standards.id, id))).limit(1);
  if (!row) return null;
  const summaries = await editionSummaries(db, orgId, [row.id]);
  return { ...row, editions: summaries.get(row.id) ?? [] };
}

export async function findEdition(db: DbOrTx, orgId: string, id: string) {
  const [row] = await db
    .select({ edition: editions, standard: standards })
    .from(editions)
    .innerJoin(standards, eq(standards.id, editions.standardId))
    .where(and(eq(editions.orgId, orgId), eq(editions.id, id)))
    .limit(1);
  return row ?? null;
}

/** An edition's lines in display order, as lib/variance lines (dependsOn filled). */
export async function loadEditionLines(db: DbOrTx, editionId: string): Promise<EditionLine[]> {
  const [rows, deps] = await Promise.all([
    db.select().from(editionLines).where(eq(editionLines.editionId, editionId)).orderBy(asc(editionLines.sortOrder), asc(editionLines.code)),
    db
      .select({ lineId: lineDependencies.lineId, dependsOnLineId: lineDependencies.dependsOnLineId })
      .from(lineDependencies)
      .innerJoin(editionLines, eq(editionLines.id, lineDependencies.lineId))
      .where(eq(editionLines.editionId, editionId)),
  ]);
  const dependsOn = new Map<string, string[]>();
  for (const d of deps) dependsOn.set(d.lineId, [...(dependsOn.get(d.lineId) ?? []), d.dependsOnLineId]);
  return rows.map((row) => toEditionLine(row, dependsOn.get(row.id) ?? []));
}

/** The next edition number of a standard. */
export async function nextEditionNumber(db: DbOrTx, standardId: string): Promise<number> {
  const [row] = await db
    .select({ max: sql<number | null>`max(${editions.number})` })
    .from(editions)
    .where(eq(editions.standardId, standardId));
  return (row?.max ?? 0) + 1;
}

/** The next sort position at the end of an edition. */
export async function nextSortOrder(db: DbOrTx, editionId: string): Promise<number> {
  const [row] = await db
    .select({ max: sql<number | null>`max(${editionLines.sortOrder})` })
    .from(editionLines)
    .where(eq(editionLines.editionId, editionId));
  return (row?.max ?? 0) + 10;
}

/** Published editions of the organisation (for choosing what to roll out or assign). */
export async function publishedEditions(db: DbOrTx, orgId: string) {
  return db
    .select({ id: editions.id, number: editions.number, standardId: editions.standardId, standardName: standards.name })
    .from(editions)
    .innerJoin(standards, eq(standards.id, editions.standardId))
    .where(and(eq(editions.orgId, orgId), eq(editions.status, "published")))
    .orderBy(asc(standards.name), desc(editions.number));
}

/** Vehicles a manager may roll an edition out to (not retired), with their current edition. */
export async function rolloutCandidates(db: DbOrTx, orgId: string) {
  const rows = await db
    .select({
      id: vehicles.id,
      fleetNumber: vehicles.fleetNumber,
      depotName: depots.name,
      make: platforms.make,
      model: platforms.model,
      editionId: vehicles.editionId,
      editionNumber: editions.number,
      standardName: standards.name,
    })
    .from(vehicles)
    .innerJoin(platforms, eq(platforms.id, vehicles.platformId))
    .leftJoin(depots, eq(depots.id, vehicles.depotId))
    .leftJoin(editions, eq(editions.id, vehicles.editionId))
    .leftJoin(standards, eq(standards.id, editions.standardId))
    .where(and(eq(vehicles.orgId, orgId), sql`${vehicles.state} != 'retired'`))
    .orderBy(asc(vehicles.fleetNumber));
  return rows.map((r) => ({
    id: r.id,
    fleetNumber: r.fleetNumber,
    depotName: r.depotName,
    platform: `${r.make} ${r.model}`,
    editionId: r.editionId,
    editionLabel: r.editionId ? `${r.standardName ?? "Standard"} ed. ${r.editionNumber}` : null,
  }));
}
