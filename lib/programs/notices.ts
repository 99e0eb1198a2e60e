/**
 * The handoff's e-mails. They are notices: sent after the move is committed, and a failure to
 * send never undoes the move — it is logged and reported back so the screen can warn.
 */
import { and, eq, inArray } from "drizzle-orm";
import type { Db } from "@/db/client";
import { users, type Role } from "@/db/schema";
import { env } from "../env";
import { sendMail, type Mailer } from "../mail";

export type NoticeResult = { sent: boolean; recipients: string[]; warning?: string };

export type Notice = { subject: string; lines: string[]; link?: string };

/** Active people with any of these roles (their e-mail addresses). */
export function addressesOfRoles(db: Db, roles: readonly Role[]): string[] {
  if (roles.length === 0) return [];
  return db
    .select({ email: users.email })
    .from(users)
    .where(and(inArray(users.role, [...roles]), eq(users.active, true)))
    .all()
    .map((r) => r.email);
}

export function addressesOfUsers(db: Db, ids: Array<number | null | undefined>): string[] {
  const wanted = ids.filter((id): id is number => typeof id === "number");
  if (wanted.length === 0) return [];
  return db
    .select({ email: users.email })
    .from(users)
    .where(and(inArray(users.id, wanted), eq(users.active, true)))
    .all()
    .map((r) => r.email);
}

function escapeHtml(value: string): string {
  return value.replace(/[&<>"']/g, (ch) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[ch]!);
}

export function renderNotice(notice: Notice): { subject: string; text: string; html: string } {
  const text = [...notice.lines, "", ...(notice.link ? [notice.link, ""] : []), "— Portolan, the shop's port library", ""].join("\n");
  const html =
    `<!doctype html><html><body style="font:15px/1.5 sans-serif;color:#2a2c2e;background:#f5f2ec;padding:20px">` +
    `<div style="max-width:560px;margin:0 auto;background:#fffdf9;border:1px solid #d9d3c7;border-radius:6px;padding:20px">` +
    notice.lines.map((l) => `<p style="margin:0 0 10px">${escapeHtml(l)}</p>`).join("") +
    (notice.link ? `<p><a href="${escapeHtml(notice.link)}" style="color:#a35a2c;font-weight:600">${escapeHtml(notice.link)}</a></p>` : "") +
    `</div></body></html>`;
  return { subject: notice.subject, text, html };
}

/** Sends one notice to each address (so nobody sees the others' addresses); never throws. */
export async function sendNotice(to: string[], notice: Notice, mailer?: Mailer): Promise<NoticeResult> {
  const recipients = [...new Set(to.map((a) => a.toLowerCase()))];
  if (recipients.length === 0) return { sent: false, recipients, warning: "Nobody to notify: no active person has the role that gets this notice." };
  const content = renderNotice(notice);
  const failed: string[] = [];
  for (const address of recipients) {
    try {
      await sendMail({ to: address, ...content }, mailer);
    } catch (err) {
      failed.push(address);
      console.error(`[notice] "${notice.subject}" to ${address} failed: ${err instanceof Error ? err.message : String(err)}`);
    }
  }
  if (failed.length === 0) return { sent: true, recipients };
  return {
    sent: failed.length < recipients.length,
    recipients,
    warning: `The move is saved, but the e-mail notice could not be sent to ${failed.join(", ")}. Tell them another way.`,
  };
}

export function appLink(path: string): string {
  return `${env().APP_URL.replace(/\/$/, "")}${path}`;
}
