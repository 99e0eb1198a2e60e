/**
 * The handoff in the browser, against the production build and the demo shop: the porter
 * registers a master and hands it over; the machinist gets the e-mail, records a scan, uploads a
 * point cloud and a multi-megabyte toolpath and watches the progress and the analyses; the lead
 * releases with the password; an auditor can read all of it and change nothing.
 */
import fs from "node:fs";
import path from "node:path";
import zlib from "node:zlib";
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { intakePortShape, sampleTubeCloud } from "@/lib/geometry/generate";
import { writePly } from "@/lib/geometry/writers";
import { generatePortProgram } from "@/lib/toolpath";
import { launchBrowser, newPage, snap, tmp } from "./support/browser";
import { DEMO, signInAs, waitForMail } from "./support/pages";

let browser: Browser;
const work = tmp();
const stamp = Date.now().toString(36).toUpperCase();
const label = `M-E2E-${stamp}`;
const programName = `E2E intake ${stamp}`;
let masterPath = "";
let revisionPath = "";
const cloudFile = path.join(work, "e2e intake scan.ply");
const programFile = path.join(work, "e2e intake A.nc");
const photoFile = path.join(work, "bowl cyl 1.png");
const wrongFile = path.join(work, "wrong head.nc");

/** A real 16×16 PNG (copper square), built by hand: signature, IHDR, IDAT, IEND (PNG spec). */
function pngBytes(): Buffer {
  const chunk = (type: string, data: Buffer) => {
    const len = Buffer.alloc(4);
    len.writeUInt32BE(data.length);
    const body = Buffer.concat([Buffer.from(type, "ascii"), data]);
    const crc = Buffer.alloc(4);
    crc.writeUInt32BE(zlib.crc32(body));
    return Buffer.concat([len, body, crc]);
  };
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(16, 0);
  ihdr.writeUInt32BE(16, 4);
  ihdr.set([8, 2, 0, 0, 0], 8);
  const rows = Buffer.concat(Array.from({ length: 16 }, () => Buffer.concat([Buffer.from([0]), Buffer.from(Array.from({ length: 16 }, () => [176, 89, 45]).flat())])));
  return Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]), chunk("IHDR", ihdr), chunk("IDAT", zlib.deflateSync(rows)), chunk("IEND", Buffer.alloc(0))]);
}

beforeAll(async () => {
  browser = await launchBrowser();
  const cloud = sampleTubeCloud(intakePortShape({ valveDiameterMm: 34.5, throatPercent: 87 }), { points: 80_000, seed: 5 });
  fs.writeFileSync(cloudFile, Buffer.concat([...writePly({ positions: cloud.positions, count: cloud.count })]));
  // Over one 16 MiB part, so the browser sends it in two parts and the progress moves.
  const out = fs.openSync(programFile, "w");
  for (const chunk of generatePortProgram({ lines: 480_000, tools: 3, seed: 9, port: "intake" })) fs.writeSync(out, chunk);
  fs.closeSync(out);
  fs.writeFileSync(photoFile, pngBytes());
  fs.writeFileSync(wrongFile, [...generatePortProgram({ lines: 300, tools: 1, seed: 2, port: "intake" })].join(""));
});
afterAll(async () => {
  await browser?.close();
  fs.rmSync(work, { recursive: true, force: true });
});

async function optionValue(page: Page, selectId: string, text: string): Promise<string> {
  const value = await page.locator(`#${selectId} option`, { hasText: text }).first().getAttribute("value");
  if (!value) throw new Error(`no option "${text}" in #${selectId}`);
  return value;
}

/** Records every value the progress bar shows from now on. */
async function watchProgress(page: Page, scope: string) {
  await page.evaluate((sel) => {
    const w = window as unknown as { seen: number[] };
    w.seen = [];
    const root = document.querySelector(sel)!;
    new MutationObserver(() => {
      const bar = root.querySelector('[role="progressbar"]');
      if (bar) w.seen.push(Number(bar.getAttribute("aria-valuenow")));
    }).observe(root, { subtree: true, attributes: true, childList: true });
  }, scope);
  return () => page.evaluate(() => (window as unknown as { seen: number[] }).seen);
}

