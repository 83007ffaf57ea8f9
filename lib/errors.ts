/**
 * The one typed error for bad input to a computation or a validated operation.
 * `field` names the input at fault (a dotted path such as "items.2.massKg"), so the API can
 * answer 422 naming it and a form can show it beside the right field.
 */
export class InputError extends Error {
  readonly field: string;

  constructor(field: string, message: string) {
    super(message);
    this.name = "InputError";
    this.field = field;
  }
}

/** Throws InputError unless `value` is a finite number (never let NaN or Infinity through). */
export function requireFinite(field: string, value: number): number {
  if (typeof value !== "number" || !Number.isFinite(value)) {
    throw new InputError(field, `${field} must be a finite number`);
  }
  return value;
}

/** Throws InputError unless `value` is a finite number ≥ 0. */
export function requireNonNegative(field: string, value: number): number {
  requireFinite(field, value);
  if (value < 0) throw new InputError(field, `${field} must not be negative`);
  return value;
}

/** Throws InputError unless `value` is a finite number > 0. */
export function requirePositive(field: string, value: number): number {
  requireFinite(field, value);
  if (value <= 0) throw new InputError(field, `${field} must be greater than zero`);
  return value;
}
