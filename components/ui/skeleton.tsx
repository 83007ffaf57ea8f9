import type { ComponentProps } from "react";
import { cn } from "./cn";

export type SkeletonProps = ComponentProps<"div">;

/** A placeholder block while content loads. Size it with classes (e.g. "h-4 w-40"). */
export function Skeleton({ className, ...props }: SkeletonProps) {
  return (
    <div
      aria-hidden="true"
      className={cn("rounded-md bg-sand-200 motion-safe:animate-pulse", className)}
      {...props}
    />
  );
}

export type SkeletonTextProps = ComponentProps<"div"> & { lines?: number };

/** Several lines of placeholder text; the last one shorter, like a paragraph. */
export function SkeletonText({ lines = 3, className, ...props }: SkeletonTextProps) {
  const count = Number.isFinite(lines) ? Math.max(1, Math.min(20, Math.trunc(lines))) : 3;
  return (
    <div aria-hidden="true" className={cn("grid gap-2", className)} {...props}>
      {Array.from({ length: count }, (_, i) => (
        <div
          key={i}
          className={cn(
            "h-4 rounded bg-sand-200 motion-safe:animate-pulse",
            i === count - 1 && count > 1 ? "w-3/5" : "w-full",
          )}
        />
      ))}
    </div>
  );
}
