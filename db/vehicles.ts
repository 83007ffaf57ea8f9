import { and, asc, count, eq } from "drizzle-orm";
import type { Actor } from "@/lib/permissions";
import type { DbOrTx } from "./client";
import { depots, platforms, users, vehicleDrivers, vehicles } from "./schema";
import { vehicleScope } from "./scope";

export async function countVehiclesByState(db: DbOrTx, actor: Actor) {
  const rows = await db
    .select({ state: vehicles.state, n: count() })
    .from(vehicles)
    .where(vehicleScope(actor))
    .groupBy(vehicles.state);
  return Object.fromEntries(rows.map((r) => [r.state, r.n])) as Partial<Record<(typeof vehicles.state.enumValues)[number], number>>;
}

const summaryColumns = {
  id: vehicles.id,
  fleetNumber: vehicles.fleetNumber,
  registration: vehicles.registration,
  vin: vehicles.vin,
  state: vehicles.state,
  odometerKm: vehicles.odometerKm,
  costCentre: vehicles.costCentre,
  make: platforms.make,
  model: platforms.model,
  variant: platforms.variant,
  depotName: depots.name,
};

export async function listVehicleSummaries(db: DbOrTx, actor: Actor, options: { state?: string; limit?: number } = {}) {
  const where = options.state
    ? and(vehicleScope(actor), eq(vehicles.state, options.state as (typeof vehicles.state.enumValues)[number]))
    : vehicleScope(actor);
  return db
    .select(summaryColumns)
    .from(vehicles)
    .innerJoin(platforms, eq(platforms.id, vehicles.platformId))
    .leftJoin(depots, eq(depots.id, vehicles.depotId))
    .where(where)
    .orderBy(asc(vehicles.fleetNumber))
    .limit(options.limit ?? 500);
}

/** One vehicle the actor may see, or null (another organisation's id is simply not found). */
export async function findVehicle(db: DbOrTx, actor: Actor, id: string) {
  const [row] = await db
    .select({ vehicle: vehicles, platform: platforms, depotName: depots.name })
    .from(vehicles)
    .innerJoin(platforms, eq(platforms.id, vehicles.platformId))
    .leftJoin(depots, eq(depots.id, vehicles.depotId))
    .where(and(vehicleScope(actor), eq(vehicles.id, id)))
    .limit(1);
  if (!row) return null;
  const drivers = await db
    .select({ id: users.id, name: users.name })
    .from(vehicleDrivers)
    .innerJoin(users, eq(users.id, vehicleDrivers.userId))
    .where(eq(vehicleDrivers.vehicleId, id));
  return { ...row, drivers };
}
