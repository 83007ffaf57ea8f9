import { InputError } from "../errors";

/**
 * Tyre load index → maximum load per tyre in kg (ISO 4000-1 / ETRTO load index table).
 * 95–124 agree across several published tables. 125–130 are from memory (unverified): the
 * table steps by 50 kg there, but confirm against a current handbook before relying on them.
 */
export const LOAD_INDEX_KG: Readonly<Record<number, number>> = Object.freeze({
  95: 690, 96: 710, 97: 730, 98: 750, 99: 775, 100: 800, 101: 825, 102: 850, 103: 875,
  104: 900, 105: 925, 106: 950, 107: 975, 108: 1000, 109: 1030, 110: 1060, 111: 1090,
  112: 1120, 113: 1150, 114: 1180, 115: 1215, 116: 1250, 117: 1285, 118: 1320, 119: 1360,
  120: 1400, 121: 1450, 122: 1500, 123: 1550, 124: 1600,
  // from memory (unverified)
  125: 1650, 126: 1700, 127: 1750, 128: 1800, 129: 1850, 130: 1900,
});

export const LOAD_INDEX_MIN = 95;
export const LOAD_INDEX_MAX = 130;

export function isKnownLoadIndex(loadIndex: number): boolean {
  return Number.isInteger(loadIndex) && LOAD_INDEX_KG[loadIndex] !== undefined;
}

/** Maximum load per tyre for a load index; throws InputError for an index outside the table. */
export function loadIndexKg(loadIndex: number, field = "loadIndex"): number {
  const kg = Number.isInteger(loadIndex) ? LOAD_INDEX_KG[loadIndex] : undefined;
  if (kg === undefined) {
    throw new InputError(
      field,
      `load index ${String(loadIndex)} is not in the table; expected a whole number from ${LOAD_INDEX_MIN} to ${LOAD_INDEX_MAX}`,
    );
  }
  return kg;
}

/** Speed symbol → maximum speed in km/h (ISO 4000-1 / ETRTO). H sits between U and V. */
export const SPEED_SYMBOL_KMH = Object.freeze({
  L: 120, M: 130, N: 140, P: 150, Q: 160, R: 170, S: 180, T: 190, U: 200, H: 210, V: 240, W: 270, Y: 300,
} as const);

export type SpeedSymbol = keyof typeof SPEED_SYMBOL_KMH;

export const SPEED_SYMBOLS = Object.freeze(Object.keys(SPEED_SYMBOL_KMH) as SpeedSymbol[]);

export function isSpeedSymbol(value: string): value is SpeedSymbol {
  return Object.prototype.hasOwnProperty.call(SPEED_SYMBOL_KMH, value);
}

/** Maximum speed for a speed symbol (case-insensitive); throws InputError for an unknown one. */
export function speedSymbolKmh(symbol: string, field = "speedSymbol"): number {
  const key = typeof symbol === "string" ? symbol.trim().toUpperCase() : "";
  if (!isSpeedSymbol(key)) {
    throw new InputError(
      field,
      `speed symbol "${String(symbol)}" is not known; expected one of ${SPEED_SYMBOLS.join(", ")}`,
    );
  }
  return SPEED_SYMBOL_KMH[key];
}
