import { InputError, requireFinite, requirePositive } from "@/lib/errors";

/**
 * Annealed copper at 20 °C: 0.017241 Ω·mm²/m (1/58), temperature coefficient 0.00393 /°C
 * (IEC 60028). Every resistance in Rigline's 12 V plan starts from these two numbers.
 */
export const COPPER_RESISTIVITY_OHM_MM2_PER_M_20C = 0.017241;
export const COPPER_TEMPERATURE_COEFFICIENT_PER_C = 0.00393;
export const REFERENCE_TEMPERATURE_C = 20;

/** Conductor temperatures the linear resistivity model is used for (a vehicle loom, cold to hot). */
export const MIN_CONDUCTOR_TEMPERATURE_C = -40;
export const MAX_CONDUCTOR_TEMPERATURE_C = 120;

export function requireConductorTemperature(field: string, temperatureC: number): number {
  requireFinite(field, temperatureC);
  if (temperatureC < MIN_CONDUCTOR_TEMPERATURE_C || temperatureC > MAX_CONDUCTOR_TEMPERATURE_C) {
    throw new InputError(
      field,
      `${field} must be between ${MIN_CONDUCTOR_TEMPERATURE_C} and ${MAX_CONDUCTOR_TEMPERATURE_C} °C`,
    );
  }
  return temperatureC;
}

/** ρ(T) = ρ20 × (1 + α (T − 20)), in Ω·mm²/m. */
export function copperResistivityOhmMm2PerM(temperatureC: number = REFERENCE_TEMPERATURE_C): number {
  requireConductorTemperature("temperatureC", temperatureC);
  return (
    COPPER_RESISTIVITY_OHM_MM2_PER_M_20C *
    (1 + COPPER_TEMPERATURE_COEFFICIENT_PER_C * (temperatureC - REFERENCE_TEMPERATURE_C))
  );
}

/** Resistance of one conductor of the given cross-section and length. */
export function conductorResistanceOhm(input: {
  areaMm2: number;
  lengthM: number;
  temperatureC?: number;
}): number {
  requirePositive("areaMm2", input.areaMm2);
  requirePositive("lengthM", input.lengthM);
  return (copperResistivityOhmMm2PerM(input.temperatureC) * input.lengthM) / input.areaMm2;
}

/** Resistance per kilometre, the way conductor standards tabulate it (Ω/km). */
export function conductorResistanceOhmPerKm(areaMm2: number, temperatureC?: number): number {
  return conductorResistanceOhm({ areaMm2, lengthM: 1000, temperatureC });
}
