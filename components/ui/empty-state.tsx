import type { ComponentProps, ReactNode } from "react";
import { cn } from "./cn";

export type EmptyStateProps = Omit<ComponentProps<"div">, "title"> & {
  title: ReactNode;
  /** Why it is empty and what would fill it. */
  children?: ReactNode;
  /** The next step (usually one Button). */
  action?: ReactNode;
  /** Replaces the default drawing. */
  icon?: ReactNode;
};

/** The default drawing: a flat horizon with an empty track running to it. */
function HorizonIcon() {
  return (
    <svg viewBox="0 0 48 48" aria-hidden="true" focusable="false" className="size-12 text-sand-500">
      <path
        d="M4 30h40"
        fill="none"
        stroke="currentColor"
        strokeWidth="2.5"
        strokeLinecap="round"
      />
      <path
        d="M14 44c4-5 8-9 11-14"
        fill="none"
        stroke="currentColor"
        strokeWidth="2.5"
        strokeLinecap="round"
        strokeDasharray="2 5"
      />
      <circle cx="33" cy="20" r="5" fill="none" stroke="currentColor" strokeWidth="2.5" />
    </svg>
  );
}

/** What a list or table shows when there is nothing in it yet. */
export function EmptyState({
  title,
  children,
  action,
  icon,
  className,
  ...props
}: EmptyStateProps) {
  return (
    <div
      className={cn(
        "flex flex-col items-center gap-3 rounded-lg border border-dashed border-line-strong/50 px-6 py-10 text-center",
        className,
      )}
      {...props}
    >
      {icon ?? <HorizonIcon />}
      <p className="text-base font-semibold text-ink">{title}</p>
      {children && <div className="max-w-prose text-sm text-muted">{children}</div>}
      {action && <div className="mt-1">{action}</div>}
    </div>
  );
}
