import { and, eq, inArray, or, sql, type SQL } from "drizzle-orm";
import type { Actor } from "@/lib/permissions";
import { jobOffers, jobs, vehicleDrivers, vehicles } from "./schema";

/**
 * The vehicles a user may see: always inside their organisation; a driver only the vehicles
 * assigned to them; a contractor only the vehicles of jobs offered or awarded to their firm.
 */
export function vehicleScope(actor: Actor, options: { named?: boolean } = {}): SQL {
  // With named vehicles the organisation is checked, not searched: the unary plus keeps SQLite
  // from walking the organisation's index in fleet-number order instead of looking the ids up
  // (SQLite query optimizer overview, "Disqualifying WHERE clause terms using unary +").
  const inOrg = options.named ? sql`+${vehicles.orgId} = ${actor.orgId}` : eq(vehicles.orgId, actor.orgId);
  if (actor.role === "driver") {
    return and(
      inOrg,
      inArray(vehicles.id, sql`(select ${vehicleDrivers.vehicleId} from ${vehicleDrivers} where ${vehicleDrivers.userId} = ${actor.userId})`),
    )!;
  }
  if (actor.role === "contractor") {
    const firm = actor.firmId ?? "__none__";
    return and(
      inOrg,
      or(
        inArray(
          vehicles.id,
          sql`(select ${jobs.vehicleId} from ${jobs} join ${jobOffers} on ${jobOffers.jobId} = ${jobs.id} where ${jobOffers.firmId} = ${firm} and ${jobs.orgId} = ${actor.orgId})`,
        ),
        inArray(vehicles.id, sql`(select ${jobs.vehicleId} from ${jobs} where ${jobs.awardedFirmId} = ${firm} and ${jobs.orgId} = ${actor.orgId})`),
      ),
    )!;
  }
  return inOrg;
}

/**
 * The given vehicles, of those the actor may see: one bound parameter for any number of ids
 * (SQLite caps bound parameters per statement), looked up by id.
 */
export function namedVehicles(actor: Actor, vehicleIds: readonly string[]): SQL {
  const ids = sql`(select value from json_each(${JSON.stringify([...new Set(vehicleIds)])}))`;
  return and(vehicleScope(actor, { named: true }), inArray(vehicles.id, ids))!;
}
