import { requireNonNegative } from "@/lib/errors";

/** Standard automotive fuse and circuit-breaker ratings, amperes (blade, then bolt-down sizes). */
export const STANDARD_FUSE_RATINGS_A = [
  5, 7.5, 10, 15, 20, 25, 30, 40, 50, 60, 80, 100, 125, 150, 200, 250, 300,
] as const;

/** A fuse sized at the load current plus a quarter, so normal draw never blows it (common practice). */
export const FUSE_HEADROOM = 1.25;

/** Where the fuse goes (common practice): it protects the cable, so it sits at the supply end. */
export const FUSE_LOCATION =
  "As close to the battery as possible at the supply end; a run fed from both ends (for example between two batteries) needs a fuse at each end.";

/**
 * The smallest standard rating at or above `currentA × FUSE_HEADROOM` that does not exceed the
 * cable's rating, or undefined when no standard rating fits between the two.
 */
export function fuseBetween(currentA: number, cableRatingA: number): number | undefined {
  requireNonNegative("currentA", currentA);
  requireNonNegative("cableRatingA", cableRatingA);
  const minimumA = currentA * FUSE_HEADROOM;
  const fuseA = STANDARD_FUSE_RATINGS_A.find((ratingA) => ratingA >= minimumA);
  return fuseA !== undefined && fuseA <= cableRatingA ? fuseA : undefined;
}
