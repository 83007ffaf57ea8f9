import { requirePositive } from "@/lib/errors";
import { METRIC_SIZES_MM2 } from "./sizes";

/**
 * Continuous current rating of a single-core copper cable per metric size, amperes.
 *
 * FROM MEMORY, NOT FROM A PUBLISHED TABLE: the figures are of the order of the usual ratings for
 * PVC-insulated copper at about 30 °C ambient (flexible-cord figures for 0.5–4 mm², enclosed
 * single-core figures above). They are deliberately conservative for high-temperature automotive
 * insulation and optimistic for tight bundles in a hot engine bay. They decide only which fuse
 * may protect a cable; the cable maker's rating for the actual insulation, bundling and ambient
 * temperature always wins.
 */
export const CABLE_RATING_A_BY_MM2: Readonly<Record<(typeof METRIC_SIZES_MM2)[number], number>> = {
  0.5: 3,
  0.75: 6,
  1: 10,
  1.5: 16,
  2.5: 25,
  4: 32,
  6: 46,
  10: 63,
  16: 85,
  25: 112,
  35: 138,
  50: 168,
  70: 213,
  95: 258,
  120: 299,
};

export const CABLE_RATING_SOURCE =
  "from memory: approximate ratings for PVC-insulated copper at about 30 °C; check the cable maker's data";

/**
 * Rating of any cross-section: that of the largest tabulated size not above it (so an AWG
 * cable of 8.37 mm² is rated as 6 mm²). Below 0.5 mm² nothing is tabulated and the rating is 0 A.
 */
export function cableRatingA(areaMm2: number): number {
  requirePositive("areaMm2", areaMm2);
  let ratingA = 0;
  for (const size of METRIC_SIZES_MM2) {
    if (size <= areaMm2 * (1 + 1e-9)) ratingA = CABLE_RATING_A_BY_MM2[size];
  }
  return ratingA;
}
