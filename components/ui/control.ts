import { cn } from "./cn";

/** Control heights: md for desks, lg (48 px) for the field and touch screens. */
export type ControlSize = "sm" | "md" | "lg";

const sizeClass: Record<ControlSize, string> = {
  sm: "h-8 px-2.5 text-sm",
  md: "h-10 px-3 text-base sm:text-sm",
  lg: "h-12 px-3.5 text-base",
};

/** Shared look of text inputs and selects: strong border (3:1), invalid state in danger. */
export function controlClasses(size: ControlSize, className?: string): string {
  return cn(
    "block w-full min-w-0 rounded-md border border-line-strong bg-surface-raised text-ink tabular-nums",
    "placeholder:text-muted disabled:cursor-not-allowed disabled:bg-surface-sunken disabled:text-muted",
    "aria-invalid:border-danger aria-invalid:border-2",
    sizeClass[size],
    className,
  );
}
