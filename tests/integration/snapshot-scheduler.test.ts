import { and, eq } from "drizzle-orm";
import { afterEach, describe, expect, it, vi } from "vitest";
import { recordTodaysSnapshotOnce, recordTodaysSnapshots, scheduleDaily, startSnapshotScheduler, stopSnapshotScheduler } from "@/db/costs";
import { fleetSnapshots, organisations } from "@/db/schema";
import { useTestDatabase } from "../helpers/db";

// Rigline rule: the fleet's figures are filed once per UTC day for each organisation, by a daily
// task in the server process (the trends page remains a fallback). Timings are our own choice.

const database = await useTestDatabase();
const HOUR_MS = 3_600_000;
const DAY_MS = 24 * HOUR_MS;

/** Lets pending promise callbacks and real I/O settle while timers stay fake. */
async function settle(rounds = 200) {
  for (let i = 0; i < rounds; i++) await new Promise((resolve) => setImmediate(resolve));
}

afterEach(() => {
  stopSnapshotScheduler();
  vi.useRealTimers();
});

describe("scheduleDaily", () => {
  it("runs once after start-up, then at 00:05 UTC each day, until stopped", async () => {
    vi.useFakeTimers({ toFake: ["setTimeout", "clearTimeout", "Date"] });
    vi.setSystemTime(new Date("2026-03-10T22:00:00.000Z"));
    const task = vi.fn(async () => {});
    const stop = scheduleDaily(task, { firstRunAfterMs: 10_000, atUtcMinute: 5 });

    await vi.advanceTimersByTimeAsync(9_999);
    expect(task).toHaveBeenCalledTimes(0);
    await vi.advanceTimersByTimeAsync(1);
    expect(task).toHaveBeenCalledTimes(1); // 22:00:10, the catch-up run

    // Next at 2026-03-11 00:05:00 UTC: 2 h 4 min 50 s later.
    await vi.advanceTimersByTimeAsync(2 * HOUR_MS + 4 * 60_000 + 49_999);
    expect(task).toHaveBeenCalledTimes(1);
    await vi.advanceTimersByTimeAsync(1);
    expect(task).toHaveBeenCalledTimes(2);
    expect(new Date(Date.now()).toISOString()).toBe("2026-03-11T00:05:00.000Z");

    await vi.advanceTimersByTimeAsync(DAY_MS);
    expect(task).toHaveBeenCalledTimes(3); // 2026-03-12 00:05

    stop();
    await vi.advanceTimersByTimeAsync(3 * DAY_MS);
    expect(task).toHaveBeenCalledTimes(3);
  });

  it("reports a failed run and keeps the schedule", async () => {
    vi.useFakeTimers({ toFake: ["setTimeout", "clearTimeout", "Date"] });
    vi.setSystemTime(new Date("2026-03-10T00:05:00.000Z"));
    const onError = vi.fn();
    const task = vi.fn(async () => {
      throw new Error("database busy");
    });
    const stop = scheduleDaily(task, { firstRunAfterMs: 0, atUtcMinute: 5, onError });
    await vi.advanceTimersByTimeAsync(0);
    expect(task).toHaveBeenCalledTimes(1);
    expect(onError).toHaveBeenCalledWith(expect.objectContaining({ message: "database busy" }));
    // Exactly at 00:05 the next run is tomorrow's, not a second one today.
    await vi.advanceTimersByTimeAsync(DAY_MS - 1);
    expect(task).toHaveBeenCalledTimes(1);
    await vi.advanceTimersByTimeAsync(1);
    expect(task).toHaveBeenCalledTimes(2);
    stop();
  });
});

describe("today's snapshots for every organisation", () => {
  const rowsOn = async (orgId: string, day: string) =>
    database.select().from(fleetSnapshots).where(and(eq(fleetSnapshots.orgId, orgId), eq(fleetSnapshots.day, day)));

  it("takes each organisation's figures once a day, however often it runs", async () => {
    // A day after the seeded history, so nothing is recorded for it yet.
    const now = new Date(Date.now() + 3 * DAY_MS);
    const day = now.toISOString().slice(0, 10);
    const orgs = await database.select({ id: organisations.id }).from(organisations);
    expect(orgs.length).toBeGreaterThan(1);

    expect(await recordTodaysSnapshots(database, now)).toBe(orgs.length);
    expect(await recordTodaysSnapshots(database, now)).toBe(0);
    expect(await recordTodaysSnapshotOnce(database, orgs[0]!.id, now)).toBe(false);
    for (const org of orgs) expect(await rowsOn(org.id, day)).toHaveLength(1);
  });

  it("starts once per process, however often the server's start-up hook runs", async () => {
    vi.useFakeTimers({ toFake: ["setTimeout", "clearTimeout"] });
    const now = new Date(Date.now() + 5 * DAY_MS);
    const day = now.toISOString().slice(0, 10);
    const dbOf = vi.fn(() => database);
    startSnapshotScheduler(dbOf, { now: () => now, firstRunAfterMs: 1_000 });
    startSnapshotScheduler(dbOf, { now: () => now, firstRunAfterMs: 1_000 });
    await vi.advanceTimersByTimeAsync(1_000);
    await settle();
    expect(dbOf).toHaveBeenCalledTimes(1);
    const orgs = await database.select({ id: organisations.id }).from(organisations);
    for (const org of orgs) expect(await rowsOn(org.id, day)).toHaveLength(1);
  });
});
