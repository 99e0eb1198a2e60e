/** Debian's chromium through playwright-core (no browser download), one context per test. */
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { chromium, type Browser, type BrowserContext, type Page } from "playwright-core";
import { inject } from "vitest";

export const CHROMIUM_ARGS = [
  "--headless",
  "--no-sandbox",
  "--disable-gpu",
  "--disable-quic",
  "--no-first-run",
  "--disable-background-networking",
  "--disable-component-update",
  "--disable-sync",
];

export async function launchBrowser(): Promise<Browser> {
  return chromium.launch({ executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium", args: CHROMIUM_ARGS });
}

export function baseUrl(): string {
  return inject("baseUrl");
}

export async function newPage(browser: Browser, viewport = { width: 1280, height: 860 }): Promise<{ context: BrowserContext; page: Page }> {
  const context = await browser.newContext({ baseURL: baseUrl(), viewport });
  const page = await context.newPage();
  return { context, page };
}

/** Saves a screenshot under data/screenshots for a person to look at after a run. */
export async function snap(page: Page, name: string): Promise<string> {
  const dir = path.join(process.cwd(), "data", "screenshots");
  fs.mkdirSync(dir, { recursive: true });
  const file = path.join(dir, `${name}.png`);
  await page.screenshot({ path: file, fullPage: true });
  return file;
}

export const tmp = () => fs.mkdtempSync(path.join(os.tmpdir(), "portolan-browser-"));
