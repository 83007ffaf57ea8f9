import { InputError } from "@/lib/errors";

/**
 * Characters that make a spreadsheet program read a text cell as a formula or split it
 * (OWASP CSV Injection; CWE-1236): =, +, -, @, tab (0x09) and carriage return (0x0D).
 */
const FORMULA_START = /^[=+\-@\t\r]/;

/** A text cell made safe to open in a spreadsheet: a leading apostrophe when it could start a formula. */
export function neutraliseCell(text: string): string {
  if (typeof text !== "string") throw new InputError("text", "text must be a string");
  return FORMULA_START.test(text) ? `'${text}` : text;
}

/** What an export cell may hold. */
export type CellValue = string | number | boolean | Date | null | undefined;

/**
 * A cell value ready for any spreadsheet writer (CSV or XLSX): text is neutralised; numbers,
 * including negative ones, stay numbers, because a number cell is data and can never run as a
 * formula (a text cell that starts with "-" is escaped like any other). Callers pass amounts as
 * numbers, not as pre-formatted text, so they stay numeric in the sheet.
 */
export function neutraliseValue(value: CellValue, field = "value"): string | number | boolean | Date | null {
  if (value === null || value === undefined) return null;
  if (typeof value === "string") return neutraliseCell(value);
  if (typeof value === "number") {
    if (!Number.isFinite(value)) throw new InputError(field, `${field} must be a finite number`);
    return value;
  }
  if (typeof value === "boolean") return value;
  if (value instanceof Date) {
    if (Number.isNaN(value.getTime())) throw new InputError(field, `${field} is not a valid date`);
    return value;
  }
  throw new InputError(field, `${field} must be text, a number, true/false, a date or empty`);
}
