import { z } from "zod";
import { InputError } from "@/lib/errors";
import { checkVin } from "@/lib/vin";
import { coerceBuildYear, coerceDate, coerceQuantity, coerceState, coerceText, type Coerced } from "./coerce";
import {
  PLATFORM_RATING_FIELDS,
  REQUIRED_VEHICLE_FIELDS,
  VEHICLE_FIELD_INFO,
  VEHICLE_FIELDS,
  VEHICLE_STATES,
  isVehicleField,
  type PlatformRatingField,
  type VehicleField,
  type VehicleState,
} from "./fields";
import { getOwn } from "./own";
import type { CellValue, ParsedSpreadsheet } from "./parse";

/** One clean row. Fields the file does not give are null ("not given", not "clear it"). */
export interface VehicleRowValues {
  fleetNumber: string;
  vin: string | null;
  registration: string | null;
  /** Calendar date, YYYY-MM-DD. */
  registrationExpiry: string | null;
  make: string | null;
  model: string | null;
  variant: string | null;
  buildYear: number | null;
  depot: string | null;
  costCentre: string | null;
  state: VehicleState | null;
  odometerKm: number | null;
  kerbMassKg: number | null;
  gvmKg: number | null;
  frontAxleRatingKg: number | null;
  rearAxleRatingKg: number | null;
  notes: string | null;
}

export interface RowContext {
  /** "Today", for the build-year limit (next year at most); default: the moment of parsing. */
  now?: Date;
  /** The workbook counts date serials from 1904. */
  date1904?: boolean;
  /** Multiplier for plain numbers per mass field (1000 when the heading says tonnes). */
  massFactors?: Partial<Record<PlatformRatingField, number>>;
}

/** Cells people fill in to mean "nothing here". */
const PLACEHOLDERS = new Set(["-", "--", "—", "n/a", "na", "nil", "none", "tba", "tbc", "unknown", "?"]);

const MAX_MASS_KG = 100_000;
const MAX_ODOMETER_KM = 10_000_000;

function withoutPlaceholder(value: CellValue): CellValue {
  return typeof value === "string" && PLACEHOLDERS.has(value.trim().toLowerCase()) ? null : value;
}

const cellInput = z.union([z.string(), z.number(), z.date(), z.null()], {
  error: "A cell must hold text, a number, a date or nothing",
});

/** A zod field that coerces one cell and reports the coercion's sentence as the issue. */
function cellField<T>(convert: (value: CellValue) => Coerced<T>, options: { keepPlaceholders?: boolean } = {}) {
  return cellInput.optional().transform((raw, ctx): T | null => {
    const value = raw === undefined ? null : options.keepPlaceholders ? raw : withoutPlaceholder(raw);
    const result = convert(value);
    if (!result.ok) {
      ctx.issues.push({ code: "custom", message: result.message, input: raw });
      return z.NEVER;
    }
    return result.value;
  });
}

function massField(field: PlatformRatingField, context: RowContext) {
  const label = VEHICLE_FIELD_INFO[field].label;
  const plainFactor = context.massFactors?.[field] ?? 1;
  return cellField((value) => coerceQuantity(value, label, { unit: "kg", plainFactor, sign: "positive", max: MAX_MASS_KG }));
}

function textField(field: VehicleField, maxLength: number, multiline = false) {
  const label = VEHICLE_FIELD_INFO[field].label;
  return cellField((value) => coerceText(value, label, { maxLength, multiline }), { keepPlaceholders: multiline });
}

/**
 * The zod schema for one row, keyed by field, taking raw cells (text, number, Date or null) and
 * giving `VehicleRowValues`. Every issue's message is a plain sentence; its path is the field.
 */
