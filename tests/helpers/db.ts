import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import type { Client } from "@libsql/client";
import { afterAll, vi } from "vitest";
import { makeDb, openClient, prepareLocal, setDbForTests, type Database } from "@/db/client";
import { migrateDatabase } from "@/db/migrate";
import { seedDemo } from "@/db/seed";

/**
 * A fresh temporary SQLite database for one test file, migrated and (by default) seeded with
 * the demo scenario. Never the demo database. Removed when the file's tests end.
 */
export async function useTestDatabase(options: { seed?: boolean } = {}): Promise<Database> {
  const dir = mkdtempSync(join(tmpdir(), "rigline-test-"));
  const url = `file:${join(dir, "test.db")}`;
  const client = openClient(url);
  await prepareLocal(client, url);
  const database = makeDb(client);
  await migrateDatabase(database);
  if (options.seed !== false) await seedDemo(database);
  setDbForTests(database);
  afterAll(() => {
    client.close();
    rmSync(dir, { recursive: true, force: true });
  });
  return database;
}

/** How many statements the database is sent while `run` runs. */
export async function statementsDuring(database: Database, run: () => Promise<unknown>): Promise<number> {
  const client = (database as unknown as { $client: Client }).$client;
  const spy = vi.spyOn(client, "execute");
  try {
    await run();
    return spy.mock.calls.length;
  } finally {
    spy.mockRestore();
  }
}
