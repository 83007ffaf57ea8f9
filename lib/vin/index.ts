export { VIN_WEIGHTS, vinCharacterValue, vinCheckDigit, type VinCheckDigit } from "./check-digit";
export {
  VIN_LENGTH,
  normaliseVin,
  checkVin,
  requireVin,
  vinSchema,
  type VinCheck,
  type VinProblem,
  type VinCheckDigitReport,
} from "./check-vin";
