import type { ComponentProps } from "react";
import { cn } from "./cn";
import { controlClasses, type ControlSize } from "./control";

export type SelectProps = Omit<ComponentProps<"select">, "size"> & {
  size?: ControlSize;
  /** Classes for the wrapper (width, grid placement). */
  wrapperClassName?: string;
};

/** The browser's own select (best on phones and with screen readers), in our look. */
export function Select({
  size = "md",
  className,
  wrapperClassName,
  children,
  ...props
}: SelectProps) {
  return (
    <span className={cn("relative block", wrapperClassName)}>
      <select className={controlClasses(size, cn("appearance-none pr-9", className))} {...props}>
        {children}
      </select>
      <svg
        viewBox="0 0 16 16"
        aria-hidden="true"
        focusable="false"
        className="pointer-events-none absolute top-1/2 right-3 size-4 -translate-y-1/2 text-muted"
      >
        <path
          d="m3.5 6 4.5 4.5L12.5 6"
          fill="none"
          stroke="currentColor"
          strokeWidth="2"
          strokeLinecap="round"
          strokeLinejoin="round"
        />
      </svg>
    </span>
  );
}
