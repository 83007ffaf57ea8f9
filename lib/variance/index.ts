export * from "./types";
export { lineVariance, vehicleVariance } from "./variance";
export { fleetVariance, rollUpFleet, statusOfSummary, vehicleFigures, varianceStatus, costToClose } from "./fleet";
export type { FleetVariance, FleetVehicleFigures, FleetVehicleInput, FleetVehicleResult, ShareOfFleet } from "./fleet";
export { evaluateCriterion, valuesEqual, normaliseText, asNumber, NOT_RECORDED } from "./criteria";
export type { CriterionResult } from "./criteria";
export { checkLine as checkEditionLine, checkFitment, checkConcession } from "./validate";
