import type { ComponentProps, ReactNode } from "react";
import { cn } from "./cn";
import { StatusShape, type StatusTone } from "./status-shape";

const toneClass: Record<StatusTone, string> = {
  ok: "bg-ok-soft text-ok-ink border-ok/40",
  warn: "bg-warn-soft text-warn-ink border-warn/40",
  danger: "bg-danger-soft text-danger-ink border-danger/40",
  info: "bg-info-soft text-info-ink border-info/40",
  neutral: "bg-neutral-soft text-neutral-ink border-neutral/40",
};

export type StatusPillProps = Omit<ComponentProps<"span">, "children"> & {
  tone: StatusTone;
  /** The status word, short and plain ("Ready", "Short", "Grounded"). Always shown. */
  children: ReactNode;
  size?: "sm" | "md" | "lg";
};

const sizeClass = {
  sm: "gap-1 px-2 py-0.5 text-xs",
  md: "gap-1.5 px-2.5 py-0.5 text-sm",
  lg: "gap-2 px-3 py-1 text-base",
} as const;

const shapePx = { sm: 10, md: 12, lg: 16 } as const;

/** A status shown three ways at once: its word, its shape and its colour. */
export function StatusPill({ tone, size = "md", className, children, ...props }: StatusPillProps) {
  return (
    <span
      data-tone={tone}
      className={cn(
        "inline-flex items-center whitespace-nowrap rounded-full border font-semibold leading-tight",
        toneClass[tone],
        sizeClass[size],
        className,
      )}
      {...props}
    >
      <StatusShape tone={tone} sizePx={shapePx[size]} />
      <span>{children}</span>
    </span>
  );
}
