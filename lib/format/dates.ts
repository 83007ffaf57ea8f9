/**
 * How dates read in Rigline: Australian order ("2 Dec 2026"), 24-hour clock ("2 Dec 2026, 13:05").
 *
 * Two kinds of value, shown two ways:
 * - an instant (something reported, published, decided, saved) reads in the organisation's time
 *   zone, so a defect reported at 8 am in the north is dated that morning wherever the server is;
 * - a calendar day (a due date, a registration expiry, a quote's validity, a budget period,
 *   the day a vehicle was weighed) is kept as that day's start in UTC and reads as that same day
 *   whatever the zone.
 */

/** The zone of calendar days: they are stored as 00:00 UTC of the day (or noon, for weighings). */
export const CALENDAR_ZONE = "UTC";
/** For an organisation that has not chosen one. */
export const DEFAULT_TIME_ZONE = "Australia/Adelaide";

type DateLike = Date | string | number;

const formats = new Map<string, Intl.DateTimeFormat>();
function format(kind: "day" | "dayTime", timeZone: string): Intl.DateTimeFormat {
  const key = `${kind}\u0000${timeZone}`;
  let f = formats.get(key);
  if (!f) {
    f = new Intl.DateTimeFormat("en-AU", {
      day: "numeric",
      month: "short",
      year: "numeric",
      ...(kind === "dayTime" ? { hour: "2-digit", minute: "2-digit", hourCycle: "h23" } : {}),
      timeZone,
    });
    formats.set(key, f);
  }
  return f;
}

function toDate(value: DateLike): Date {
  const d = value instanceof Date ? value : new Date(value);
  if (!Number.isFinite(d.getTime())) throw new RangeError(`not a date: ${String(value)}`);
  return d;
}

/** Whether `zone` is an IANA time zone this runtime knows (e.g. "Australia/Darwin"). */
export function isTimeZone(zone: string): boolean {
  if (!zone || zone.length > 64) return false;
  try {
    new Intl.DateTimeFormat("en-AU", { timeZone: zone });
    return true;
  } catch {
    return false;
  }
}

/**
 * The zones an organisation may choose, Australian ones first, then UTC and the rest; the zone
 * it has now is always among them (an alias such as "Australia/Canberra" is valid but is not
 * in the runtime's canonical list), so saving the form never changes it unasked.
 */
export function timeZoneChoices(current?: string): string[] {
  const all = Intl.supportedValuesOf("timeZone");
  const australian = all.filter((z) => z.startsWith("Australia/"));
  const choices = [...australian, "UTC", ...all.filter((z) => !z.startsWith("Australia/") && z !== "UTC")];
  return current && !choices.includes(current) ? [current, ...choices] : choices;
}

/** The day of an instant, in the zone: "2 Dec 2026". Empty values read as "—". */
export function formatDay(value: DateLike | null | undefined, timeZone: string): string {
  return value === null || value === undefined ? "—" : format("day", timeZone).format(toDate(value));
}

/** The day and time of an instant, in the zone: "2 Dec 2026, 13:05". */
export function formatDayTime(value: DateLike | null | undefined, timeZone: string): string {
  return value === null || value === undefined ? "—" : format("dayTime", timeZone).format(toDate(value));
}

/** A calendar day (stored as its start in UTC): "2 Dec 2026", the same in every zone. */
export function formatCalendarDay(value: DateLike | null | undefined): string {
  return formatDay(value, CALENDAR_ZONE);
}
