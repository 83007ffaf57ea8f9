import { StatusPill } from "@/components/ui";

/** Whether a platform's ratings are all there: mass checks need every one of them. */
export function PlatformRatingsPill({ ratingsMissing, size }: { ratingsMissing: boolean; size?: "sm" | "md" | "lg" }) {
  return ratingsMissing ? (
    <StatusPill tone="warn" size={size}>
      Ratings missing
    </StatusPill>
  ) : (
    <StatusPill tone="ok" size={size}>
      Ratings complete
    </StatusPill>
  );
}
