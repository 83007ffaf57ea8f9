import { and, desc, eq } from "drizzle-orm";
import type { DbOrTx } from "./client";
import { depots, importMappings, imports, platforms, users, vehicles } from "./schema";

/** Everything of one organisation's register that an import plan is made against. */
export async function loadRegisterForImport(db: DbOrTx, orgId: string) {
  const [vehicleRows, platformRows, depotRows] = await Promise.all([
    db
      .select({
        id: vehicles.id,
        fleetNumber: vehicles.fleetNumber,
        vin: vehicles.vin,
        registration: vehicles.registration,
        registrationExpiry: vehicles.registrationExpiry,
        platformId: vehicles.platformId,
        make: platforms.make,
        model: platforms.model,
        variant: platforms.variant,
        buildYear: vehicles.buildYear,
        depotId: vehicles.depotId,
        costCentre: vehicles.costCentre,
        state: vehicles.state,
        odometerKm: vehicles.odometerKm,
        notes: vehicles.notes,
        version: vehicles.version,
      })
      .from(vehicles)
      .innerJoin(platforms, eq(platforms.id, vehicles.platformId))
      .where(eq(vehicles.orgId, orgId)),
    db
      .select({ id: platforms.id, make: platforms.make, model: platforms.model, variant: platforms.variant })
      .from(platforms)
      .where(eq(platforms.orgId, orgId)),
    db.select({ id: depots.id, code: depots.code, name: depots.name }).from(depots).where(eq(depots.orgId, orgId)),
  ]);
  return { vehicles: vehicleRows, platforms: platformRows, depots: depotRows };
}
export type RegisterForImport = Awaited<ReturnType<typeof loadRegisterForImport>>;

export async function findSavedMapping(db: DbOrTx, orgId: string, headerSignature: string) {
  const [row] = await db
    .select({ mapping: importMappings.mapping, updatedAt: importMappings.updatedAt })
    .from(importMappings)
    .where(and(eq(importMappings.orgId, orgId), eq(importMappings.headerSignature, headerSignature)))
    .limit(1);
  return row ?? null;
}

export async function saveMapping(db: DbOrTx, orgId: string, headerSignature: string, mapping: Record<string, string | null>) {
  await db
    .insert(importMappings)
    .values({ orgId, headerSignature, mapping })
    .onConflictDoUpdate({ target: [importMappings.orgId, importMappings.headerSignature], set: { mapping, updatedAt: new Date() } });
}

/** A file this organisation already uploaded (same bytes), so its stored copy can be reused. */
export async function findStoredUpload(db: DbOrTx, orgId: string, sha256: string) {
  const [row] = await db
    .select({ storageKey: imports.storageKey })
    .from(imports)
    .where(and(eq(imports.orgId, orgId), eq(imports.sha256, sha256)))
    .orderBy(desc(imports.createdAt))
    .limit(1);
  return row?.storageKey ?? null;
}

const historyColumns = {
  id: imports.id,
  createdAt: imports.createdAt,
  filename: imports.filename,
  format: imports.format,
  sizeBytes: imports.sizeBytes,
  sha256: imports.sha256,
  dryRun: imports.dryRun,
  totalRows: imports.totalRows,
  created: imports.created,
  updated: imports.updated,
  unchanged: imports.unchanged,
  errorCount: imports.errorCount,
  hasFile: imports.storageKey,
  createdByName: users.name,
};

export async function listImportHistory(db: DbOrTx, orgId: string, limit = 50) {
  const rows = await db
    .select(historyColumns)
    .from(imports)
    .leftJoin(users, eq(users.id, imports.createdBy))
    .where(eq(imports.orgId, orgId))
    .orderBy(desc(imports.createdAt))
    .limit(limit);
  return rows.map(({ hasFile, ...row }) => ({ ...row, hasFile: hasFile !== null }));
}

/** One import of the organisation, or null (another organisation's id is simply not found). */
export async function findImport(db: DbOrTx, orgId: string, id: string) {
  const [row] = await db
    .select()
    .from(imports)
    .where(and(eq(imports.orgId, orgId), eq(imports.id, id)))
    .limit(1);
  return row ?? null;
}
