import { describe, expect, it } from "vitest";
import { clearHits, hit, retryAfterMs } from "@/db/rate-limit";
import { useTestDatabase } from "../helpers/db";

const database = await useTestDatabase({ seed: false });
const limit = { max: 3, windowMs: 60_000 };

describe("rate limits", () => {
  it("blocks after the maximum within the window and frees the key when the window ends", async () => {
    const now = new Date("2026-12-01T10:00:00Z");
    for (let i = 0; i < 3; i++) {
      expect(await retryAfterMs(database, "k", limit, now)).toBe(0);
      await hit(database, "k", limit, now);
    }
    expect(await retryAfterMs(database, "k", limit, now)).toBe(60_000);
    const after = new Date(now.getTime() + 60_001);
    expect(await retryAfterMs(database, "k", limit, after)).toBe(0);
    await hit(database, "k", limit, after); // a new window starts at 1
    expect(await retryAfterMs(database, "k", limit, after)).toBe(0);
  });

  it("counts concurrent hits without losing any", async () => {
    const now = new Date();
    await Promise.all(Array.from({ length: 10 }, () => hit(database, "burst", { max: 100, windowMs: 60_000 }, now)));
    const row = await database.query.rateLimits.findFirst({ where: (t, { eq }) => eq(t.key, "burst") });
    expect(row?.count).toBe(10);
    await clearHits(database, "burst");
    expect(await database.query.rateLimits.findFirst({ where: (t, { eq }) => eq(t.key, "burst") })).toBeUndefined();
  });
});
