"use client";

import { createContext, useContext, type ReactNode } from "react";
import { DEFAULT_TIME_ZONE, formatDay, formatDayTime } from "@/lib/format/dates";

/**
 * The organisation's time zone for client components, so an instant renders the same on the
 * server and in the browser (whatever zone either is in) and reads as the organisation's time.
 */
const TimeZoneContext = createContext<string>(DEFAULT_TIME_ZONE);

export function TimeZoneProvider({ timeZone, children }: { timeZone: string; children: ReactNode }) {
  return <TimeZoneContext.Provider value={timeZone}>{children}</TimeZoneContext.Provider>;
}

export function useTimeZone(): string {
  return useContext(TimeZoneContext);
}

/**
 * An instant as the organisation reads it, in a `<time>` element: the day ("2 Dec 2026") or the
 * day and time ("2 Dec 2026, 13:05"). Calendar days (due dates, expiry dates) use
 * `formatCalendarDay` instead: they read the same in every zone.
 */
export function Instant({ at, show = "dayTime" }: { at: Date | string | number | null | undefined; show?: "day" | "dayTime" }) {
  const timeZone = useTimeZone();
  if (at === null || at === undefined) return <>—</>;
  const iso = new Date(at).toISOString();
  return <time dateTime={iso}>{show === "day" ? formatDay(at, timeZone) : formatDayTime(at, timeZone)}</time>;
}
