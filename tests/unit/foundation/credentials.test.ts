import bcrypt from "bcryptjs";
import { beforeEach, describe, expect, it } from "vitest";
import type { Db } from "@/db/client";
import { users } from "@/db/schema";
import { THROTTLED, WRONG_CREDENTIALS, actorForSession, verifyCredentials } from "@/lib/auth/credentials";
import { MAX_FAILURES_PER_ACCOUNT } from "@/lib/auth/throttle";
import { freshDb } from "../../support/db";

let db: Db;
beforeEach(() => {
  db = freshDb();
  db.insert(users).values({ email: "wren@shop.invalid", name: "Wren", role: "porter", passwordHash: bcrypt.hashSync("right-password", 4) }).run();
});

const attempt = (email: string, password: string, ip = "10.0.0.1") => verifyCredentials(db, { email, password, ip });

describe("sign-in", () => {
  it("accepts the right password, case-insensitive e-mail", async () => {
    const who = await attempt("Wren@Shop.invalid", "right-password");
    expect(who).toMatchObject({ email: "wren@shop.invalid", role: "porter", sessionVersion: 1 });
  });

  it("gives one message for an unknown e-mail and a wrong password", async () => {
    await expect(attempt("nobody@shop.invalid", "whatever-123")).rejects.toThrow(WRONG_CREDENTIALS);
    await expect(attempt("wren@shop.invalid", "wrong-password")).rejects.toThrow(WRONG_CREDENTIALS);
  });

  it("refuses a deactivated account with the same message", async () => {
    db.update(users).set({ active: false }).run();
    await expect(attempt("wren@shop.invalid", "right-password")).rejects.toThrow(WRONG_CREDENTIALS);
  });

  it("throttles after five failures from one address, even with the right password", async () => {
    for (let i = 0; i < MAX_FAILURES_PER_ACCOUNT; i++) await expect(attempt("wren@shop.invalid", "wrong")).rejects.toThrow(WRONG_CREDENTIALS);
    await expect(attempt("wren@shop.invalid", "right-password")).rejects.toThrow(THROTTLED);
    // Another workstation is not locked out by someone else's typing.
    await expect(attempt("wren@shop.invalid", "right-password", "10.0.0.2")).resolves.toMatchObject({ role: "porter" });
  });

  it("ends a session when the account is deactivated or its version moves on", async () => {
    const who = await attempt("wren@shop.invalid", "right-password");
    expect(actorForSession(db, { userId: who.id, sessionVersion: 1 })?.role).toBe("porter");
    db.update(users).set({ sessionVersion: 2 }).run();
    expect(actorForSession(db, { userId: who.id, sessionVersion: 1 })).toBeNull();
    db.update(users).set({ active: false }).run();
    expect(actorForSession(db, { userId: who.id, sessionVersion: 2 })).toBeNull();
  });
});
