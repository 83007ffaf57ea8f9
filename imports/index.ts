export { ImportFileError, IMPORT_FILE_ERROR_STATUS, importFileErrorStatus, type ImportFileErrorCode } from "./errors";
export {
  VEHICLE_FIELDS,
  VEHICLE_FIELD_INFO,
  REQUIRED_VEHICLE_FIELDS,
  PLATFORM_RATING_FIELDS,
  VEHICLE_STATES,
  isVehicleField,
  type VehicleField,
  type VehicleFieldInfo,
  type PlatformRatingField,
  type VehicleState,
} from "./fields";
export {
  parseSpreadsheet,
  DEFAULT_MAX_BYTES,
  DEFAULT_MAX_ROWS,
  type CellValue,
  type ParsedRow,
  type ParsedSpreadsheet,
  type ParseOptions,
} from "./parse";
export type { SpreadsheetFormat } from "./detect";
export {
  matchHeaders,
  normaliseHeader,
  suggestField,
  isKnownHeader,
  type HeaderMapping,
  type HeaderMatch,
  type DuplicateClaim,
} from "./headers";
export {
  validateRows,
  makeVehicleRowSchema,
  vehicleRowSchema,
  vehicleImportMappingSchema,
  vehicleStateSchema,
  type VehicleRowValues,
  type VehicleRowInput,
  type RowContext,
  type ValidRow,
  type RowError,
  type RowValidation,
  type ValidateOptions,
} from "./vehicle-row";
export {
  planUpsert,
  UPSERT_FIELDS,
  type UpsertField,
  type ExistingVehicle,
  type KnownPlatform,
  type PlanOptions,
  type FieldChange,
  type FieldValue,
  type MatchedBy,
  type PlannedRow,
  type NewPlatform,
  type UpsertPlan,
} from "./plan";
export { vehicleImportTemplate, TEMPLATE_SHEET, TEMPLATE_NOTES_SHEET } from "./template";
