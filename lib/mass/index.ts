export { type AxleShare, type PointMass, leverRule } from "./lever";
export {
  DEFAULT_ZONE_POSITIONS,
  ZONES,
  type Zone,
  type ZoneOverrides,
  type ZonePosition,
  isZone,
  positionXMm,
  zoneXMm,
} from "./zones";
export {
  type AxleLimit,
  type AxleLoadsApiInput,
  type AxleLoadsInput,
  type AxleLoadsResult,
  axleLoads,
  axleLoadsInputSchema,
} from "./axleLoads";
export {
  DEFAULT_ABOVE_STANDARD_WARN_KG,
  DEFAULT_OCCUPANT_MASS_KG,
  DIESEL_DENSITY_KG_PER_L,
  WATER_DENSITY_KG_PER_L,
  type MassCheck,
  type MassItem,
  type MassLimit,
  type MassLine,
  type MassSplit,
  type PlatformMassFigures,
  type VehicleMassInput,
  type VehicleMassResult,
  vehicleMass,
} from "./vehicleMass";
export {
  type ReconcileResult,
  type ReconcileRow,
  type WeighbridgeTolerance,
  reconcileWeighbridge,
} from "./weighbridge";
export { type VehicleMassApiInput, vehicleMassInputSchema } from "./vehicleMassSchema";
