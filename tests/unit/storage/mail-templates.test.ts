/** The e-mail templates (pure functions) and the mapping of SMTP failures to reasons. */
import { describe, expect, it } from "vitest";
import { describeMailError } from "@/lib/mail/errors";
import { formatExpiry, invitationMail, passwordResetMail } from "@/lib/mail/templates";

// Calendar facts used below: 1 December 2026 is a Tuesday, 1 January 2026 a Thursday.
const friday = new Date(Date.UTC(2026, 11, 4, 18, 40));

describe("formatExpiry", () => {
  it("writes weekday, date and 24-hour time in UTC by default", () => {
    expect(formatExpiry(friday)).toBe("Friday 4 December 2026, 18:40 UTC");
  });

  it("uses another zone when asked", () => {
    // 18:40 UTC is 19:40 in Berlin in winter (CET = UTC+1).
    expect(formatExpiry(friday, "Europe/Berlin")).toBe("Friday 4 December 2026, 19:40 CET");
  });
});

describe("invitationMail", () => {
  const mail = invitationMail({ link: "https://portolan.shop.example/invite/t0k", roleLabel: "Shop lead", inviterName: "Sam", expiresAt: friday });

  it("names the role, the inviter, the link and the expiry in the text", () => {
    expect(mail.subject).toBe("You are invited to Portolan as Shop lead");
    expect(mail.text).toContain("Sam has invited you");
    expect(mail.text).toContain("with the role Shop lead");
    expect(mail.text).toContain("\nhttps://portolan.shop.example/invite/t0k\n");
    expect(mail.text).toContain("valid until Friday 4 December 2026, 18:40 UTC");
  });

  it("has the same link as a button and as copyable text in the HTML", () => {
    expect(mail.html.match(/https:\/\/portolan\.shop\.example\/invite\/t0k/g)).toHaveLength(2);
    expect(mail.html).toContain("<strong>Shop lead</strong>");
  });

  it("escapes every value in the HTML", () => {
    const evil = invitationMail({ link: "https://x.example/i?a=1&b=<2>", roleLabel: "<b>Admin</b>", inviterName: '"Eve" <script>', expiresAt: friday });
    expect(evil.html).not.toContain("<script>");
    expect(evil.html).not.toContain("<b>Admin</b>");
    expect(evil.html).toContain("&lt;b&gt;Admin&lt;/b&gt;");
    expect(evil.html).toContain('href="https://x.example/i?a=1&amp;b=%3C2%3E"');
  });

  it("works without an inviter name", () => {
    expect(invitationMail({ link: "http://127.0.0.1:3000/invite/a", roleLabel: "Porter", expiresAt: friday }).text).toMatch(/^You have been invited/);
  });

  it("refuses links that are not http(s)", () => {
    expect(() => invitationMail({ link: "javascript:alert(1)", roleLabel: "Porter", expiresAt: friday })).toThrow(/http/);
    expect(() => invitationMail({ link: "not a url", roleLabel: "Porter", expiresAt: friday })).toThrow(/not a URL/);
  });
});

describe("passwordResetMail", () => {
  it("greets by name and states link, expiry and what happens to other sessions", () => {
    const mail = passwordResetMail({ link: "https://portolan.shop.example/reset-password/r", name: "Ana", expiresAt: new Date(Date.UTC(2026, 0, 2, 9, 5)) });
    expect(mail.subject).toBe("Set a new Portolan password");
    expect(mail.text.startsWith("Hello Ana,\n")).toBe(true);
    expect(mail.text).toContain("https://portolan.shop.example/reset-password/r");
    expect(mail.text).toContain("valid until Friday 2 January 2026, 09:05 UTC");
    expect(mail.text).toContain("signs you out everywhere else");
    expect(mail.html).toContain("Choose a new password");
  });
});

describe("describeMailError", () => {
  it("turns nodemailer failures into short reasons", () => {
    expect(describeMailError({ code: "ESOCKET", message: "connect ECONNREFUSED 127.0.0.1:1025" }, "127.0.0.1", 1025)).toEqual({
      unreachable: true,
      reason: "connection refused by 127.0.0.1:1025",
    });
    expect(describeMailError({ code: "ETIMEDOUT", message: "Connection timeout" }, "mail.example", 587).reason).toBe("no answer from mail.example:587 in time");
    expect(describeMailError({ code: "EAUTH", message: "Invalid login" }, "h", 1).reason).toMatch(/refused our login/);
    expect(describeMailError({ code: "EENVELOPE", responseCode: 550, response: "550 no such user" }, "h", 1)).toEqual({
      unreachable: false,
      reason: "SMTP 550: 550 no such user",
    });
  });
});
