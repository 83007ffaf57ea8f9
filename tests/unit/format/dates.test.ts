import { describe, expect, it } from "vitest";
import { formatCalendarDay, formatDay, formatDayTime, isTimeZone, timeZoneChoices } from "@/lib/format/dates";

// Offsets from the IANA time zone database (tzdata, an open standard): Australia/Darwin is
// UTC+09:30 with no daylight saving; Australia/Sydney is UTC+11:00 in December (daylight
// saving) and UTC+10:00 in June; Australia/Perth is UTC+08:00.

describe("dates as Rigline shows them", () => {
  it("an instant reads in the organisation's zone: 22:45 UTC is the next morning in Darwin", () => {
    const at = new Date("2026-12-01T22:45:00Z");
    expect(formatDayTime(at, "Australia/Darwin")).toBe("2 Dec 2026, 08:15");
    expect(formatDay(at, "Australia/Darwin")).toBe("2 Dec 2026");
    expect(formatDay(at, "UTC")).toBe("1 Dec 2026");
    expect(formatDayTime(at, "Australia/Perth")).toBe("2 Dec 2026, 06:45");
  });

  it("follows daylight saving where the zone has it", () => {
    expect(formatDayTime(new Date("2026-12-15T02:00:00Z"), "Australia/Sydney")).toBe("15 Dec 2026, 13:00");
    expect(formatDayTime(new Date("2026-06-15T02:00:00Z"), "Australia/Sydney")).toBe("15 June 2026, 12:00"); // en-AU (CLDR) writes June in full
  });

  it("a calendar day reads as the same day in every zone", () => {
    const due = new Date("2026-12-24T00:00:00Z");
    expect(formatCalendarDay(due)).toBe("24 Dec 2026");
    expect(formatCalendarDay("2026-02-28T00:00:00.000Z")).toBe("28 Feb 2026");
  });

  it("an empty value reads as a dash, a bad one is refused", () => {
    expect(formatDay(null, "Australia/Darwin")).toBe("—");
    expect(formatDayTime(undefined, "Australia/Darwin")).toBe("—");
    expect(() => formatDay("not a date", "UTC")).toThrow(RangeError);
  });

  it("knows the IANA zones and offers the Australian ones first", () => {
    expect(isTimeZone("Australia/Darwin")).toBe(true);
    expect(isTimeZone("UTC")).toBe(true);
    expect(isTimeZone("Australia/Nowhere")).toBe(false);
    expect(isTimeZone("")).toBe(false);
    const choices = timeZoneChoices();
    expect(choices[0]!.startsWith("Australia/")).toBe(true);
    expect(choices).toContain("Australia/Perth");
    expect(choices).toContain("Pacific/Auckland");
    expect(choices).toContain("UTC");
    expect(new Set(choices).size).toBe(choices.length);
    // A valid alias the organisation already has stays selectable.
    expect(isTimeZone("Australia/Canberra")).toBe(true);
    expect(timeZoneChoices("Australia/Canberra")[0]).toBe("Australia/Canberra");
    expect(timeZoneChoices("Australia/Darwin")).toEqual(choices);
  });
});
