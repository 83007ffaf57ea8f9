import type { CellValue } from "./parse";
import { VEHICLE_STATES, type VehicleState } from "./fields";

/**
 * Turning messy spreadsheet cells into clean values. Each coercion returns the value (null for
 * an empty cell) or a sentence saying what is wrong, naming the field by `label`.
 */

export type Coerced<T> = { ok: true; value: T | null } | { ok: false; message: string };

const ok = <T>(value: T | null): Coerced<T> => ({ ok: true, value });
const fail = <T>(message: string): Coerced<T> => ({ ok: false, message });

function formatNumber(value: number): string {
  return value.toLocaleString("en-AU", { maximumFractionDigits: 3 });
}

function quoted(text: string): string {
  const short = text.length > 40 ? `${text.slice(0, 37)}...` : text;
  return `"${short}"`;
}

/** A calendar date as YYYY-MM-DD, read in UTC so no time zone shifts the day. */
export function isoDate(date: Date): string {
  return date.toISOString().slice(0, 10);
}

// ---------------------------------------------------------------------------------------------
// Text

export interface TextRules {
  maxLength: number;
  /** Keep line breaks (notes); elsewhere all runs of white space become one space. */
  multiline?: boolean;
}

export function coerceText(value: CellValue, label: string, rules: TextRules): Coerced<string> {
  if (value === null) return ok(null);
  let text: string;
  if (value instanceof Date) text = isoDate(value);
  else if (typeof value === "number") text = String(value);
  else text = value;
  text = rules.multiline
    ? text.replace(/\r\n?/g, "\n").replace(/[ \t]+/g, " ").replace(/ *\n */g, "\n").trim()
    : text.replace(/\s+/g, " ").trim();
  if (text === "") return ok(null);
  if (text.length > rules.maxLength) {
    return fail(`${label} has ${formatNumber(text.length)} characters; the most allowed is ${formatNumber(rules.maxLength)}`);
  }
  return ok(text);
}

// ---------------------------------------------------------------------------------------------
// Numbers

/**
 * Reads a number written as text. Accepted: "12345", "12,345" and "12 345" (thousands
 * grouped by threes), "2150.5", "1,234.5", "1.234,5" (the last separator is the decimal one),
 * "12,5" (a comma followed by anything but three digits can only be a decimal comma). A comma
 * followed by exactly three digits ("12,345") is read as thousands, the local convention.
 */
