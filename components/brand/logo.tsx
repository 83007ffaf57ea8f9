import { useId, type ComponentProps } from "react";
import { cn } from "@/components/ui/cn";

/*
 * The Rigline mark: a flat-topped range on a long horizon, a low gold sun, and a track running
 * out across red country towards it, on a night-blue tile. In mono it is one colour
 * (currentColor) with the track cut out of the ground, so it works on any background.
 */

// Palette values (app/globals.css): the mark must also work outside the CSS (favicon, e-mail).
const NIGHT_800 = "#1d2c48";
const EARTH_500 = "#b5512f";
const EARTH_700 = "#7a321f";
const SPINIFEX_300 = "#e4be52";
const SPINIFEX_400 = "#d4a62f";

const SUN = { cx: 35.5, cy: 21.5, r: 5.5 } as const;
const RANGE = "M5 30.5 10.5 21h11l4.5 9.5Z";
const GROUND = "M0 30h48v18H0Z";
const TRACK = "M12.5 48c4.5-7.5 10-13.5 18.5-17.5";

export type LogoMarkProps = Omit<ComponentProps<"svg">, "children"> & {
  /** Edge length in CSS pixels. */
  size?: number;
  mono?: boolean;
  /** Accessible name; when absent the mark is decorative. */
  title?: string;
};

export function LogoMark({ size = 32, mono = false, title, className, ...props }: LogoMarkProps) {
  const uid = useId().replace(/[^a-zA-Z0-9_-]/g, "");
  const clipId = `rl-clip-${uid}`;
  const maskId = `rl-mask-${uid}`;
  const labelled = title !== undefined && title !== "";
  return (
    <svg
      viewBox="0 0 48 48"
      width={size}
      height={size}
      role={labelled ? "img" : undefined}
      aria-label={labelled ? title : undefined}
      aria-hidden={labelled ? undefined : true}
      focusable="false"
      className={cn("shrink-0", className)}
      {...props}
    >
      <defs>
        <clipPath id={clipId}>
          <rect width="48" height="48" rx="11" />
        </clipPath>
        {mono && (
          <mask id={maskId} maskUnits="userSpaceOnUse" x="0" y="0" width="48" height="48">
            <rect width="48" height="48" fill="white" />
            <path d={TRACK} fill="none" stroke="black" strokeWidth="4.5" strokeLinecap="round" />
            <path d="M0 28.5h48" stroke="black" strokeWidth="1.5" />
          </mask>
        )}
      </defs>
      {mono ? (
        <g clipPath={`url(#${clipId})`}>
          <circle cx={SUN.cx} cy={SUN.cy} r={SUN.r} fill="currentColor" />
          <path d={`${RANGE}${GROUND}`} fill="currentColor" mask={`url(#${maskId})`} />
        </g>
      ) : (
        <g clipPath={`url(#${clipId})`}>
          <rect width="48" height="48" fill={NIGHT_800} />
          <circle cx={SUN.cx} cy={SUN.cy} r={SUN.r} fill={SPINIFEX_400} />
          <path d={RANGE} fill={EARTH_700} />
          <path d={GROUND} fill={EARTH_500} />
          <path
            d={TRACK}
            fill="none"
            stroke={SPINIFEX_300}
            strokeWidth="3.5"
            strokeLinecap="round"
          />
        </g>
      )}
    </svg>
  );
}

export type LogoProps = Omit<ComponentProps<"span">, "children"> & {
  /** Height of the mark in CSS pixels; the wordmark scales with it. */
  size?: number;
  /** One colour (the current text colour) instead of the palette. */
  mono?: boolean;
  /** Show the word "Rigline" beside the mark (default). Without it the mark is named "Rigline". */
  wordmark?: boolean;
};

/** Mark and wordmark. */
export function Logo({ size = 32, mono = false, wordmark = true, className, ...props }: LogoProps) {
  return (
    <span
      className={cn("inline-flex items-center", mono ? "text-current" : "text-ink", className)}
      style={{ gap: size * 0.3 }}
      {...props}
    >
      <LogoMark size={size} mono={mono} title={wordmark ? undefined : "Rigline"} />
      {wordmark && (
        <span className="leading-none font-bold tracking-tight" style={{ fontSize: size * 0.66 }}>
          Rigline
        </span>
      )}
    </span>
  );
}
