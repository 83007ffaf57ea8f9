/**
 * Rows the defect and readiness integration tests build for themselves, so they do not depend
 * on what other parts of the demo seed put on the demo vehicles. Invented data only.
 */
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { and, eq } from "drizzle-orm";
import sharp from "sharp";
import { afterAll } from "vitest";
import type { Database } from "@/db/client";
import {
  EVIDENCE_KINDS,
  editionLines,
  editions,
  evidence,
  fitments,
  organisations,
  platforms,
  standards,
  users,
  vehicleDrivers,
  vehicles,
  type VehicleState,
} from "@/db/schema";
import { diskStorage, setStorageForTests } from "@/lib/server/storage";

export const MIRRABEL = "mirrabel-health";
export const GIDGEE = "gidgee-trust";

export async function orgId(database: Database, slug: string): Promise<string> {
  const org = await database.query.organisations.findFirst({ where: eq(organisations.slug, slug) });
  if (!org) throw new Error(`no organisation ${slug}`);
  return org.id;
}

export async function userId(database: Database, email: string): Promise<string> {
  const user = await database.query.users.findFirst({ where: eq(users.email, email) });
  if (!user) throw new Error(`no user ${email}`);
  return user.id;
}

let serial = 0;

/** A vehicle of its own, optionally assigned to drivers (by e-mail). */
export async function makeVehicle(
  database: Database,
  org: string,
  options: { fleetNumber?: string; state?: VehicleState; registration?: string; registrationExpiry?: Date | null; editionId?: string | null; drivers?: string[] } = {},
): Promise<string> {
  const platform = await database.query.platforms.findFirst({ where: eq(platforms.orgId, org) });
  if (!platform) throw new Error("the organisation has no platform");
  serial += 1;
  const [row] = await database
    .insert(vehicles)
    .values({
      orgId: org,
      fleetNumber: options.fleetNumber ?? `TST-${String(serial).padStart(3, "0")}`,
      vin: null,
      registration: options.registration ?? `TS${serial}XY`,
      registrationExpiry: options.registrationExpiry === undefined ? new Date(Date.UTC(2099, 0, 1)) : options.registrationExpiry,
      platformId: platform.id,
      state: options.state ?? "in_service",
      editionId: options.editionId ?? null,
    })
    .returning({ id: vehicles.id });
  for (const email of options.drivers ?? []) {
    await database.insert(vehicleDrivers).values({ vehicleId: row!.id, userId: await userId(database, email) });
  }
  return row!.id;
}

export type LineSpec = {
  key: string;
  code: string;
  title: string;
  category: (typeof editionLines.category.enumValues)[number];
  quantity?: number;
  requirement?: (typeof editionLines.requirement.enumValues)[number];
  checkable?: boolean;
  expiryMonths?: number | null;
  evidenceNeeded?: (typeof EVIDENCE_KINDS)[number][];
};

/** A published edition of a fresh standard with the given lines. */
export async function makeEdition(database: Database, org: string, lines: LineSpec[]): Promise<string> {
  serial += 1;
  const [standard] = await database.insert(standards).values({ orgId: org, name: `Test standard ${serial}` }).returning({ id: standards.id });
  const [edition] = await database
    .insert(editions)
    .values({ orgId: org, standardId: standard!.id, number: 1, status: "published", publishedAt: new Date() })
    .returning({ id: editions.id });
  await database.insert(editionLines).values(
    lines.map((l, i) => ({
      orgId: org,
      editionId: edition!.id,
      key: l.key,
      code: l.code,
      category: l.category,
      title: l.title,
      requirement: l.requirement ?? ("must_fit" as const),
      quantity: l.quantity ?? 1,
      checkable: l.checkable ?? false,
      expiryMonths: l.expiryMonths ?? null,
      evidenceNeeded: l.evidenceNeeded ?? [],
      sortOrder: i,
    })),
  );
  return edition!.id;
}

export async function makeFitment(
  database: Database,
  org: string,
  vehicleId: string,
  spec: { lineKey: string | null; label: string; quantity?: number; fittedAt: Date; expiresAt?: Date | null; acceptedEvidence?: (typeof evidence.kind.enumValues)[number][] },
): Promise<string> {
  const [row] = await database
    .insert(fitments)
    .values({ orgId: org, vehicleId, lineKey: spec.lineKey, label: spec.label, quantity: spec.quantity ?? 1, fittedAt: spec.fittedAt, expiresAt: spec.expiresAt ?? null })
    .returning({ id: fitments.id });
  for (const kind of spec.acceptedEvidence ?? []) {
    await database.insert(evidence).values({
      orgId: org,
      fitmentId: row!.id,
      lineKey: spec.lineKey,
      kind,
      status: "accepted",
      filename: `${kind}.jpg`,
      contentType: "image/jpeg",
      sizeBytes: 1,
      sha256: "0".repeat(64),
      storageKey: `evidence/test/${row!.id}.jpg`,
    });
  }
  return row!.id;
}

export async function vehicleState(database: Database, id: string) {
  const row = await database.query.vehicles.findFirst({ where: eq(vehicles.id, id) });
  return { state: row?.state, groundedReason: row?.groundedReason ?? null, version: row?.version };
}

export async function vehicleByFleetNumber(database: Database, org: string, fleetNumber: string): Promise<string> {
  const row = await database.query.vehicles.findFirst({ where: and(eq(vehicles.orgId, org), eq(vehicles.fleetNumber, fleetNumber)) });
  if (!row) throw new Error(`no vehicle ${fleetNumber}`);
  return row.id;
}

/** A temporary disk store for uploads, removed when the file's tests end. */
export function useTempStorage(): string {
  const dir = mkdtempSync(join(tmpdir(), "rigline-files-"));
  setStorageForTests(diskStorage(dir));
  afterAll(() => {
    setStorageForTests(undefined);
    rmSync(dir, { recursive: true, force: true });
  });
  return dir;
}

/** A small JPEG whose EXIF carries a camera make and a GPS position (invented: the plain south of the ranges). */
export async function jpegWithGps(): Promise<Buffer> {
  return sharp({ create: { width: 96, height: 64, channels: 3, background: "#a05030" } })
    .jpeg()
    .withExif({
      IFD0: { Make: "Testcam" },
      IFD3: { GPSLatitudeRef: "S", GPSLatitude: "23/1 42/1 0/1", GPSLongitudeRef: "E", GPSLongitude: "133/1 52/1 0/1" },
    })
    .toBuffer();
}

export const uuid = () => crypto.randomUUID();
