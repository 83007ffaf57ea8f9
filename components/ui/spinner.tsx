import type { ComponentProps } from "react";
import { cn } from "./cn";

export type SpinnerSize = "sm" | "md" | "lg";

const sizeClass: Record<SpinnerSize, string> = {
  sm: "size-4",
  md: "size-5",
  lg: "size-8",
};

export type SpinnerProps = Omit<ComponentProps<"svg">, "children"> & {
  size?: SpinnerSize;
  /**
   * Words for screen readers ("Loading vehicles"). With a label the spinner is a status
   * region; without one it is decorative (e.g. inside a button that carries aria-busy).
   */
  label?: string;
};

/** A turning ring in the current text colour. */
export function Spinner({ size = "md", label, className, ...props }: SpinnerProps) {
  const svg = (
    <svg
      viewBox="0 0 24 24"
      fill="none"
      aria-hidden="true"
      focusable="false"
      className={cn("shrink-0 animate-spin", sizeClass[size], className)}
      {...props}
    >
      <circle cx="12" cy="12" r="9" stroke="currentColor" strokeOpacity="0.25" strokeWidth="3" />
      <path d="M21 12a9 9 0 0 0-9-9" stroke="currentColor" strokeWidth="3" strokeLinecap="round" />
    </svg>
  );
  if (label === undefined) return svg;
  return (
    <span role="status" className="inline-flex items-center gap-2">
      {svg}
      <span className="sr-only">{label}</span>
    </span>
  );
}