export function makeVehicleRowSchema(context: RowContext = {}) {
  const date1904 = context.date1904 ?? false;
  return z
    .object({
      fleetNumber: cellField((value): Coerced<string> => {
        const text = coerceText(value, "Fleet number", { maxLength: 32 });
        if (text.ok && text.value === null) return { ok: false, message: "Fleet number is empty; every row needs one" };
        return text;
      }),
      vin: cellField((value): Coerced<string> => {
        const text = coerceText(value, "VIN", { maxLength: 64 });
        if (!text.ok || text.value === null) return text;
        // Structure per ISO 3779 from the shared VIN module; its check-digit report is information only.
        const check = checkVin(text.value);
        if (check.structureOk) return { ok: true, value: check.normalised };
        return { ok: false, message: check.problems.map((problem) => problem.message).join(" ") };
      }),
      registration: textField("registration", 16),
      registrationExpiry: cellField((value) => coerceDate(value, "Registration expiry", date1904)),
      make: textField("make", 64),
      model: textField("model", 64),
      variant: textField("variant", 64),
      buildYear: cellField((value) => coerceBuildYear(value, "Build year", context.now ?? new Date())),
      depot: textField("depot", 64),
      costCentre: textField("costCentre", 32),
      state: cellField((value) => coerceState(value, "Status")),
      odometerKm: cellField((value) =>
        coerceQuantity(value, "Odometer", { unit: "km", integer: "round", sign: "nonNegative", max: MAX_ODOMETER_KM }),
      ),
      kerbMassKg: massField("kerbMassKg", context),
      gvmKg: massField("gvmKg", context),
      frontAxleRatingKg: massField("frontAxleRatingKg", context),
      rearAxleRatingKg: massField("rearAxleRatingKg", context),
      notes: textField("notes", 2000, true),
    })
    .check((ctx) => {
      const { kerbMassKg, gvmKg } = ctx.value;
      // Payload is GVM less kerb mass, so a kerb mass at or above GVM leaves none: a typo.
      if (kerbMassKg !== null && gvmKg !== null && kerbMassKg >= gvmKg) {
        ctx.issues.push({
          code: "custom",
          path: ["kerbMassKg"],
          message: `Kerb mass ${kerbMassKg.toLocaleString("en-AU")} kg is not below GVM ${gvmKg.toLocaleString("en-AU")} kg`,
          input: ctx.value,
        });
      }
    });
}

/** The row schema with default context (today's date, 1900 date system, masses in kg). */
export const vehicleRowSchema = makeVehicleRowSchema();

export type VehicleRowInput = z.input<typeof vehicleRowSchema>;

/** Zod schema for a mapping sent back by the browser: heading → field name or null. */
export const vehicleImportMappingSchema = z.record(
  z.string().max(200),
  z.enum(VEHICLE_FIELDS, { error: "Not a vehicle field" }).nullable(),
);

export const vehicleStateSchema = z.enum(VEHICLE_STATES);

export interface ValidRow {
  rowNumber: number;
  values: VehicleRowValues;
}

export interface RowError {
  /** Row number as the spreadsheet program shows it. */
  row: number;
  /** The file's own heading of the column at fault. */
  column: string;
  field: VehicleField;
  message: string;
}

export interface RowValidation {
  valid: ValidRow[];
  errors: RowError[];
  /** Rows with at least one error (each listed once). */
  rejectedRows: number[];
}

export type ValidateOptions = Pick<RowContext, "now">;

/** Mass headings that say tonnes ("GVM (t)", "Kerb mass tonnes") scale plain numbers by 1000. */
function massFactorsFrom(headerOf: ReadonlyMap<VehicleField, string>): Partial<Record<PlatformRatingField, number>> {
  const factors: Partial<Record<PlatformRatingField, number>> = {};
  for (const field of PLATFORM_RATING_FIELDS) {
    const header = headerOf.get(field);
    if (header !== undefined && /(\(\s*t\s*\)|\[\s*t\s*\]|\btonnes?\b)/i.test(header)) factors[field] = 1000;
  }
  return factors;
}

function sameCell(a: CellValue, b: CellValue): boolean {
  if (a instanceof Date && b instanceof Date) return a.getTime() === b.getTime();
  if (typeof a === "string" && typeof b === "string") return a.trim() === b.trim();
  return a === b;
}

function keyText(value: CellValue, compact: boolean): string | null {
  if (value === null || value instanceof Date) return null;
  const text = String(value).trim().toUpperCase();
  const key = compact ? text.replace(/\s+/g, "") : text.replace(/\s+/g, " ");
  return key === "" || PLACEHOLDERS.has(key.toLowerCase()) ? null : key;
}

/**
 * Checks every row of a parsed sheet against the mapping. Good rows come back clean; each bad
 * cell gives one error naming the row, the file's column heading and the reason. Two rows with
 * the same fleet number or VIN are reported with both row numbers: an exact copy loses only the
 * later row, two different rows claiming one vehicle are both held back.
 * Throws InputError when the mapping itself cannot be used (a field twice, fleet number unmapped).
 */
