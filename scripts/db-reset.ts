import { rmSync } from "node:fs";
import { makeDb, openClient, prepareLocal } from "@/db/client";
import { migrateDatabase } from "@/db/migrate";
import { seedDemo } from "@/db/seed";
import { loadDotEnv } from "./load-env";

loadDotEnv();
const url = process.env.DATABASE_URL ?? "file:./data/rigline.db";
if (!url.startsWith("file:")) {
  console.error("db:reset only rebuilds a local SQLite file; refusing to touch " + url);
  process.exit(1);
}
const path = url.slice("file:".length);
for (const suffix of ["", "-wal", "-shm"]) rmSync(path + suffix, { force: true });
const client = openClient(url);
await prepareLocal(client, url);
const database = makeDb(client);
await migrateDatabase(database);
await seedDemo(database);
console.log(`Rebuilt ${url} with the demo scenario`);
client.close();
