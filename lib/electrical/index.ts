export {
  COPPER_RESISTIVITY_OHM_MM2_PER_M_20C,
  COPPER_TEMPERATURE_COEFFICIENT_PER_C,
  REFERENCE_TEMPERATURE_C,
  MIN_CONDUCTOR_TEMPERATURE_C,
  MAX_CONDUCTOR_TEMPERATURE_C,
  copperResistivityOhmMm2PerM,
  conductorResistanceOhm,
  conductorResistanceOhmPerKm,
} from "./copper";
export {
  METRIC_SIZES_MM2,
  AWG_GAUGES,
  awgDiameterMm,
  awgAreaMm2,
  awgLabel,
  conductorSizes,
  nextSizeAtOrAbove,
  type SizeSeries,
  type ConductorSize,
} from "./sizes";
export { voltageDrop, minAreaForDropMm2, type VoltageDropInput, type VoltageDropResult } from "./voltage-drop";
export { CABLE_RATING_A_BY_MM2, CABLE_RATING_SOURCE, cableRatingA } from "./ampacity";
export { STANDARD_FUSE_RATINGS_A, FUSE_HEADROOM, FUSE_LOCATION, fuseBetween } from "./fuses";
export {
  MAX_DROP_PCT_BY_CIRCUIT,
  DEFAULT_CIRCUIT,
  cableRunInputSchema,
  cableRun,
  type CircuitKind,
  type CableRunInput,
  type CableRunResult,
  type CableCheck,
} from "./cable-run";
export {
  USABLE_DEPTH_OF_DISCHARGE,
  DEFAULT_INVERTER_EFFICIENCY,
  STANDARD_BATTERY_SIZES_AH,
  batteryPlanInputSchema,
  batteryPlan,
  suggestBattery,
  type BatteryChemistry,
  type BatteryConsumer,
  type BatteryPlanInput,
  type BatteryPlanResult,
  type ConsumerBudget,
  type SuggestedBattery,
} from "./battery";
export {
  SOLAR_DERATING,
  rechargeInputSchema,
  rechargeTime,
  type ChargeSourceKind,
  type ChargeSource,
  type RechargeInput,
  type RechargeResult,
  type ChargeSourceResult,
} from "./recharge";
export { batteryCalcInputSchema, batteryCalc, type BatteryCalcInput, type BatteryCalcResult } from "./battery-calc";
export {
  PLAN_CHEMISTRIES,
  PLAN_SOURCE_KINDS,
  PLAN_CIRCUITS,
  electricalPlanSchema,
  planConsumerSchema,
  planSourceSchema,
  planRunSchema,
  summariseElectricalPlan,
  type ElectricalPlan,
  type ElectricalPlanInput,
  type ElectricalPlanSummary,
  type CableRunSummary,
} from "./plan";
