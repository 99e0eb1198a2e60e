/** Page objects: what a person does, named as they would say it. */
import type { Page } from "playwright-core";
import { inject } from "vitest";

export const DEMO = {
  porter: { email: "porter@harbourline.invalid", password: "porter-portolan", name: "Wren Castellane" },
  machinist: { email: "machinist@harbourline.invalid", password: "machinist-portolan", name: "Tobin Okonkwo-Hale" },
  lead: { email: "lead@harbourline.invalid", password: "lead-portolan", name: "Maren Lisgaard" },
  auditor: { email: "auditor@harbourline.invalid", password: "auditor-portolan", name: "Ines Varro" },
  admin: { email: "admin@harbourline.invalid", password: "admin-portolan", name: "Casimir Undry" },
} as const;

export type DemoRole = keyof typeof DEMO;

export async function signIn(page: Page, email: string, password: string): Promise<void> {
  await page.goto("/sign-in");
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill(password);
  await page.getByRole("button", { name: "Sign in" }).click();
}

export async function signInAs(page: Page, role: DemoRole): Promise<void> {
  await signIn(page, DEMO[role].email, DEMO[role].password);
  await page.getByTestId("signed-in-name").waitFor();
}

export async function navLabels(page: Page): Promise<string[]> {
  return (await page.getByRole("navigation", { name: "Main" }).getByRole("link").allTextContents()).map((t) => t.trim());
}

type CaughtMail = { id: string; subject: string; to: Array<{ address: string }>; text: string; html: string };

/** Waits for a mail to reach the local catcher (maildev's REST API). */
export async function waitForMail(to: string, subjectPart: string, timeoutMs = 15_000): Promise<CaughtMail> {
  const base = inject("mailWebUrl");
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    const res = await fetch(`${base}/api/email`);
    if (res.ok) {
      const all = (await res.json()) as CaughtMail[];
      const hit = all.reverse().find((m) => m.to.some((t) => t.address === to) && m.subject.includes(subjectPart));
      if (hit) return hit;
    }
    await new Promise((r) => setTimeout(r, 300));
  }
  throw new Error(`no mail to ${to} about "${subjectPart}" within ${timeoutMs} ms`);
}

export function firstLink(text: string, pathPart: string): string {
  const match = text.match(new RegExp(`https?://\\S*${pathPart}\\S*`));
  if (!match) throw new Error(`no ${pathPart} link in the mail`);
  return match[0];
}