export function readNumberText(text: string): number | null {
  let digits = text;
  if (/[\s\u00a0\u202f']/.test(digits)) {
    const groups = digits.split(/[\s\u00a0\u202f']+/);
    const first = groups[0] ?? "";
    const last = groups[groups.length - 1] ?? "";
    const middle = groups.slice(1, -1);
    if (groups.length < 2 || !/^\d{1,3}$/.test(first) || !middle.every((g) => /^\d{3}$/.test(g)) || !/^\d{3}([.,]\d+)?$/.test(last)) {
      return null;
    }
    digits = groups.join("");
  }
  const hasComma = digits.includes(",");
  const hasDot = digits.includes(".");
  let normal: string | null = null;
  if (hasComma && hasDot) {
    const lastAt = Math.max(digits.lastIndexOf(","), digits.lastIndexOf("."));
    const decimal = digits[lastAt];
    const thousands = decimal === "," ? "." : ",";
    const whole = digits.slice(0, lastAt);
    const fraction = digits.slice(lastAt + 1);
    const grouped = new RegExp(`^\\d{1,3}(\\${thousands}\\d{3})+$`);
    if (grouped.test(whole) && /^\d+$/.test(fraction)) normal = `${whole.split(thousands).join("")}.${fraction}`;
  } else if (hasComma) {
    if (/^[1-9]\d{0,2}(,\d{3})+$/.test(digits)) normal = digits.replace(/,/g, "");
    else if (/^\d+,\d+$/.test(digits)) normal = digits.replace(",", ".");
  } else if (hasDot) {
    if (/^\d+\.\d*$/.test(digits)) normal = digits;
    else if (/^[1-9]\d{0,2}(\.\d{3})+$/.test(digits)) normal = digits.replace(/\./g, "");
  } else if (/^\d+$/.test(digits)) {
    normal = digits;
  }
  if (normal === null) return null;
  const number = Number(normal);
  return Number.isFinite(number) ? number : null;
}

export interface QuantityRules {
  /** The unit we store, named in messages: "kg" or "km". */
  unit: "kg" | "km";
  /** Multiplier for plain numbers (1, or 1000 when the column heading says tonnes). */
  plainFactor?: number;
  integer?: "round" | "require";
  /** "positive" (> 0) or "nonNegative" (≥ 0). */
  sign: "positive" | "nonNegative";
  /** Largest plausible value in the stored unit. */
  max: number;
}

const UNIT_FACTORS: Readonly<Record<"kg" | "km", Readonly<Record<string, number>>>> = {
  kg: { kg: 1, kgs: 1, kilogram: 1, kilograms: 1, t: 1000, tonne: 1000, tonnes: 1000 },
  km: { km: 1, kms: 1, kilometre: 1, kilometres: 1, kilometer: 1, kilometers: 1 },
};

/** A number from a number cell or messy text, in the stored unit, checked against the rules. */
export function coerceQuantity(value: CellValue, label: string, rules: QuantityRules): Coerced<number> {
  if (value === null) return ok(null);
  if (value instanceof Date) return fail(`${label} holds a date; it needs a number in ${rules.unit}`);
  let number: number;
  if (typeof value === "number") {
    number = value * (rules.plainFactor ?? 1);
  } else {
    const text = value.trim().replace(/[\u2212\u2012\u2013]/g, "-");
    if (text === "" || text === "-") return ok(null);
    const match = /^([+-]?)\s*(\d[\d.,'\s\u00a0\u202f]*?)\s*([a-z]+)?\.?$/i.exec(text);
    if (match === null) return fail(`${label} ${quoted(value.trim())} is not a number`);
    const [, sign = "", numeral = "", unitWord] = match;
    const read = readNumberText(numeral);
    if (read === null) return fail(`${label} ${quoted(value.trim())} is not a number we can read`);
    let factor = rules.plainFactor ?? 1;
    if (unitWord !== undefined) {
      const unit = unitWord.toLowerCase();
      const known = UNIT_FACTORS[rules.unit][unit];
      if (known === undefined) {
        const hint = rules.unit === "km" && /^(mi|mile|miles)$/.test(unit) ? "; convert it to kilometres" : "";
        return fail(`${label} is given in "${unitWord}"; it needs ${rules.unit}${hint}`);
      }
      factor = known;
    }
    number = (sign === "-" ? -read : read) * factor;
  }
  if (!Number.isFinite(number)) return fail(`${label} is not a number`);
  // Scaling ("3.21 t") can leave binary noise such as 3209.9999999999995; a milligram is plenty.
  number = Math.round(number * 1e6) / 1e6;
  if (rules.integer === "round") number = Math.round(number);
  if (rules.integer === "require" && !Number.isInteger(number)) return fail(`${label} ${formatNumber(number)} must be a whole number`);
  if (number < 0) return fail(`${label} is ${formatNumber(number)} ${rules.unit}; it cannot be negative`);
  if (rules.sign === "positive" && number === 0) return fail(`${label} is 0 ${rules.unit}; it must be more than zero`);
  if (number > rules.max) return fail(`${label} ${formatNumber(number)} ${rules.unit} is more than ${formatNumber(rules.max)} ${rules.unit}; check the value and its unit`);
  // Negative zero from "-0" would otherwise survive to the database.
  return ok(number === 0 ? 0 : number);
}

// ---------------------------------------------------------------------------------------------
// Dates

const MS_PER_DAY = 86_400_000;
/** Serial number of 1970-01-01 in the 1900 date system (day 1 is 1900-01-01; 1900 is wrongly a leap year). */
const SERIAL_OF_UNIX_EPOCH = 25569;
/** The 1904 date system counts from 1904-01-01, 1462 days later. */
const DATE1904_OFFSET_DAYS = 1462;
const EARLIEST_YEAR = 1950;
const LATEST_YEAR = 2100;

/** The calendar date of a spreadsheet date serial number (time of day dropped). */
export function dateFromSerial(serial: number, date1904 = false): Date {
  const days = Math.floor(serial) - SERIAL_OF_UNIX_EPOCH + (date1904 ? DATE1904_OFFSET_DAYS : 0);
  return new Date(days * MS_PER_DAY);
}

const MONTHS: Readonly<Record<string, number>> = {
  jan: 1, feb: 2, mar: 3, apr: 4, may: 5, jun: 6, jul: 7, aug: 8, sep: 9, sept: 9, oct: 10, nov: 11, dec: 12,
  january: 1, february: 2, march: 3, april: 4, june: 6, july: 7, august: 8, september: 9, october: 10, november: 11, december: 12,
};

function calendarDate(year: number, month: number, day: number): Date | null {
  if (month < 1 || month > 12 || day < 1 || day > 31) return null;
  const date = new Date(Date.UTC(year, month - 1, day));
  if (date.getUTCFullYear() !== year || date.getUTCMonth() !== month - 1 || date.getUTCDate() !== day) return null;
  return date;
}

function fullYear(text: string): number {
  const year = Number(text);
  // Two-digit years are this century's: registrations expire in the future, not in 1926.
  return text.length === 2 ? 2000 + year : year;
}

type DateReading = { date: Date } | { problem: string } | null;

const TIME_SUFFIX = String.raw`(?:[ T]\d{1,2}:\d{2}(?::\d{2}(?:\.\d+)?)?(?:\s*[ap]\.?m\.?)?(?:Z|[+-]\d{2}:?\d{2})?)?`;
const ISO = new RegExp(String.raw`^(\d{4})[-/.](\d{1,2})[-/.](\d{1,2})${TIME_SUFFIX}$`, "i");
const DAY_FIRST = new RegExp(String.raw`^(\d{1,2})[-/.](\d{1,2})[-/.](\d{4}|\d{2})${TIME_SUFFIX}$`, "i");
const DAY_MONTH_NAME = /^(\d{1,2})(?:st|nd|rd|th)?[\s\-/]+([a-z]{3,9})\.?[\s\-/,]+(\d{4}|\d{2})$/i;
const MONTH_NAME_DAY = /^([a-z]{3,9})\.?\s+(\d{1,2})(?:st|nd|rd|th)?,?\s+(\d{4})$/i;

function readDateText(text: string, date1904: boolean): DateReading {
  let match = ISO.exec(text);
  if (match) {
    const date = calendarDate(Number(match[1]), Number(match[2]), Number(match[3]));
    return date ? { date } : { problem: "is not a real date" };
  }
  match = DAY_FIRST.exec(text);
  if (match) {
    const day = Number(match[1]);
    const month = Number(match[2]);
    if (month > 12) return { problem: `has month ${month}; dates are read day first, as in 31/03/2026` };
    const date = calendarDate(fullYear(match[3]!), month, day);
    return date ? { date } : { problem: "is not a real date" };
  }
  match = DAY_MONTH_NAME.exec(text) ?? null;
  if (match) {
    const month = MONTHS[match[2]!.toLowerCase()];
    if (month === undefined) return null;
    const date = calendarDate(fullYear(match[3]!), month, Number(match[1]));
    return date ? { date } : { problem: "is not a real date" };
  }
  match = MONTH_NAME_DAY.exec(text);
  if (match) {
    const month = MONTHS[match[1]!.toLowerCase()];
    if (month === undefined) return null;
    const date = calendarDate(Number(match[3]), month, Number(match[2]));
    return date ? { date } : { problem: "is not a real date" };
  }
  // A date serial number that arrived as text (a CSV saved from a sheet with an unformatted date).
  if (/^\d{5}(\.\d+)?$/.test(text)) return { date: dateFromSerial(Number(text), date1904) };
  return null;
}

/** A date from a date cell, a serial number, ISO text or day-first text, as YYYY-MM-DD. */
export function coerceDate(value: CellValue, label: string, date1904 = false): Coerced<string> {
  if (value === null) return ok(null);
  let date: Date;
  if (value instanceof Date) {
    if (Number.isNaN(value.getTime())) return fail(`${label} is not a valid date`);
    date = value;
  } else if (typeof value === "number") {
    if (!Number.isFinite(value) || value <= 0) return fail(`${label} ${formatNumber(value)} is not a date`);
    date = dateFromSerial(value, date1904);
  } else {
    const text = value.trim();
    if (text === "") return ok(null);
    const reading = readDateText(text, date1904);
    if (reading === null) {
      return fail(`${label} ${quoted(text)} is not a date we can read; write it as 31/03/2026 (day first) or 2026-03-31`);
    }
    if ("problem" in reading) return fail(`${label} ${quoted(text)} ${reading.problem}`);
    date = reading.date;
  }
  const year = date.getUTCFullYear();
  if (year < EARLIEST_YEAR || year > LATEST_YEAR) {
    return fail(`${label} falls in ${year}; it must be between ${EARLIEST_YEAR} and ${LATEST_YEAR}`);
  }
  return ok(isoDate(date));
}

// ---------------------------------------------------------------------------------------------
// Build year

export const EARLIEST_BUILD_YEAR = 1950;

export function coerceBuildYear(value: CellValue, label: string, now: Date): Coerced<number> {
  if (value === null) return ok(null);
  if (value instanceof Date) return fail(`${label} holds a full date; give just the year, such as 2021`);
  let year: number;
  if (typeof value === "number") year = value;
  else {
    const text = value.trim();
    if (text === "") return ok(null);
    if (!/^\d{4}(\.0+)?$/.test(text)) return fail(`${label} ${quoted(text)} is not a year; give four digits, such as 2021`);
    year = Number(text);
  }
  if (!Number.isInteger(year)) return fail(`${label} ${formatNumber(year)} is not a whole year`);
  const latest = now.getUTCFullYear() + 1;
  if (year < EARLIEST_BUILD_YEAR) return fail(`${label} ${year} is before ${EARLIEST_BUILD_YEAR}`);
  if (year > latest) return fail(`${label} ${year} is after next year (${latest})`);
  return ok(year);
}

// ---------------------------------------------------------------------------------------------
// Status

const STATE_SPELLINGS: Readonly<Record<VehicleState, readonly string[]>> = {
  in_service: ["in service", "inservice", "service", "active", "operational", "available", "on road", "in use", "serviceable", "current"],
  in_fitout: ["in fitout", "in fit out", "fitout", "fit out", "fitting out", "being fitted", "being fitted out", "in build"],
  grounded: ["grounded", "off road", "vor", "out of service", "unserviceable", "u s", "not in service", "stood down"],
  retired: ["retired", "disposed", "sold", "decommissioned", "written off", "scrapped", "archived", "inactive"],
};

const STATE_BY_SPELLING: ReadonlyMap<string, VehicleState> = new Map(
  VEHICLE_STATES.flatMap((state) => STATE_SPELLINGS[state].map((spelling) => [spelling, state] as const)),
);

export function coerceState(value: CellValue, label: string): Coerced<VehicleState> {
  if (value === null) return ok(null);
  const text = String(value).trim();
  const key = text.toLowerCase().replace(/[^a-z]+/g, " ").trim();
  if (key === "") return ok(null);
  const state = STATE_BY_SPELLING.get(key);
  if (state === undefined) {
    return fail(`${label} ${quoted(text)} is not one we know; use in service, in fit-out, grounded or retired`);
  }
  return ok(state);
}
