import bcrypt from "bcryptjs";
import { eq } from "drizzle-orm";
import type { Database } from "../client";
import {
  contractorFirms,
  depots,
  memberships,
  organisations,
  platforms,
  users,
  vehicleDrivers,
  vehicles,
} from "../schema";
import { DEMO_PASSWORD, ORGANISATIONS, type DemoOrganisation } from "./scenario";
import { demoVin, demoRegistration } from "./identifiers";
import { seedRuleSets } from "../rule-sets";
import { seedCosts } from "./costs";
import { seedDefects } from "./defects";
import { seedJobs } from "./jobs";
import { seedStandards } from "./standards";

export type SeedReport = { organisations: { name: string; created: boolean }[] };

/**
 * Seeds the demo scenario. Idempotent: an organisation that already exists (by slug) is left
 * as it is, so running the seed twice changes nothing.
 */
export async function seedDemo(database: Database): Promise<SeedReport> {
  const passwordHash = await bcrypt.hash(DEMO_PASSWORD, 10);
  const report: SeedReport = { organisations: [] };
  await seedRuleSets(database);
  for (const scenario of ORGANISATIONS) {
    const existing = await database.query.organisations.findFirst({ where: eq(organisations.slug, scenario.slug) });
    if (existing) {
      report.organisations.push({ name: scenario.name, created: false });
      continue;
    }
    await database.transaction(async (tx) => seedOrganisation(tx as unknown as Database, scenario, passwordHash));
    report.organisations.push({ name: scenario.name, created: true });
  }
  return report;
}

const DAY_MS = 86_400_000;

/**
 * Days from the seed's today to a demo vehicle's registration expiry. Nearly every registration
 * is current (45 days to about a year ahead); three of the larger fleet are set for the demo:
 * MH-011 expired twelve days ago (not ready), MH-017 and MH-028 fall due within 30 days (limited,
 * with the reason shown).
 */
const DEMO_REGISTRATION_DAYS: Readonly<Record<number, number>> = { 10: -12, 16: 9, 27: 24 };

export function registrationExpiry(index: number, now: Date): Date {
  const today = Date.UTC(now.getUTCFullYear(), now.getUTCMonth(), now.getUTCDate());
  const days = DEMO_REGISTRATION_DAYS[index] ?? 45 + ((index * 53) % 320);
  return new Date(today + days * DAY_MS);
}

const STATE_PATTERN = ["in_service", "in_service", "in_service", "in_service", "in_fitout", "in_service", "in_service", "in_service", "in_service", "in_service"] as const;

async function seedOrganisation(tx: Database, scenario: DemoOrganisation, passwordHash: string) {
  const [org] = await tx
    .insert(organisations)
    .values({ slug: scenario.slug, name: scenario.name, approvalThresholdCents: scenario.approvalThresholdCents, timeZone: scenario.timeZone })
    .returning();
  if (!org) throw new Error("organisation insert failed");

  const depotRows = await tx
    .insert(depots)
    .values(scenario.depots.map((d) => ({ ...d, orgId: org.id })))
    .returning();
  const depotByCode = new Map(depotRows.map((d) => [d.code, d]));

  const firmRows = await tx
    .insert(contractorFirms)
    .values(scenario.firms.map((f) => ({ ...f, orgId: org.id })))
    .returning();
  const firmByName = new Map(firmRows.map((f) => [f.name, f]));

  const drivers: string[] = [];
  for (const person of scenario.people) {
    const [user] = await tx
      .insert(users)
      .values({ email: person.email, name: person.name, passwordHash })
      .onConflictDoUpdate({ target: users.email, set: { name: person.name } })
      .returning();
    if (!user) throw new Error("user insert failed");
    await tx.insert(memberships).values({
      orgId: org.id,
      userId: user.id,
      role: person.role,
      firmId: person.firm ? (firmByName.get(person.firm)?.id ?? null) : null,
      depotId: person.depot ? (depotByCode.get(person.depot)?.id ?? null) : null,
    });
    if (person.role === "driver") drivers.push(user.id);
  }

  const platformRows = await tx
    .insert(platforms)
    .values(scenario.platforms.map(({ code: _code, ...p }) => ({ ...p, orgId: org.id })))
    .returning();

  const now = new Date();
  for (let i = 0; i < scenario.vehicleCount; i++) {
    const platform = platformRows[i % platformRows.length]!;
    const depot = depotRows[i % depotRows.length]!;
    let state: (typeof STATE_PATTERN)[number] | "grounded" | "retired" = STATE_PATTERN[i % STATE_PATTERN.length]!;
    if (i === 7 || i === 23) state = "grounded";
    if (i === scenario.vehicleCount - 1) state = "retired";
    const [vehicle] = await tx
      .insert(vehicles)
      .values({
        orgId: org.id,
        fleetNumber: `${scenario.fleetPrefix}-${String(i + 1).padStart(3, "0")}`,
        vin: demoVin(scenario.fleetPrefix, i),
        registration: demoRegistration(scenario.fleetPrefix, i),
        registrationExpiry: registrationExpiry(i, now),
        platformId: platform.id,
        depotId: depot.id,
        costCentre: `CC-${depot.code}-${platform.make.slice(0, 3).toUpperCase()}`,
        state,
        groundedReason: state === "grounded" ? "Front shock absorber leaking; waiting for parts" : null,
        odometerKm: 18_000 + ((i * 7919) % 160_000),
        buildYear: 2019 + (i % 7),
      })
      .returning();
    // The first drivers get a few vehicles each, all at their depot's side of the fleet.
    const driverId = drivers[i % Math.max(1, drivers.length)];
    if (vehicle && driverId && i < drivers.length * 3) {
      await tx.insert(vehicleDrivers).values({ vehicleId: vehicle.id, userId: driverId });
    }
  }
  await seedStandards(tx, org.id, scenario.slug);
  await seedJobs(tx, org.id);
  await seedDefects(tx, org.id);
  await seedCosts(tx, org.id);
}
