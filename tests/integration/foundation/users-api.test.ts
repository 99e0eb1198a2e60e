/**
 * The user-administration API end to end: route handlers, a fresh SQLite file, and real SMTP to
 * an in-process catcher (an invitation e-mail actually arrives).
 */
import { count, eq } from "drizzle-orm";
import { afterAll, beforeAll, beforeEach, describe, expect, it } from "vitest";
import { POST as invite, GET as listInvitations } from "@/app/api/invitations/route";
import { GET as listUsers } from "@/app/api/users/route";
import { PATCH as patchUser } from "@/app/api/users/[id]/route";
import type { Db } from "@/db/client";
import { invitations, users } from "@/db/schema";
import { acceptInvitation, inspectInvitation } from "@/lib/users/invite";
import { requestPasswordReset, resetPassword } from "@/lib/users/reset";
import { verifyCredentials } from "@/lib/auth/credentials";
import { hashToken } from "@/lib/auth/tokens";
import { freshAppDb, json, makeUser, params, request, type TestUser } from "../support/app";
import { startMailCatcher, type MailCatcher } from "../support/fakes";

let db: Db;
let mail: MailCatcher;
let admin: TestUser;
let porter: TestUser;

beforeAll(async () => {
  mail = await startMailCatcher();
  process.env.SMTP_HOST = mail.host;
  process.env.SMTP_PORT = String(mail.port);
  db = freshAppDb();
  admin = makeUser(db, "admin");
  porter = makeUser(db, "porter");
});
afterAll(async () => {
  await mail.stop();
});
beforeEach(() => mail.clear());

const linkIn = (text: string, part: string) => text.match(new RegExp(`https?://\\S*${part}([A-Za-z0-9_-]+)`));

describe("POST /api/invitations", () => {
  it("e-mails a one-time link and stores only the token's hash", async () => {
    const res = await invite(await request("/api/invitations", { as: admin, json: { email: "New.Person@Shop.invalid", role: "machinist" } }), params({}));
    const { status, body } = await json(res);
    expect(status).toBe(201);
    expect(body).toMatchObject({ email: "new.person@shop.invalid", role: "machinist" });

    const caught = await mail.waitFor((m) => m.envelopeTo.includes("new.person@shop.invalid"));
    expect(caught.subject).toMatch(/invited/);
    const match = linkIn(caught.text ?? "", "/invite/");
    expect(match).not.toBeNull();
    const token = match![1];
    const row = db.select().from(invitations).where(eq(invitations.id, body.id)).get()!;
    expect(row.tokenHash).toBe(hashToken(token));
    expect(JSON.stringify(row)).not.toContain(token);
    expect(row.expiresAt - row.createdAt).toBe(72 * 3600 * 1000);

    const open = await json(await listInvitations(await request("/api/invitations", { as: admin }), params({})));
    expect(open.body.rows.map((r: { email: string }) => r.email)).toContain("new.person@shop.invalid");
  });

  it("answers 401 without a session and 403 to a porter, sending nothing", async () => {
    const anon = await invite(await request("/api/invitations", { json: { email: "x@shop.invalid", role: "porter" } }), params({}));
    expect(anon.status).toBe(401);
    const asPorter = await json(await invite(await request("/api/invitations", { as: porter, json: { email: "x@shop.invalid", role: "porter" } }), params({})));
    expect(asPorter.status).toBe(403);
    expect(asPorter.body.error.code).toBe("forbidden");
    expect(mail.mails).toHaveLength(0);
  });

  it("explains bad input field by field, and a body that is not JSON", async () => {
    const bad = await json(await invite(await request("/api/invitations", { as: admin, json: { email: "nope", role: "boss" } }), params({})));
    expect(bad.status).toBe(422);
    expect(Object.keys(bad.body.error.fields)).toEqual(expect.arrayContaining(["email", "role"]));
    const notJson = await invite(await request("/api/invitations", { as: admin, body: "email=x", headers: { "content-type": "text/plain" } }), params({}));
    expect(notJson.status).toBe(400);
  });

  it("refuses an address that already has an account with 409", async () => {
    const res = await json(await invite(await request("/api/invitations", { as: admin, json: { email: porter.email, role: "lead" } }), params({})));
    expect(res.status).toBe(409);
  });

  it("writes nothing when the mail server is down, and says so", async () => {
    const before = db.select({ n: count() }).from(invitations).get()!.n;
    // A mail server that was there and is gone: the port refuses connections.
    const down = await startMailCatcher();
    await down.stop();
    const { createMailer } = await import("@/lib/mail");
    const { inviteUser } = await import("@/lib/users/invite");
    const deadMailer = createMailer({ host: "127.0.0.1", port: down.port, secure: false, from: "t@x.invalid", connectTimeoutMs: 1000 });
    await expect(inviteUser(db, { ...admin }, { email: "later@shop.invalid", role: "porter" }, "http://app", Date.now(), deadMailer)).rejects.toMatchObject({
      code: "unavailable",
    });
    expect(db.select({ n: count() }).from(invitations).get()!.n).toBe(before);
  });
});

