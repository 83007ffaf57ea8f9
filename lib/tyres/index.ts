export {
  LOAD_INDEX_KG,
  LOAD_INDEX_MAX,
  LOAD_INDEX_MIN,
  SPEED_SYMBOL_KMH,
  SPEED_SYMBOLS,
  type SpeedSymbol,
  isKnownLoadIndex,
  isSpeedSymbol,
  loadIndexKg,
  speedSymbolKmh,
} from "./loadIndex";
export { MM_PER_INCH, type TyreSize, parseTyreSize } from "./size";
export {
  DEFAULT_SPEEDS_KMH,
  type SpeedometerRow,
  allowedIndicatedRangeKmh,
  speedometerCompliant,
  speedometerRows,
  trueSpeedRangeForIndicatedKmh,
} from "./speedometer";
export { type AxleTyreCapacity, type TyreChangeInput, type TyreChangeResult, tyreChange } from "./change";
export { type TyreChangeApiInput, tyreChangeInputSchema } from "./schema";
