/**
 * The SQLite connection. One per process (route handlers share it); WAL so readers never wait
 * for the writer, a busy timeout so a second writer (a worker, the CLI) waits instead of failing.
 */
import fs from "node:fs";
import path from "node:path";
import Database from "better-sqlite3";
import { drizzle, type BetterSQLite3Database } from "drizzle-orm/better-sqlite3";
import * as schema from "./schema";
import { env } from "../lib/env";

export type Db = BetterSQLite3Database<typeof schema> & { $client: Database.Database };

export function openDatabase(file: string): Db {
  if (file !== ":memory:") fs.mkdirSync(path.dirname(path.resolve(file)), { recursive: true });
  const sqlite = new Database(file);
  sqlite.pragma("journal_mode = WAL");
  sqlite.pragma("busy_timeout = 5000");
  sqlite.pragma("foreign_keys = ON");
  sqlite.pragma("synchronous = NORMAL");
  return drizzle(sqlite, { schema }) as Db;
}

const globalForDb = globalThis as unknown as { portolanDb?: Db };

/** The process-wide connection, opened on first use at DATABASE_PATH. */
export function db(): Db {
  globalForDb.portolanDb ??= openDatabase(env().DATABASE_PATH);
  return globalForDb.portolanDb;
}

/** Tests point the process at a fresh file. */
export function setDatabase(instance: Db): void {
  globalForDb.portolanDb = instance;
}

export type Tx = Parameters<Parameters<Db["transaction"]>[0]>[0];
