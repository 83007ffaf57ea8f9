import type { ExistingVehicle, UpsertPlan, ValidRow, VehicleRowValues } from "@/imports";

/** Applies a plan the way the database layer will: creates get new ids, updates set their changes. */
export function applyPlan(existing: readonly ExistingVehicle[], plan: UpsertPlan): ExistingVehicle[] {
  const next = existing.map((vehicle) => ({ ...vehicle }));
  let created = 0;
  for (const planned of plan.rows) {
    if (planned.action === "create") {
      const { kerbMassKg: _k, gvmKg: _g, frontAxleRatingKg: _f, rearAxleRatingKg: _r, ...vehicle } = planned.values;
      next.push({ id: `new-${++created}`, ...vehicle });
    } else if (planned.action === "update") {
      const target = next.find((vehicle) => vehicle.id === planned.vehicleId)!;
      for (const change of planned.changes) (target as unknown as Record<string, unknown>)[change.field] = change.after;
    }
  }
  return next;
}

export function row(rowNumber: number, values: Partial<VehicleRowValues> & { fleetNumber: string }): ValidRow {
  return {
    rowNumber,
    values: {
      vin: null, registration: null, registrationExpiry: null, make: null, model: null, variant: null, buildYear: null,
      depot: null, costCentre: null, state: null, odometerKm: null, kerbMassKg: null, gvmKg: null, frontAxleRatingKg: null,
      rearAxleRatingKg: null, notes: null, ...values,
    },
  };
}
