/**
 * The mail adapter against an in-process SMTP catcher: messages arrive with the right envelope,
 * headers and bodies; the health check and sendMail say clearly when the server is down.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { checkMail, createMailer, MailUnavailableError, sendMail, type Mailer } from "@/lib/mail";
import { DEFAULT_CONNECT_TIMEOUT_MS, type MailConfig } from "@/lib/mail/config";
import { invitationMail, passwordResetMail } from "@/lib/mail/templates";
import { findFreePort } from "@/storage-fake/net";
import { startMailCatcher, type MailCatcher } from "../support/fakes";

let catcher: MailCatcher;
let mailer: Mailer;

const config = (port: number): MailConfig => ({
  host: "127.0.0.1",
  port,
  secure: false,
  from: "Portolan <no-reply@portolan.invalid>",
  connectTimeoutMs: DEFAULT_CONNECT_TIMEOUT_MS,
});

beforeAll(async () => {
  catcher = await startMailCatcher();
  mailer = createMailer(config(catcher.port));
});

afterAll(async () => {
  mailer?.close();
  await catcher?.stop();
});

describe("sending", () => {
  it("delivers an invitation with text and HTML bodies", async () => {
    const expiresAt = new Date(Date.UTC(2026, 11, 4, 18, 40));
    const content = invitationMail({ link: "http://127.0.0.1:3000/invite/tok_123", roleLabel: "Machinist", inviterName: "Dana <Lead>", expiresAt });
    const sent = await sendMail({ to: "machinist@shop.example", ...content }, mailer);
    expect(sent.accepted).toEqual(["machinist@shop.example"]);

    const mail = await catcher.waitFor((m) => m.messageId === sent.messageId);
    expect(mail.envelopeTo).toEqual(["machinist@shop.example"]);
    expect(mail.envelopeFrom).toBe("no-reply@portolan.invalid");
    expect(mail.from?.value[0]).toMatchObject({ name: "Portolan", address: "no-reply@portolan.invalid" });
    expect(mail.subject).toBe("You are invited to Portolan as Machinist");
    expect(mail.text).toContain("http://127.0.0.1:3000/invite/tok_123");
    expect(mail.text).toContain("Friday 4 December 2026, 18:40 UTC");
    expect(mail.html).toContain('href="http://127.0.0.1:3000/invite/tok_123"');
    // The inviter's name is escaped in HTML, so it cannot inject markup.
    expect(mail.html).toContain("Dana &lt;Lead&gt; has invited you");
  });

  it("delivers a password reset with a non-ASCII name intact", async () => {
    const content = passwordResetMail({ link: "https://portolan.shop.example/reset-password/abc", name: "Zoë Øster", expiresAt: new Date(Date.UTC(2026, 0, 2, 9, 5)) });
    await sendMail({ to: ["porter@shop.example"], ...content }, mailer);
    const mail = await catcher.waitFor((m) => m.subject === "Set a new Portolan password");
    expect(mail.text).toContain("Hello Zoë Øster,");
    expect(mail.text).toContain("https://portolan.shop.example/reset-password/abc");
    expect(mail.text).toContain("Friday 2 January 2026, 09:05 UTC");
  });

  it("waitFor also resolves for a mail that arrives later", async () => {
    const pending = catcher.waitFor((m) => m.subject === "late arrival");
    await sendMail({ to: "a@shop.example", subject: "late arrival", text: "x" }, mailer);
    await expect(pending).resolves.toMatchObject({ subject: "late arrival" });
  });
});

describe("when the SMTP server is down", () => {
  it("the health check reports it with the reason", async () => {
    expect(await checkMail(mailer)).toMatchObject({ ok: true });
    const port = await findFreePort();
    const down = createMailer(config(port));
    const check = await checkMail(down);
    expect(check.ok).toBe(false);
    expect(check.message).toBe(`mail: connection refused by 127.0.0.1:${port}`);
  });

  it("sendMail throws MailUnavailableError with a message for people and a detail for the log", async () => {
    const port = await findFreePort();
    const down = createMailer(config(port));
    const err = await sendMail({ to: "x@shop.example", subject: "s", text: "t" }, down).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(MailUnavailableError);
    expect((err as MailUnavailableError).code).toBe("unavailable");
    expect((err as MailUnavailableError).status).toBe(503);
    expect((err as MailUnavailableError).detail).toBe(`connection refused by 127.0.0.1:${port}`);
  });

  it("a catcher that stops mid-session is reported too", async () => {
    const short = await startMailCatcher();
    const m = createMailer(config(short.port));
    expect((await m.check()).ok).toBe(true);
    await short.stop();
    expect((await m.check()).ok).toBe(false);
    m.close();
  });
});