describe("accepting an invitation", () => {
  async function invited(email: string) {
    await invite(await request("/api/invitations", { as: admin, json: { email, role: "lead" } }), params({}));
    const caught = await mail.waitFor((m) => m.envelopeTo.includes(email));
    return linkIn(caught.text ?? "", "/invite/")![1];
  }

  it("creates the account once; the link then reports itself used", async () => {
    const token = await invited("lead.two@shop.invalid");
    const user = await acceptInvitation(db, { token, name: "Lead Two", password: "a-good-password", confirm: "a-good-password" });
    expect(user).toMatchObject({ email: "lead.two@shop.invalid", role: "lead" });
    await expect(verifyCredentials(db, { email: "lead.two@shop.invalid", password: "a-good-password", ip: "t" })).resolves.toMatchObject({ role: "lead" });
    await expect(acceptInvitation(db, { token, name: "Again", password: "a-good-password", confirm: "a-good-password" })).rejects.toThrow(/already been used/);
  });

  it("refuses an expired link and changes nothing", async () => {
    const token = await invited("late@shop.invalid");
    const later = Date.now() + 72 * 3600 * 1000 + 1;
    expect(inspectInvitation(db, token, later)).toMatchObject({ ok: false, message: expect.stringMatching(/expired/) });
    await expect(acceptInvitation(db, { token, name: "Late", password: "a-good-password", confirm: "a-good-password" }, later)).rejects.toThrow(/expired/);
    expect(db.select().from(users).where(eq(users.email, "late@shop.invalid")).get()).toBeUndefined();
  });

  it("refuses a made-up token", () => {
    expect(inspectInvitation(db, "made-up-token-value")).toMatchObject({ ok: false, message: expect.stringMatching(/not valid/) });
  });
});

describe("managing accounts", () => {
  it("lists users without password hashes, paged and filtered", async () => {
    const res = await json(await listUsers(await request("/api/users?pageSize=5&q=porter&sort=email", { as: admin }), params({})));
    expect(res.status).toBe(200);
    expect(res.body.rows.length).toBeGreaterThan(0);
    expect(res.body.rows.every((r: { email: string }) => r.email.includes("porter"))).toBe(true);
    expect(JSON.stringify(res.body)).not.toMatch(/passwordHash|\$2[aby]\$/);
  });

  it("deactivating someone ends their session on the next request", async () => {
    const adminTwo = makeUser(db, "admin");
    const before = await listUsers(await request("/api/users", { as: adminTwo }), params({}));
    expect(before.status).toBe(200);
    const res = await json(await patchUser(await request(`/api/users/${adminTwo.id}`, { method: "PATCH", as: admin, json: { active: false } }), params({ id: String(adminTwo.id) })));
    expect(res.body).toMatchObject({ active: false });
    const after = await listUsers(await request("/api/users", { as: adminTwo }), params({}));
    expect(after.status).toBe(401);
  });

  it("will not let the last administrator remove their own access", async () => {
    const res = await json(await patchUser(await request(`/api/users/${admin.id}`, { method: "PATCH", as: admin, json: { role: "porter" } }), params({ id: String(admin.id) })));
    expect(res.status).toBe(409);
  });
});

describe("forgotten password", () => {
  it("mails a link that sets a new password and ends older sessions", async () => {
    const user = makeUser(db, "machinist", { password: "the-old-password" });
    await requestPasswordReset(db, { email: user.email }, "http://127.0.0.1:3000");
    const caught = await mail.waitFor((m) => m.envelopeTo.includes(user.email));
    const token = linkIn(caught.text ?? "", "/reset-password/")![1];
    await resetPassword(db, { token, password: "the-new-password", confirm: "the-new-password" });
    await expect(verifyCredentials(db, { email: user.email, password: "the-new-password", ip: "r" })).resolves.toMatchObject({ sessionVersion: 2 });
    const oldSession = await listUsers(await request("/api/users", { as: user }), params({}));
    expect(oldSession.status).toBe(401);
  });

  it("says nothing about unknown addresses and sends nothing", async () => {
    await requestPasswordReset(db, { email: "ghost@shop.invalid" }, "http://127.0.0.1:3000");
    await new Promise((r) => setTimeout(r, 200));
    expect(mail.mails).toHaveLength(0);
  });
});
