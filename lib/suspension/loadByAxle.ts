import { InputError, requireNonNegative, requirePositive } from "../errors";
import { leverRule, positionXMm, type Zone, type ZoneOverrides } from "../mass";

export interface SuspensionItem {
  label?: string;
  massKg: number;
  xMm?: number;
  zone?: Zone;
  /** Variable mass (touring gear, water, contents); default constant (fitted accessories). */
  variable?: boolean;
}

export interface AxleLoadOverStandard {
  frontKg: number;
  rearKg: number;
  totalKg: number;
}

function sumByAxle(
  items: readonly SuspensionItem[],
  wheelbaseMm: number,
  overrides: ZoneOverrides | undefined,
  keep: (item: SuspensionItem) => boolean,
): AxleLoadOverStandard {
  const wb = requirePositive("wheelbaseMm", wheelbaseMm);
  if (!Array.isArray(items)) throw new InputError("items", "items must be a list");
  let frontKg = 0;
  let rearKg = 0;
  let totalKg = 0;
  items.forEach((item, i) => {
    const field = `items.${i}`;
    const massKg = requireNonNegative(`${field}.massKg`, item.massKg);
    const xMm = positionXMm(item, wb, overrides, field);
    if (!keep(item)) return;
    const share = leverRule({ massKg, xMm }, wb, field);
    frontKg += share.frontKg;
    rearKg += share.rearKg;
    totalKg += massKg;
  });
  return { frontKg, rearKg, totalKg };
}

/**
 * The constant load each axle carries from fitted accessories (lever rule), the figure a spring
 * is chosen for. Variable items are left out: they are what airbags may help with.
 */
export function constantLoadByAxle(
  items: readonly SuspensionItem[],
  wheelbaseMm: number,
  overrides?: ZoneOverrides,
): AxleLoadOverStandard {
  return sumByAxle(items, wheelbaseMm, overrides, (item) => !item.variable);
}

/** The variable load each axle carries (touring gear, water, contents). */
export function variableLoadByAxle(
  items: readonly SuspensionItem[],
  wheelbaseMm: number,
  overrides?: ZoneOverrides,
): AxleLoadOverStandard {
  return sumByAxle(items, wheelbaseMm, overrides, (item) => item.variable === true);
}
