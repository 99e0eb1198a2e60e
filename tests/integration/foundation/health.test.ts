/**
 * /api/health against the real S3 fake and SMTP catcher: which service is down is named; why
 * (host, port) only to a signed-in lead or admin.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { GET as health } from "@/app/api/health/route";
import type { Db } from "@/db/client";
import { freshAppDb, json, makeUser, request, type TestUser } from "../support/app";
import { startMailCatcher, startTestS3, type MailCatcher, type TestS3 } from "../support/fakes";

let s3: TestS3;
let mail: MailCatcher;
let db: Db;
let lead: TestUser;
let porter: TestUser;

beforeAll(async () => {
  [s3, mail] = await Promise.all([startTestS3(), startMailCatcher()]);
  Object.assign(process.env, {
    S3_ENDPOINT: s3.config.endpoint,
    S3_BUCKET: s3.config.bucket,
    S3_ACCESS_KEY_ID: s3.config.accessKeyId,
    S3_SECRET_ACCESS_KEY: s3.config.secretAccessKey,
    SMTP_HOST: mail.host,
    SMTP_PORT: String(mail.port),
  });
  db = freshAppDb();
  lead = makeUser(db, "lead");
  porter = makeUser(db, "porter");
});

const ask = async (as?: TestUser) => json(await health(await request("/api/health", { as })));
afterAll(async () => {
  await s3?.stop();
});

describe("GET /api/health", () => {
  it("is 200 when the database, storage and mail answer", async () => {
    const res = await ask();
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ ok: true, checks: { database: { ok: true }, storage: { ok: true }, mail: { ok: true } } });
  });

  it("is 503 and says the mail server is down; only a lead or admin learns why", async () => {
    await mail.stop();
    const forLead = await ask(lead);
    expect(forLead.status).toBe(503);
    expect(forLead.body.checks.mail.ok).toBe(false);
    expect(forLead.body.checks.mail.message).toMatch(new RegExp(String(mail.port)));
    expect(forLead.body.checks.storage.ok).toBe(true);
    for (const who of [undefined, porter]) {
      const res = await ask(who);
      expect(res.status).toBe(503);
      expect(res.body.checks.mail).toEqual({ ok: false }); // no host, no port
      expect(JSON.stringify(res.body)).not.toContain(String(mail.port));
    }
  });

  it("names the storage when the bucket cannot be reached", async () => {
    await s3.stop();
    const res = await ask(lead);
    expect(res.status).toBe(503);
    expect(res.body.checks.storage.ok).toBe(false);
    expect(res.body.checks.storage.message).toBeTruthy();
  });
});
