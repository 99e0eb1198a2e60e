/** A fresh, migrated SQLite for one test file (in memory unless a path is given). */
import { openDatabase, type Db } from "@/db/client";
import { migrateDatabase } from "@/db/migrate";

export function freshDb(file = ":memory:"): Db {
  const db = openDatabase(file);
  migrateDatabase(db);
  return db;
}