export function validateRows(
  parsed: Pick<ParsedSpreadsheet, "headers" | "rows" | "date1904">,
  mapping: Readonly<Record<string, string | null>>,
  options: ValidateOptions = {},
): RowValidation {
  const headerOf = new Map<VehicleField, string>();
  for (const header of parsed.headers) {
    const field = getOwn(mapping, header);
    if (field === undefined || field === null) continue;
    if (!isVehicleField(field)) throw new InputError(`mapping.${header}`, `"${field}" is not a vehicle field`);
    const other = headerOf.get(field);
    if (other !== undefined) {
      throw new InputError(`mapping.${header}`, `Both "${other}" and "${header}" are mapped to ${VEHICLE_FIELD_INFO[field].label}; keep one`);
    }
    headerOf.set(field, header);
  }
  for (const field of REQUIRED_VEHICLE_FIELDS) {
    if (!headerOf.has(field)) throw new InputError("mapping", `No column is mapped to ${VEHICLE_FIELD_INFO[field].label}`);
  }

  const schema = makeVehicleRowSchema({ now: options.now, date1904: parsed.date1904, massFactors: massFactorsFrom(headerOf) });
  const mappedFields = VEHICLE_FIELDS.filter((field) => headerOf.has(field));
  const errors: RowError[] = [];
  const goodValues = new Map<number, VehicleRowValues>();
  const errorAt = (row: number, field: VehicleField, message: string) =>
    errors.push({ row, column: headerOf.get(field) ?? VEHICLE_FIELD_INFO[field].header, field, message });

  for (const row of parsed.rows) {
    const input: Record<string, CellValue> = {};
    for (const field of mappedFields) input[field] = getOwn(row.cells, headerOf.get(field)!) ?? null;
    const result = schema.safeParse(input);
    if (result.success) {
      goodValues.set(row.rowNumber, result.data as VehicleRowValues);
      continue;
    }
    for (const issue of result.error.issues) {
      const field = issue.path[0];
      errorAt(row.rowNumber, isVehicleField(field) ? field : "fleetNumber", issue.message);
    }
  }

  // Duplicates, judged on every row (a bad row still claims its fleet number and VIN).
  const held = new Set<number>();
  const copies = new Set<number>();
  const cellsOf = (rowIndex: number) => parsed.rows[rowIndex]!.cells;
  const isCopy = (a: number, b: number) => mappedFields.every((field) => {
    const header = headerOf.get(field)!;
    return sameCell(getOwn(cellsOf(a), header) ?? null, getOwn(cellsOf(b), header) ?? null);
  });
  for (const field of ["fleetNumber", "vin"] as const) {
    const header = headerOf.get(field);
    if (header === undefined) continue;
    const groups = new Map<string, number[]>();
    parsed.rows.forEach((row, index) => {
      if (copies.has(row.rowNumber)) return;
      const key = keyText(getOwn(row.cells, header) ?? null, field === "vin");
      if (key === null) return;
      groups.set(key, [...(groups.get(key) ?? []), index]);
    });
    const label = VEHICLE_FIELD_INFO[field].label;
    for (const [key, indexes] of groups) {
      if (indexes.length < 2) continue;
      const first = indexes[0]!;
      const firstRow = parsed.rows[first]!.rowNumber;
      const different = indexes.slice(1).filter((index) => !isCopy(first, index));
      for (const index of indexes.slice(1)) {
        if (different.includes(index)) continue;
        const rowNumber = parsed.rows[index]!.rowNumber;
        copies.add(rowNumber);
        held.add(rowNumber);
        errorAt(rowNumber, field, `Row ${rowNumber} repeats row ${firstRow} exactly; only row ${firstRow} is imported`);
      }
      if (different.length === 0) continue;
      const clashing = [first, ...different].map((index) => parsed.rows[index]!.rowNumber);
      const list = clashing.length === 2 ? `rows ${clashing[0]} and ${clashing[1]}` : `rows ${clashing.slice(0, -1).join(", ")} and ${clashing.at(-1)}`;
      for (const rowNumber of clashing) {
        held.add(rowNumber);
        errorAt(rowNumber, field, `${label} ${key} is on ${list}; keep one of them`);
      }
    }
  }

  const fieldOrder = (field: VehicleField) => VEHICLE_FIELDS.indexOf(field);
  errors.sort((a, b) => a.row - b.row || fieldOrder(a.field) - fieldOrder(b.field));
  const valid: ValidRow[] = [];
  for (const row of parsed.rows) {
    const values = goodValues.get(row.rowNumber);
    if (values !== undefined && !held.has(row.rowNumber)) valid.push({ rowNumber: row.rowNumber, values: fillAbsent(values) });
  }
  const rejectedRows = [...new Set(errors.map((error) => error.row))];
  return { valid, errors, rejectedRows };
}

/** Fields not mapped come out of zod as undefined; the row shape promises null. */
function fillAbsent(values: Partial<VehicleRowValues>): VehicleRowValues {
  const filled = {} as Record<VehicleField, unknown>;
  for (const field of VEHICLE_FIELDS) filled[field] = values[field] ?? null;
  return filled as unknown as VehicleRowValues;
}
