import { migrate } from "drizzle-orm/libsql/migrator";
import { join } from "node:path";
import type { Database } from "./client";

export const MIGRATIONS_FOLDER = join(process.cwd(), "db", "migrations");

export async function migrateDatabase(database: Database): Promise<void> {
  await migrate(database, { migrationsFolder: MIGRATIONS_FOLDER });
}
