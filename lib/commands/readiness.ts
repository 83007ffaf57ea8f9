import "server-only";
import { z } from "zod";
import { db } from "@/db/client";
import { fleetReadinessCounts, loadVehicleReadiness } from "@/db/readiness";
import { notFound } from "@/lib/server/errors";
import { query } from "@/lib/server/operation";

/** GET /api/vehicles/{id}/readiness: ready, limited or not ready, with every reason. */
export const getVehicleReadiness = query({
  name: "readiness.vehicle",
  input: z.object({ id: z.string({ error: "id is required" }).trim().min(1, { error: "id is required" }).max(64) }),
  permission: ["read", "Variance"],
  run: async ({ user, input, now }) => {
    const readiness = await loadVehicleReadiness(db(), user, input.id, now);
    if (!readiness) throw notFound("That vehicle");
    return { ...readiness, computedAt: now };
  },
});

/** Counts of the actor's vehicles in each readiness state (retired vehicles not counted). */
export const getFleetReadinessCounts = query({
  name: "readiness.fleet_counts",
  input: z.object({}).passthrough(),
  permission: ["read", "Variance"],
  run: async ({ user, now }) => fleetReadinessCounts(db(), user, now),
});
