/**
 * Calling route handlers the way Next does, without a server: a fresh migrated SQLite file per
 * test file, signed-in requests carrying a real next-auth session cookie, and JSON helpers.
 */
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import bcrypt from "bcryptjs";
import { encode } from "next-auth/jwt";
import { NextRequest } from "next/server";
import { setDatabase, type Db } from "@/db/client";
import { users, type Role } from "@/db/schema";
import { freshDb } from "../../support/db";

const SECRET = () => process.env.NEXTAUTH_SECRET ?? "integration-tests-only";

/** A new database file for this test file, made the process-wide one (as the app sees it). */
export function freshAppDb(): Db {
  const dir = fs.mkdtempSync(path.join(process.env.DATA_DIR ?? os.tmpdir(), "db-"));
  const db = freshDb(path.join(dir, "portolan.db"));
  setDatabase(db);
  return db;
}

export type TestUser = { id: number; email: string; name: string; role: Role; password: string; sessionVersion: number };

let counter = 0;
export function makeUser(db: Db, role: Role, overrides: Partial<{ email: string; name: string; password: string; active: boolean }> = {}): TestUser {
  counter++;
  const password = overrides.password ?? "test-password-123";
  const email = overrides.email ?? `${role}${counter}@test.invalid`;
  const name = overrides.name ?? `${role} ${counter}`;
  const row = db
    .insert(users)
    .values({ email, name, role, passwordHash: bcrypt.hashSync(password, 4), active: overrides.active ?? true })
    .returning()
    .get();
  return { id: row.id, email, name, role, password, sessionVersion: row.sessionVersion };
}

/** The session cookie next-auth would set after signing this user in. */
export async function sessionCookie(user: Pick<TestUser, "id" | "email" | "name" | "role" | "sessionVersion">): Promise<string> {
  const token = await encode({
    token: { sub: String(user.id), email: user.email, name: user.name, uid: user.id, role: user.role, sv: user.sessionVersion },
    secret: SECRET(),
  });
  return `next-auth.session-token=${token}`;
}

type Init = { method?: string; json?: unknown; body?: BodyInit; headers?: Record<string, string>; as?: TestUser | null };

export async function request(url: string, init: Init = {}): Promise<NextRequest> {
  const headers: Record<string, string> = { ...init.headers };
  if (init.as) headers.cookie = await sessionCookie(init.as);
  let body = init.body;
  if (init.json !== undefined) {
    body = JSON.stringify(init.json);
    headers["content-type"] = "application/json";
  }
  return new NextRequest(new URL(url, "http://127.0.0.1:3000"), { method: init.method ?? (body ? "POST" : "GET"), headers, body });
}

/** Route context as Next passes it: params behind a promise. */
export const params = <P extends Record<string, string>>(p: P) => ({ params: Promise.resolve(p) });

export async function json<T = any>(res: Response): Promise<{ status: number; body: T }> {
  return { status: res.status, body: (await res.json()) as T };
}
