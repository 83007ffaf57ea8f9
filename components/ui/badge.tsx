import type { ComponentProps } from "react";
import { cn } from "./cn";

export type BadgeTone = "neutral" | "accent" | "ok" | "warn" | "danger" | "info";

const toneClass: Record<BadgeTone, string> = {
  neutral: "bg-neutral-soft text-neutral-ink",
  accent: "bg-accent-soft text-accent-ink",
  ok: "bg-ok-soft text-ok-ink",
  warn: "bg-warn-soft text-warn-ink",
  danger: "bg-danger-soft text-danger-ink",
  info: "bg-info-soft text-info-ink",
};

export type BadgeProps = ComponentProps<"span"> & { tone?: BadgeTone };

/**
 * A small tag or count ("12 open", "Draft", "Cab"). Not for status: a status needs its shape,
 * so use StatusPill.
 */
export function Badge({ tone = "neutral", className, ...props }: BadgeProps) {
  return (
    <span
      className={cn(
        "inline-flex items-center rounded-md px-1.5 py-0.5 text-xs font-semibold tabular-nums leading-tight",
        toneClass[tone],
        className,
      )}
      {...props}
    />
  );
}
