import "server-only";
import { z } from "zod";
import { db } from "@/db/client";
import { findVehicle } from "@/db/vehicles";
import { notFound } from "@/lib/server/errors";
import { query } from "@/lib/server/operation";

export const getVehicle = query({
  name: "vehicle.read",
  input: z.object({ id: z.string().min(1).max(64) }),
  permission: ["read", "Vehicle"],
  run: async ({ user, input }) => {
    const found = await findVehicle(db(), user, input.id);
    if (!found) throw notFound("That vehicle");
    const { vehicle, platform, depotName, drivers } = found;
    return {
      id: vehicle.id,
      fleetNumber: vehicle.fleetNumber,
      vin: vehicle.vin,
      registration: vehicle.registration,
      registrationExpiry: vehicle.registrationExpiry,
      state: vehicle.state,
      groundedReason: vehicle.groundedReason,
      odometerKm: vehicle.odometerKm,
      buildYear: vehicle.buildYear,
      costCentre: vehicle.costCentre,
      depot: depotName,
      platform: { id: platform.id, make: platform.make, model: platform.model, variant: platform.variant },
      drivers,
      version: vehicle.version,
    };
  },
});
