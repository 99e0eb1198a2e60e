/** /api/health against the real S3 fake and SMTP catcher: which service is down is named. */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { GET as health } from "@/app/api/health/route";
import { freshAppDb, json } from "../support/app";
import { startMailCatcher, startTestS3, type MailCatcher, type TestS3 } from "../support/fakes";

let s3: TestS3;
let mail: MailCatcher;

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
  freshAppDb();
});
afterAll(async () => {
  await s3?.stop();
});

describe("GET /api/health", () => {
  it("is 200 when the database, storage and mail answer", async () => {
    const res = await json(await health());
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ ok: true, checks: { database: { ok: true }, storage: { ok: true }, mail: { ok: true } } });
  });

  it("is 503 and names the mail server when it is down", async () => {
    await mail.stop();
    const res = await json(await health());
    expect(res.status).toBe(503);
    expect(res.body.checks.mail.ok).toBe(false);
    expect(res.body.checks.mail.message).toMatch(new RegExp(String(mail.port)));
    expect(res.body.checks.storage.ok).toBe(true);
  });

  it("names the storage when the bucket cannot be reached", async () => {
    await s3.stop();
    const res = await json(await health());
    expect(res.status).toBe(503);
    expect(res.body.checks.storage.ok).toBe(false);
    expect(res.body.checks.storage.message).toBeTruthy();
  });
});
