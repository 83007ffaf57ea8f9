import { requireFinite, requirePositive } from "../errors";

export interface PointMass {
  massKg: number;
  /** Distance behind the front axle centre line (negative = ahead of the front axle). */
  xMm: number;
}

export interface AxleShare {
  frontKg: number;
  rearKg: number;
}

/**
 * Lever rule (statics of a simply supported beam): a mass W at x behind the front axle on a
 * wheelbase WB puts W·(WB − x)/WB on the front axle and W·x/WB on the rear. Behind the rear axle
 * (x > WB) the front share is negative: the item lifts load off the front axle.
 */
export function leverRule(load: PointMass, wheelbaseMm: number, field = "item"): AxleShare {
  const wb = requirePositive("wheelbaseMm", wheelbaseMm);
  const m = requireFinite(`${field}.massKg`, load.massKg);
  const x = requireFinite(`${field}.xMm`, load.xMm);
  const rearKg = (m * x) / wb;
  return { frontKg: m - rearKg, rearKg };
}
