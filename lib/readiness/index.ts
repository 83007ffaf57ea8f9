export {
  tripReadiness,
  describeCriterion,
  CRITICAL_CATEGORIES,
  DEFAULT_SOON_DAYS,
  DEFECT_SEVERITIES,
  LIMITED_ROADS,
  VEHICLE_STATES,
} from "./readiness";
export { addMonths, expiringItemsOf } from "./expiry";
export { criticalGapCount, earliestExpiry, nextReadinessChange, readinessFactsOf, readinessStateOf, type ReadinessFacts } from "./brief";
export type {
  DefectSeverity,
  ExpiringItem,
  OpenDefect,
  ReadinessReason,
  ReadinessState,
  ReasonCode,
  ReasonSeverity,
  TripReadiness,
  TripReadinessInput,
  VehicleState,
} from "./readiness";
