import { createClient, type Client } from "@libsql/client";
import { drizzle, type LibSQLDatabase } from "drizzle-orm/libsql";
import { mkdirSync } from "node:fs";
import { dirname } from "node:path";
import { env } from "@/lib/env";
import * as schema from "./schema";
import { serialiseWrites } from "./write-queue";

export type Database = LibSQLDatabase<typeof schema>;
/** A transaction handle has the same query API as the database. */
export type Tx = Parameters<Parameters<Database["transaction"]>[0]>[0];
export type DbOrTx = Database | Tx;

/** Opens a libSQL client: a local SQLite file (WAL, foreign keys on) or a remote libSQL URL. */
export function openClient(url: string, authToken?: string): Client {
  if (url.startsWith("file:")) {
    const path = url.slice("file:".length);
    if (path && path !== ":memory:") mkdirSync(dirname(path), { recursive: true });
  }
  // timeout = SQLite busy timeout, so writers of other processes wait instead of failing at once.
  const client = createClient({ url, authToken, timeout: 5000 });
  return url.startsWith("file:") ? serialiseWrites(client) : client;
}

export async function prepareLocal(client: Client, url: string): Promise<void> {
  if (!url.startsWith("file:")) return;
  // WAL is a property of the file; foreign keys are on by default in libSQL, asserted here.
  await client.execute("PRAGMA journal_mode = WAL");
  await client.execute("PRAGMA foreign_keys = ON");
}

export function makeDb(client: Client): Database {
  return drizzle(client, { schema });
}

const globalForDb = globalThis as unknown as { riglineClient?: Client; riglineDb?: Database };

/** The app's database, cached on globalThis so development reloads do not open new clients. */
export function db(): Database {
  if (!globalForDb.riglineDb) {
    const { DATABASE_URL, DATABASE_AUTH_TOKEN } = env();
    const client = openClient(DATABASE_URL, DATABASE_AUTH_TOKEN);
    void prepareLocal(client, DATABASE_URL);
    globalForDb.riglineClient = client;
    globalForDb.riglineDb = makeDb(client);
  }
  return globalForDb.riglineDb;
}

/** Tests swap in their own temporary database. */
export function setDbForTests(database: Database): void {
  globalForDb.riglineDb = database;
}
