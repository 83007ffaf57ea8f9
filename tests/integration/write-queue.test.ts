import { sql } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { rateLimits } from "@/db/schema";
import { useTestDatabase } from "../helpers/db";

const database = await useTestDatabase({ seed: false });

describe("writes on a local SQLite file", () => {
  it("let overlapping transactions in one process run one after the other instead of freezing", async () => {
    const started = Date.now();
    const order: string[] = [];
    await Promise.all(
      ["a", "b", "c"].map((key) =>
        database.transaction(async (tx) => {
          order.push(`${key}:start`);
          await tx.insert(rateLimits).values({ key, count: 1, resetAt: new Date() });
          await new Promise((r) => setTimeout(r, 50));
          await tx.update(rateLimits).set({ count: 2 }).where(sql`${rateLimits.key} = ${key}`);
          order.push(`${key}:end`);
        }),
      ),
    );
    expect(order).toEqual(["a:start", "a:end", "b:start", "b:end", "c:start", "c:end"]);
    expect(Date.now() - started).toBeLessThan(4000);
    const rows = await database.select().from(rateLimits);
    expect(rows.map((r) => r.count)).toEqual([2, 2, 2]);
  });

  it("releases the writer after a rolled-back transaction", async () => {
    await expect(
      database.transaction(async (tx) => {
        await tx.insert(rateLimits).values({ key: "rolled", count: 1, resetAt: new Date() });
        throw new Error("stop");
      }),
    ).rejects.toThrow("stop");
    await database.insert(rateLimits).values({ key: "after", count: 1, resetAt: new Date() });
    const keys = (await database.select().from(rateLimits)).map((r) => r.key);
    expect(keys).toContain("after");
    expect(keys).not.toContain("rolled");
  });

  it("lets reads through while a write transaction is open", async () => {
    let readDone = false;
    await database.transaction(async (tx) => {
      await tx.insert(rateLimits).values({ key: "open", count: 1, resetAt: new Date() });
      await database.select().from(rateLimits);
      readDone = true;
    });
    expect(readDone).toBe(true);
  });
});