describe("from the porter's bench to a released program", () => {
  it("the porter registers a master with readings and hands it over", async () => {
    const { context, page } = await newPage(browser);
    await signInAs(page, "porter");
    await page.goto("/masters/new");
    await page.getByLabel("Label").fill(label);
    await page.locator("#m-headtype").selectOption(await optionValue(page, "m-headtype", "HL-2205-K"));
    await page.locator("#m-notes-intake").fill("Opened the bowl, sharpened the divider, laid back the short side 1.5 mm.");
    await page.locator("#m-throat-intake").fill("30.4");
    await page.locator("#m-volume-intake").fill("146");
    // 30.4 / 34.5 mm = 88.1 % of the valve: inside the common-practice 85–90 % band.
    await expect.poll(() => page.getByTestId("throat-intake").textContent()).toMatch(/88\.1 %.*Within the guideline/);
    await page.getByRole("button", { name: "Register master" }).click();
    await page.waitForURL(/\/masters\/\d+$/);
    masterPath = new URL(page.url()).pathname;
    await page.getByRole("heading", { name: `Master ${label}` }).waitFor();
    await page.getByRole("button", { name: "Hand over for digitizing" }).click();
    await expect.poll(() => page.getByTestId("master-stage").textContent(), { timeout: 10_000 }).toMatch(/Ready to digitize/i);
    // A photo through the upload service, kept in our bucket and shown in the gallery.
    await page.getByTestId("photo-uploader").locator('input[type="file"]').setInputFiles(photoFile);
    await page.getByTestId("photo-uploader").getByRole("button", { name: "Upload", exact: true }).click();
    await expect.poll(() => page.getByTestId("gallery").locator("img").count(), { timeout: 30_000 }).toBe(1);
    // The image arrives through the checksum-verified download and decodes.
    const img = page.getByTestId("gallery").locator("img").first();
    await img.scrollIntoViewIfNeeded();
    await expect.poll(() => img.evaluate((i) => (i as HTMLImageElement).naturalWidth), { timeout: 10_000 }).toBe(16);
    // The same photo sent twice by mistake: the second one is taken off again.
    await page.getByTestId("photo-uploader").locator('input[type="file"]').setInputFiles(photoFile);
    await page.getByTestId("photo-uploader").getByRole("button", { name: "Upload", exact: true }).click();
    await expect.poll(() => page.getByTestId("gallery").locator("img").count(), { timeout: 30_000 }).toBe(2);
    page.once("dialog", (dialog) => void dialog.accept());
    await page.getByTestId("gallery").getByRole("button", { name: "Remove bowl cyl 1.png from this master" }).last().click();
    await expect.poll(() => page.getByTestId("gallery").locator("img").count(), { timeout: 10_000 }).toBe(1);
    await snap(page, "handoff-porter-master");
    await page.goto("/handoff");
    await page.getByTestId(`card-master-${label}`).waitFor();
    expect(await page.getByTestId("column-ready_to_digitize").getByTestId(`card-master-${label}`).count()).toBe(1);
    await snap(page, "handoff-board");
    await context.close();
  });

  it("the machinist gets the e-mail, records a scan and uploads its point cloud", async () => {
    const mail = await waitForMail(DEMO.machinist.email, `Master ${label} is ready to digitize`);
    expect(mail.text).toContain(masterPath);
    const { context, page } = await newPage(browser);
    await signInAs(page, "machinist");
    await page.goto(masterPath);
    await page.getByRole("link", { name: "Record a scan" }).click();
    await page.waitForURL(/\/scans\/new/);
    await page.getByLabel("Stylus diameter (mm)").fill("2");
    await page.getByLabel("Point spacing (mm)").fill("0.3");
    await page.getByRole("button", { name: "Record scan" }).click();
    await page.waitForURL(/\/scans\/\d+$/);
    const uploader = page.getByTestId("uploader-point_cloud");
    await uploader.locator('input[type="file"]').setInputFiles(cloudFile);
    await uploader.getByRole("button", { name: "Upload", exact: true }).click();
    await expect.poll(() => uploader.getByTestId("upload-status").textContent(), { timeout: 60_000 }).toMatch(/Stored “e2e intake scan.ply”/);
    await expect.poll(async () => page.locator('[data-testid^="analysis-"]').first().getAttribute("data-state"), { timeout: 90_000 }).toBe("done");
    await expect.poll(() => page.getByTestId("geometry-figures").textContent()).toMatch(/% of valve/);
    await snap(page, "handoff-machinist-scan");
    // Recording the scan moved the master on.
    await page.goto(masterPath);
    await expect.poll(() => page.getByTestId("master-stage").textContent()).toMatch(/Digitized/i);
    await context.close();
  });

  it("the machinist creates the program, uploads a multi-megabyte toolpath and sends it to proving", async () => {
    const { context, page } = await newPage(browser);
    await signInAs(page, "machinist");
    await page.goto("/programs/new");
    await page.locator("#pg-headtype").selectOption(await optionValue(page, "pg-headtype", "HL-2205-K"));
    await page.getByLabel("Name").fill(programName);
    await page.getByRole("button", { name: "Create program" }).click();
    await page.waitForURL(/\/programs\/\d+$/);
    await page.getByRole("link", { name: "New revision" }).click();
    await page.waitForURL(/\/revisions\/new$/);
    await page.getByLabel("Change note").fill("First program from the e2e scan.");
    await page.getByRole("button", { name: "Create draft revision" }).click();
    await page.waitForURL(/\/revisions\/\d+$/);
    revisionPath = new URL(page.url()).pathname;
    const uploader = page.getByTestId("uploader-toolpath");
    // A wrong file first: uploaded, then taken off the draft again (the stored copy stays).
    await uploader.locator('input[type="file"]').setInputFiles(wrongFile);
    await uploader.getByRole("button", { name: "Upload", exact: true }).click();
    await expect.poll(() => uploader.getByTestId("upload-status").textContent(), { timeout: 60_000 }).toMatch(/Stored “wrong head.nc”/);
    await expect.poll(() => page.getByTestId("file-name").allTextContents()).toContain("wrong head.nc");
    page.once("dialog", (dialog) => void dialog.accept());
    await page.getByRole("button", { name: "Remove wrong head.nc from this revision" }).click();
    await expect.poll(() => page.getByTestId("file-name").allTextContents()).not.toContain("wrong head.nc");
    await uploader.locator('input[type="file"]').setInputFiles(programFile);
    const seen = await watchProgress(page, '[data-testid="uploader-toolpath"]');
    await uploader.getByRole("button", { name: "Upload", exact: true }).click();
    await expect.poll(() => uploader.getByTestId("upload-status").textContent(), { timeout: 120_000 }).toMatch(/Stored “e2e intake A.nc”/);
    const values = await seen();
    expect(values.at(-1)).toBe(100);
    expect(values.some((v) => v > 0 && v < 100)).toBe(true);
    await expect.poll(async () => page.locator('[data-testid^="analysis-"]').first().getAttribute("data-state"), { timeout: 120_000 }).toBe("done");
    await expect.poll(() => page.getByTestId("cycle-time").textContent()).toMatch(/min/);
    await page.getByRole("button", { name: "Send to proving" }).click();
    await expect.poll(() => page.getByTestId("revision-state").textContent(), { timeout: 10_000 }).toMatch(/Proving/i);
    await snap(page, "handoff-machinist-revision");
    await context.close();
  });

  it("the lead is told, and releases with the password", async () => {
    await waitForMail(DEMO.lead.email, `${programName} (intake) revision A is in proving`);
    const { context, page } = await newPage(browser);
    await signInAs(page, "lead");
    await page.goto(revisionPath);
    await page.getByRole("button", { name: "Release…" }).click();
    await page.getByLabel("Reason to release without a flow test").fill("First article measured within 0.05 mm of the master; bench booked for Friday.");
    await page.getByLabel("Your password").fill("not-the-password");
    await page.getByRole("button", { name: "Sign and release" }).click();
    await expect.poll(() => page.locator("#release-password-error").textContent(), { timeout: 10_000 }).toMatch(/does not match/);
    await page.getByLabel("Your password").fill(DEMO.lead.password);
    await page.getByRole("button", { name: "Sign and release" }).click();
    // Signing checks the password hash and e-mails everyone concerned before it answers.
    await expect.poll(() => page.getByTestId("revision-state").textContent(), { timeout: 20_000 }).toMatch(/Released/i);
    expect(await page.getByTestId("release-signature").textContent()).toMatch(/[0-9a-f]{64}/);
    await expect.poll(() => page.getByTestId("moves").textContent()).toMatch(/Released by/);
    await snap(page, "handoff-lead-released");
    await context.close();
    await waitForMail(DEMO.machinist.email, `${programName} (intake) revision A released`);
  });

  it("an auditor reads everything and can change nothing", async () => {
    const { context, page } = await newPage(browser);
    await signInAs(page, "auditor");
    await page.goto(revisionPath);
    await page.getByTestId("revision-state").waitFor();
    expect(await page.getByTestId("revision-actions").count()).toBe(0);
    expect(await page.locator('input[type="file"]').count()).toBe(0);
    await page.goto(masterPath);
    expect(await page.getByRole("link", { name: "Edit notes and readings" }).count()).toBe(0);
    expect(await page.getByTestId("photo-uploader").count()).toBe(0);
    expect(await page.getByTestId("gallery").getByRole("button", { name: /^Remove/ }).count()).toBe(0);
    for (const p of ["/masters/new", "/scans/new", "/programs/new", "/plates/new", "/machines/new", "/head-types/new"]) {
      await page.goto(p);
      await expect.poll(() => page.getByTestId("forbidden-title").textContent(), { message: p }).toBe("Not open to your role");
      expect(await page.locator("form").count(), p).toBe(0);
    }
    const api = await page.request.post("/api/masters", { data: { label: "M-AUDIT", headTypeId: 1 } });
    expect(api.status()).toBe(403);
    const move = await page.request.post(`/api/revisions/${revisionPath.split("/").pop()}/moves`, { data: { to: "withdrawn", note: "auditor tries" } });
    expect(move.status()).toBe(403);
    await page.goto("/handoff");
    expect(await page.getByTestId("handoff-board").getByRole("button").count()).toBe(0);
    await snap(page, "handoff-auditor-board");
    await context.close();
  });

  it("anyone compares the demo's street intake revisions side by side, on a tablet", async () => {
    const { context, page } = await newPage(browser, { width: 820, height: 1180 });
    await signInAs(page, "auditor");
    await page.goto("/programs");
    await page.getByRole("link", { name: "Street intake" }).click();
    await page.waitForURL(/\/programs\/\d+$/);
    await page.getByRole("button", { name: "Compare" }).click();
    await page.waitForURL(/\/compare\?a=\d+&b=\d+/);
    await expect.poll(() => page.getByTestId("compare-times").textContent()).toMatch(/Cycle time/);
    expect(await page.getByRole("note").first().textContent()).toMatch(/first-article cut/);
    await snap(page, "handoff-compare-tablet");
    await context.close();
  });
});
