/** Applies pending migrations (`npm run db:migrate`); also used by tests on fresh files. */
import path from "node:path";
import { fileURLToPath } from "node:url";
import { migrate } from "drizzle-orm/better-sqlite3/migrator";
import { db, type Db } from "./client";

const here = path.dirname(fileURLToPath(import.meta.url));
export const migrationsFolder = path.join(here, "migrations");

export function migrateDatabase(instance: Db = db()): void {
  migrate(instance, { migrationsFolder });
}

if (process.argv[1] && fileURLToPath(import.meta.url) === path.resolve(process.argv[1])) {
  try {
    migrateDatabase();
    console.log("database migrated");
  } catch (err) {
    console.error(`migration failed: ${err instanceof Error ? err.message : String(err)}`);
    process.exitCode = 1;
  }
}
