import type { ComponentProps } from "react";
import { cn } from "./cn";

/** What every mass, tyre, lift and electrical result carries. */
export const DEFAULT_CAUTION =
  "Planning aid only. Weigh the loaded vehicle on a certified weighbridge; modifications are decided under local rules by an authorised vehicle engineer.";

export type CautionProps = Omit<ComponentProps<"div">, "children"> & {
  /** Short plain text. */
  text?: string;
  /** The region's name for assistive tech. */
  label?: string;
};

/** The safety caution shown beside computed results. */
export function Caution({
  text = DEFAULT_CAUTION,
  label = "Caution",
  className,
  ...props
}: CautionProps) {
  return (
    <div
      role="note"
      aria-label={label}
      className={cn(
        "flex items-start gap-3 rounded-md border border-warn/50 bg-warn-soft px-3.5 py-3 text-sm text-warn-ink",
        className,
      )}
      {...props}
    >
      <svg
        viewBox="0 0 20 20"
        aria-hidden="true"
        focusable="false"
        className="mt-0.5 size-5 shrink-0 text-warn"
      >
        <path
          d="M10 2.5 18 17H2Z"
          fill="none"
          stroke="currentColor"
          strokeWidth="2"
          strokeLinejoin="round"
        />
        <path d="M10 8v4" stroke="currentColor" strokeWidth="2" strokeLinecap="round" />
        <circle cx="10" cy="14.5" r="1.1" fill="currentColor" />
      </svg>
      <p className="font-medium">{text}</p>
    </div>
  );
}
