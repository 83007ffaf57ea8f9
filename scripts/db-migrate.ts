import { makeDb, openClient, prepareLocal } from "@/db/client";
import { migrateDatabase } from "@/db/migrate";
import { loadDotEnv } from "./load-env";

loadDotEnv();
const url = process.env.DATABASE_URL ?? "file:./data/rigline.db";
const client = openClient(url, process.env.DATABASE_AUTH_TOKEN);
await prepareLocal(client, url);
await migrateDatabase(makeDb(client));
console.log(`Migrated ${url}`);
client.close();
