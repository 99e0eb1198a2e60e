import { asc, desc, type SQL } from "drizzle-orm";
import type { AnySQLiteColumn } from "drizzle-orm/sqlite-core";
import type { TableQuery } from "@/lib/paging";

/** ORDER BY for a whitelisted sort key; unknown keys fall back, never reach SQL. */
export function orderFor(query: TableQuery, columns: Record<string, AnySQLiteColumn | SQL>, fallback: string): SQL[] {
  const column = columns[query.sort ?? ""] ?? columns[fallback];
  return [query.dir === "desc" ? desc(column) : asc(column)];
}

export function offsetFor(query: TableQuery): number {
  return (query.page - 1) * query.pageSize;
}

/** LIKE pattern with the user's wildcards escaped. */
export function likePattern(q: string): string {
  return `%${q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
}
