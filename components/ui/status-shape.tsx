import type { ComponentProps } from "react";
import { cn } from "./cn";

/** The status tones. Each has its own word, shape and colour, so none relies on colour alone. */
export type StatusTone = "ok" | "warn" | "danger" | "info" | "neutral";

export const statusTones: readonly StatusTone[] = ["ok", "warn", "danger", "info", "neutral"];

/** The shape drawn for each tone (named so tests and docs can say which is which). */
export const statusShapeOf: Record<
  StatusTone,
  "filled-circle" | "hollow-triangle" | "filled-square" | "filled-diamond" | "hollow-circle"
> = {
  ok: "filled-circle",
  warn: "hollow-triangle",
  danger: "filled-square",
  info: "filled-diamond",
  neutral: "hollow-circle",
};

export const toneTextClass: Record<StatusTone, string> = {
  ok: "text-ok",
  warn: "text-warn",
  danger: "text-danger",
  info: "text-info",
  neutral: "text-neutral",
};

export type StatusShapeProps = Omit<ComponentProps<"svg">, "children"> & {
  tone: StatusTone;
  /** Edge length in CSS pixels. */
  sizePx?: number;
};

/** The shape alone, in the tone's colour; decorative (the word beside it carries the meaning). */
export function StatusShape({ tone, sizePx = 14, className, ...props }: StatusShapeProps) {
  return (
    <svg
      viewBox="0 0 16 16"
      width={sizePx}
      height={sizePx}
      aria-hidden="true"
      focusable="false"
      data-shape={statusShapeOf[tone]}
      className={cn("shrink-0", toneTextClass[tone], className)}
      {...props}
    >
      {tone === "ok" && <circle cx="8" cy="8" r="6" fill="currentColor" />}
      {tone === "warn" && (
        <path
          d="M8 2.4 14 13.2H2Z"
          fill="none"
          stroke="currentColor"
          strokeWidth="2"
          strokeLinejoin="round"
        />
      )}
      {tone === "danger" && (
        <rect x="2.5" y="2.5" width="11" height="11" rx="1" fill="currentColor" />
      )}
      {tone === "info" && <path d="M8 1.5 14.5 8 8 14.5 1.5 8Z" fill="currentColor" />}
      {tone === "neutral" && (
        <circle cx="8" cy="8" r="5.25" fill="none" stroke="currentColor" strokeWidth="2" />
      )}
    </svg>
  );
}
