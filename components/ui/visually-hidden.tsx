import type { ComponentProps } from "react";
import { cn } from "./cn";

export type VisuallyHiddenProps = ComponentProps<"span"> & {
  /** Becomes visible while focused (for skip links and similar). */
  focusable?: boolean;
};

/** Text for screen readers only: hidden on screen, still in the accessibility tree. */
export function VisuallyHidden({ focusable = false, className, ...props }: VisuallyHiddenProps) {
  return (
    <span
      className={cn(
        "sr-only",
        focusable && "focus-within:not-sr-only focus:not-sr-only",
        className,
      )}
      {...props}
    />
  );
}
