import { InputError } from "../errors";
import { isSpeedSymbol, SPEED_SYMBOLS, type SpeedSymbol } from "./loadIndex";

export const MM_PER_INCH = 25.4;

export interface TyreSize {
  /** The size written the standard way, e.g. "LT265/70R17 121/118S" or "35x12.50R17LT". */
  designation: string;
  kind: "metric" | "flotation";
  /** "P" (passenger) or "LT" (light truck) where the size says so. */
  service?: "P" | "LT";
  sectionWidthMm: number;
  /** Section height as a percentage of width (metric sizes only). */
  aspectRatio?: number;
  rimIn: number;
  overallDiameterMm: number;
  overallDiameterIn: number;
  loadIndexSingle?: number;
  loadIndexDual?: number;
  speedSymbol?: SpeedSymbol;
}

const METRIC_FORM = "a metric size like 265/70R17, LT285/75R16 or 265/70R17 121/118S";
const FLOTATION_FORM = "a flotation size like 35x12.50R17 or 33x12.50R15LT 108Q";
const ANY_FORM = `${METRIC_FORM}, or ${FLOTATION_FORM}`;
const SERVICE_FORM = "a load index and speed symbol like 112T, or single/dual load indexes like 121/118S";

// Numbers are kept loose in the patterns; ranges are checked after, so the message can name
// the part that is wrong rather than just "bad size".
const METRIC = /^(LT|P)?\s*(\d{2,3})\s*\/\s*(\d{2,3})\s*(R)\s*(\d{2}(?:\.\d)?)\s*(LT)?(?=\s|$|\d)/;
const FLOTATION = /^(LT)?\s*(\d{2}(?:\.\d{1,2})?)\s*X\s*(\d{1,2}(?:\.\d{1,2})?)\s*R\s*(\d{2}(?:\.\d)?)\s*(LT)?(?=\s|$|\d)/;
const SERVICE = /^(\d{2,3})(?:\s*\/\s*(\d{2,3}))?\s*([A-Z])$/;

function inRange(field: string, what: string, value: number, min: number, max: number, unit: string): number {
  if (!(value >= min && value <= max)) {
    throw new InputError(field, `${what} ${value} ${unit} is out of range; expected ${min}–${max} ${unit}`);
  }
  return value;
}

function parseService(field: string, rest: string): Pick<TyreSize, "loadIndexSingle" | "loadIndexDual" | "speedSymbol"> {
  if (rest === "") return {};
  const m = SERVICE.exec(rest);
  if (!m) {
    throw new InputError(field, `service description "${rest}" is not understood; expected ${SERVICE_FORM}`);
  }
  const single = Number(m[1]);
  const dual = m[2] === undefined ? undefined : Number(m[2]);
  const symbol = m[3] ?? "";
  if (!isSpeedSymbol(symbol)) {
    throw new InputError(field, `speed symbol "${symbol}" is not known; expected one of ${SPEED_SYMBOLS.join(", ")}`);
  }
  if (dual !== undefined && dual > single) {
    throw new InputError(field, `dual load index ${dual} is above the single index ${single}; expected single/dual like 121/118S`);
  }
  return { loadIndexSingle: single, loadIndexDual: dual, speedSymbol: symbol };
}

function serviceText(s: Pick<TyreSize, "loadIndexSingle" | "loadIndexDual" | "speedSymbol">): string {
  if (s.loadIndexSingle === undefined) return "";
  return ` ${s.loadIndexSingle}${s.loadIndexDual === undefined ? "" : `/${s.loadIndexDual}`}${s.speedSymbol ?? ""}`;
}

/**
 * Parses a tyre size. Metric: overall diameter = rim (in) × 25.4 + 2 × width × aspect / 100
 * (ETRTO / ISO metric designation). Flotation: the first number is the nominal overall diameter
 * in inches (not calculated). Throws InputError naming `field` with the expected form.
 */
export function parseTyreSize(text: string, field = "size"): TyreSize {
  if (typeof text !== "string" || text.trim() === "") {
    throw new InputError(field, `tyre size is empty; expected ${ANY_FORM}`);
  }
  const src = text.trim().toUpperCase().replace(/\s+/g, " ");

  const metric = METRIC.exec(src);
  if (metric) {
    const widthMm = inRange(field, "section width", Number(metric[2]), 100, 500, "mm");
    const aspect = inRange(field, "aspect ratio", Number(metric[3]), 20, 110, "%");
    const rimIn = inRange(field, "rim diameter", Number(metric[5]), 10, 26, "in");
    const lt = metric[1] === "LT" || metric[6] === "LT";
    const service: TyreSize["service"] = lt ? "LT" : metric[1] === "P" ? "P" : undefined;
    const sd = parseService(field, src.slice(metric[0].length).trim());
    const diameterMm = rimIn * MM_PER_INCH + (2 * widthMm * aspect) / 100;
    return {
      designation: `${service ?? ""}${widthMm}/${aspect}R${rimIn}${serviceText(sd)}`,
      kind: "metric",
      ...(service ? { service } : {}),
      sectionWidthMm: widthMm,
      aspectRatio: aspect,
      rimIn,
      overallDiameterMm: diameterMm,
      overallDiameterIn: diameterMm / MM_PER_INCH,
      ...definedOnly(sd),
    };
  }

  const flot = FLOTATION.exec(src);
  if (flot) {
    const diameterIn = inRange(field, "overall diameter", Number(flot[2]), 20, 50, "in");
    const widthIn = inRange(field, "section width", Number(flot[3]), 6, 20, "in");
    const rimIn = inRange(field, "rim diameter", Number(flot[4]), 10, 26, "in");
    if (rimIn >= diameterIn) {
      throw new InputError(field, `rim ${rimIn} in is not smaller than the tyre's ${diameterIn} in diameter; expected ${FLOTATION_FORM}`);
    }
    const lt = flot[1] === "LT" || flot[5] === "LT";
    const sd = parseService(field, src.slice(flot[0].length).trim());
    return {
      designation: `${diameterIn}x${widthIn.toFixed(2)}R${rimIn}${lt ? "LT" : ""}${serviceText(sd)}`,
      kind: "flotation",
      ...(lt ? { service: "LT" as const } : {}),
      sectionWidthMm: widthIn * MM_PER_INCH,
      rimIn,
      overallDiameterMm: diameterIn * MM_PER_INCH,
      overallDiameterIn: diameterIn,
      ...definedOnly(sd),
    };
  }

  const expected = /\dX\d/.test(src.replace(/\s/g, "")) ? FLOTATION_FORM : /\//.test(src) ? METRIC_FORM : ANY_FORM;
  throw new InputError(field, `tyre size "${text.trim()}" is not understood; expected ${expected}`);
}

function definedOnly<T extends object>(o: T): Partial<T> {
  return Object.fromEntries(Object.entries(o).filter(([, v]) => v !== undefined)) as Partial<T>;
}
