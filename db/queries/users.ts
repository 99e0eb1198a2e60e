import { and, count, desc, eq, isNull, like, or, sql } from "drizzle-orm";
import type { Db } from "../client";
import { invitations, users, type Role } from "../schema";
import { pageOf, type Page, type TableQuery } from "@/lib/paging";
import { likePattern, offsetFor, orderFor } from "./paging";

/** What a users table shows: never the password hash. */
export type UserRow = {
  id: number;
  email: string;
  name: string;
  role: Role;
  active: boolean;
  lastSignInAt: number | null;
  createdAt: number;
};

const columns = {
  id: users.id,
  email: users.email,
  name: users.name,
  role: users.role,
  active: users.active,
  lastSignInAt: users.lastSignInAt,
  createdAt: users.createdAt,
};

export function listUsers(db: Db, query: TableQuery & { role?: Role }): Page<UserRow> {
  const where = and(
    query.q ? or(like(users.email, likePattern(query.q)), like(users.name, likePattern(query.q))) : undefined,
    query.role ? eq(users.role, query.role) : undefined,
  );
  const rows = db
    .select(columns)
    .from(users)
    .where(where)
    .orderBy(...orderFor(query, columns, "name"))
    .limit(query.pageSize)
    .offset(offsetFor(query))
    .all();
  const total = db.select({ n: count() }).from(users).where(where).get()!.n;
  return pageOf(rows, total, query);
}

export function pendingInvitations(db: Db, now = Date.now()) {
  return db
    .select({ id: invitations.id, email: invitations.email, role: invitations.role, expiresAt: invitations.expiresAt, createdAt: invitations.createdAt })
    .from(invitations)
    .where(and(isNull(invitations.acceptedAt), isNull(invitations.revokedAt), sql`${invitations.expiresAt} > ${now}`))
    .orderBy(desc(invitations.createdAt))
    .all();
}

export function findUserByEmail(db: Db, email: string) {
  return db.select(columns).from(users).where(eq(users.email, email.trim().toLowerCase())).get();
}
