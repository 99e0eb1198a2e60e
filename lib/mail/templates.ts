/**
 * The app's e-mails as pure functions: data in, `{ subject, text, html }` out. Plain text comes
 * first (many shop inboxes show only that); the HTML is the same words with one button.
 * Every value is escaped, and links must be http(s) so a bad value cannot become a script link.
 */

export type MailContent = { subject: string; text: string; html: string };

const PRODUCT = "Portolan";

function escapeHtml(value: string): string {
  return value.replace(/[&<>"']/g, (ch) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[ch]!);
}

function checkedLink(link: string): string {
  let url: URL;
  try {
    url = new URL(link);
  } catch {
    throw new Error(`mail link is not a URL: ${link}`);
  }
  if (url.protocol !== "https:" && url.protocol !== "http:") throw new Error(`mail link must be http(s): ${link}`);
  return url.href;
}

/**
 * "Friday 4 December 2026, 18:40 UTC": built from Intl parts in a fixed order, so the wording
 * does not shift with the ICU version, and in a named zone (UTC unless the shop sets one).
 */
export function formatExpiry(at: Date, timeZone = "UTC"): string {
  const parts = new Intl.DateTimeFormat("en-GB", {
    weekday: "long",
    day: "numeric",
    month: "long",
    year: "numeric",
    hour: "2-digit",
    minute: "2-digit",
    hourCycle: "h23",
    timeZone,
    timeZoneName: "short",
  }).formatToParts(at);
  const part = (type: Intl.DateTimeFormatPartTypes) => parts.find((p) => p.type === type)?.value ?? "";
  return `${part("weekday")} ${part("day")} ${part("month")} ${part("year")}, ${part("hour")}:${part("minute")} ${part("timeZoneName")}`;
}

function layout(title: string, paragraphs: string[], button: { label: string; href: string }, footer: string): string {
  const body = paragraphs.map((p) => `<p style="margin:0 0 14px">${p}</p>`).join("");
  return (
    `<!doctype html><html><head><meta charset="utf-8"><title>${escapeHtml(title)}</title></head>` +
    `<body style="margin:0;padding:24px;background:#f5f2ec;color:#2a2c2e;font:15px/1.5 -apple-system,'Segoe UI',Roboto,sans-serif">` +
    `<div style="max-width:560px;margin:0 auto;background:#fffdf9;border:1px solid #d9d3c7;border-radius:6px;padding:24px">` +
    `<div style="font-weight:700;letter-spacing:.04em;color:#a35a2c;margin-bottom:16px">${PRODUCT.toUpperCase()}</div>` +
    body +
    `<p style="margin:22px 0"><a href="${escapeHtml(button.href)}" style="display:inline-block;background:#a35a2c;color:#fffdf9;text-decoration:none;padding:10px 18px;border-radius:4px;font-weight:600">${escapeHtml(button.label)}</a></p>` +
    `<p style="margin:0 0 14px;font-size:13px;color:#5b5e62">If the button does not work, copy this address into your browser:<br><span style="word-break:break-all">${escapeHtml(button.href)}</span></p>` +
    `<p style="margin:18px 0 0;font-size:13px;color:#5b5e62">${footer}</p>` +
    `</div></body></html>`
  );
}

export type InvitationMailInput = {
  link: string;
  /** The role in words, e.g. "Machinist". */
  roleLabel: string;
  /** Who sent the invitation, when known. */
  inviterName?: string;
  expiresAt: Date;
  timeZone?: string;
};

export function invitationMail(input: InvitationMailInput): MailContent {
  const link = checkedLink(input.link);
  const expiry = formatExpiry(input.expiresAt, input.timeZone);
  const who = input.inviterName?.trim();
  const subject = `You are invited to ${PRODUCT} as ${input.roleLabel}`;
  const opening = `${who ? `${who} has invited you` : "You have been invited"} to the shop's ${PRODUCT} account with the role ${input.roleLabel}.`;
  const instruction = "Open the link below to choose your name and password. The link works once.";
  const expiryLine = `It stays valid until ${expiry}.`;
  const ignore = "If you were not expecting this, you can ignore this e-mail; nothing happens until the link is used.";

  const text = [opening, "", instruction, expiryLine, "", link, "", ignore, ""].join("\n");
  const html = layout(
    subject,
    [
      `${who ? `${escapeHtml(who)} has invited you` : "You have been invited"} to the shop's ${PRODUCT} account with the role <strong>${escapeHtml(input.roleLabel)}</strong>.`,
      escapeHtml(instruction),
      escapeHtml(expiryLine),
    ],
    { label: "Accept the invitation", href: link },
    escapeHtml(ignore),
  );
  return { subject, text, html };
}

export type PasswordResetMailInput = {
  link: string;
  /** The account holder's name, for the greeting. */
  name?: string;
  expiresAt: Date;
  timeZone?: string;
};

export function passwordResetMail(input: PasswordResetMailInput): MailContent {
  const link = checkedLink(input.link);
  const expiry = formatExpiry(input.expiresAt, input.timeZone);
  const name = input.name?.trim();
  const subject = `Set a new ${PRODUCT} password`;
  const greeting = name ? `Hello ${name},` : "Hello,";
  const opening = `someone asked to set a new password for your ${PRODUCT} account. Open the link below to choose one.`;
  const expiryLine = `The link works once and stays valid until ${expiry}. Setting a new password signs you out everywhere else.`;
  const ignore = "If you did not ask for this, ignore this e-mail: your password stays as it is.";

  const text = [greeting, "", opening, expiryLine, "", link, "", ignore, ""].join("\n");
  const html = layout(subject, [escapeHtml(greeting), escapeHtml(opening), escapeHtml(expiryLine)], { label: "Choose a new password", href: link }, escapeHtml(ignore));
  return { subject, text, html };
}
