import type { ComponentProps } from "react";
import { InputError } from "@/lib/errors";
import { cn } from "./cn";

export type FormatQuantityOptions = {
  /** Fraction digits, fixed (0–6). */
  digits?: number;
  /** Show "+" on positive values (for changes and headroom). */
  signed?: boolean;
};

const formatters = new Map<string, Intl.NumberFormat>();

function formatter(digits: number, signed: boolean): Intl.NumberFormat {
  const key = `${digits}:${signed}`;
  let f = formatters.get(key);
  if (!f) {
    f = new Intl.NumberFormat("en-AU", {
      minimumFractionDigits: digits,
      maximumFractionDigits: digits,
      // "negative"/"exceptZero" never print a minus before a value that rounds to zero.
      signDisplay: signed ? "exceptZero" : "negative",
    });
    formatters.set(key, f);
  }
  return f;
}

function checkDigits(digits: number): number {
  if (!Number.isInteger(digits) || digits < 0 || digits > 6) {
    throw new InputError("digits", "digits must be a whole number from 0 to 6");
  }
  return digits;
}

/**
 * A number in Australian style: comma thousands grouping, point decimals, fixed digits
 * (1234.5 → "1,234.5" with digits 1). Throws InputError for a non-finite value or bad digits.
 */
export function formatNumber(
  value: number,
  { digits = 0, signed = false }: FormatQuantityOptions = {},
): string {
  if (typeof value !== "number" || !Number.isFinite(value))
    throw new InputError("value", "value must be a finite number");
  return formatter(checkDigits(digits), signed).format(value);
}

/** Units written without a space before them. */
const unspacedUnits = new Set(["%", "°", "′", "″"]);

/** Number and unit as one unbreakable string ("2,150 kg", "4.8%"). */
export function formatQuantity(
  value: number,
  unit?: string,
  options?: FormatQuantityOptions,
): string {
  const number = formatNumber(value, options);
  if (!unit) return number;
  return unspacedUnits.has(unit) ? `${number}${unit}` : `${number}\u00a0${unit}`;
}

export type QuantityProps = Omit<ComponentProps<"span">, "children"> & {
  /** null/undefined/NaN show as a dash and read as "no value". */
  value: number | null | undefined;
  unit?: string;
  digits?: number;
  signed?: boolean;
};

/** A number with its unit, in tabular figures, never broken across lines. */
export function Quantity({
  value,
  unit,
  digits = 0,
  signed = false,
  className,
  ...props
}: QuantityProps) {
  checkDigits(digits);
  const classes = cn("tabular-nums whitespace-nowrap", className);
  if (value === null || value === undefined || !Number.isFinite(value)) {
    return (
      <span className={classes} {...props}>
        <span aria-hidden="true">—</span>
        <span className="sr-only">no value</span>
      </span>
    );
  }
  const number = formatNumber(value, { digits, signed });
  return (
    <span className={classes} data-value={value} {...props}>
      {number}
      {unit && (
        <span className="text-muted">
          {unspacedUnits.has(unit) ? "" : "\u00a0"}
          {unit}
        </span>
      )}
    </span>
  );
}
