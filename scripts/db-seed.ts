import { makeDb, openClient, prepareLocal } from "@/db/client";
import { migrateDatabase } from "@/db/migrate";
import { seedDemo } from "@/db/seed";
import { loadDotEnv } from "./load-env";

loadDotEnv();
const url = process.env.DATABASE_URL ?? "file:./data/rigline.db";
const client = openClient(url, process.env.DATABASE_AUTH_TOKEN);
await prepareLocal(client, url);
const database = makeDb(client);
await migrateDatabase(database);
const report = await seedDemo(database);
for (const o of report.organisations) console.log(`${o.created ? "Seeded" : "Already there"}: ${o.name}`);
client.close();
