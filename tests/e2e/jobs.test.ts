/**
 * The whole story of a job in the browser, against the production build and the demo shop:
 * the lead opens a job and picks the released revision (a superseded one is refused with the
 * reason); the machinist receives two heads and records their cuts, one scrapped; the admin
 * issues a machine token and the cell computer's CLI fetches the program with a matching hash;
 * the auditor traces the revision to both heads and downloads the recall list.
 */
import { spawnSync } from "node:child_process";
import fs from "node:fs";
import path from "node:path";
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { baseUrl, launchBrowser, newPage, snap, tmp } from "./support/browser";
import { signInAs } from "./support/pages";

let browser: Browser;
const work = tmp();
const stamp = Date.now().toString(36).toUpperCase();
const serials = [`E2E-${stamp}-1`, `E2E-${stamp}-2`];
let jobPath = "";
let jobNumber = "";

beforeAll(async () => {
  browser = await launchBrowser();
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

describe("a job from quote to recall", () => {
  it("the lead opens a job and picks the released revision", async () => {
    const { context, page } = await newPage(browser);
    await signInAs(page, "lead");
    await page.goto("/jobs/new");
    await page.locator("#job-new-customer").selectOption(await optionValue(page, "job-new-customer", "Pellucid Motor Works"));
    await page.locator("#job-new-type").selectOption(await optionValue(page, "job-new-type", "HL-4471-A"));
    await page.getByLabel("Heads (quantity)").fill("2");
    await page.getByLabel("Exhaust").uncheck();
    await page.getByLabel("Due").fill("2026-12-18");
    jobNumber = (await page.getByLabel("Job number").inputValue()).trim();
    await page.getByRole("button", { name: "Open the job" }).click();
    await page.waitForURL(/\/jobs\/\d+$/);
    jobPath = new URL(page.url()).pathname;
    const jobId = jobPath.split("/").pop()!;
    await page.getByRole("heading", { name: `Job ${jobNumber}` }).waitFor();

    // A superseded revision is refused, with the reason under the field.
    const select = page.locator(`#job-${jobId}-intake-revision`);
    const superseded = await page.locator(`#job-${jobId}-intake-revision option`, { hasText: "Street intake A" }).getAttribute("value");
    if (superseded) {
      await select.selectOption(superseded);
      await page.getByRole("button", { name: "Use this revision" }).click();
      await expect.poll(() => page.locator(`#job-${jobId}-intake-revision-error`).textContent()).toMatch(/superseded: only a released revision can be chosen/);
    }
    await select.selectOption(await optionValue(page, `job-${jobId}-intake-revision`, "Street intake B"));
    await page.getByRole("button", { name: "Use this revision" }).click();
    await expect.poll(() => page.getByTestId("chosen-intake").textContent()).toBe("Street intake B");
    await expect.poll(() => page.getByTestId("planned-total").textContent()).toMatch(/\d+ (h|min)/);
    await page.getByRole("button", { name: "Schedule" }).click();
    await expect.poll(() => page.getByTestId("job-state").textContent()).toMatch(/Scheduled/i);
    await snap(page, "jobs-lead-scheduled");
    await context.close();
  });

  it("the machinist receives two heads and records their cuts, one scrapped", async () => {
    const { context, page } = await newPage(browser);
    await signInAs(page, "machinist");
    await page.goto(jobPath);
    // The cautions are on the page before anything is cut.
    await expect.poll(() => page.getByRole("note").first().textContent()).toMatch(/First-article check/);
    for (const serial of serials) {
      await page.getByLabel("Serial or casting mark").fill(serial);
      await page.getByLabel("Incoming inspection").fill("Dye check clean; seats fine.");
      await page.getByRole("button", { name: "Receive head" }).click();
      await page.getByTestId(`head-${serial}`).waitFor();
    }
    const jobId = jobPath.split("/").pop()!;
    const head = page.locator(`#cut-${jobId}-head`);

    await head.selectOption(await optionValue(page, `cut-${jobId}-head`, serials[0]!));
    await page.getByLabel("Good", { exact: true }).check();
    await page.getByRole("button", { name: "Record the cut" }).click();
    await expect.poll(() => page.getByTestId(`head-${serials[0]}`).textContent()).toMatch(/Cut/);

    await head.selectOption(await optionValue(page, `cut-${jobId}-head`, serials[1]!));
    await page.getByLabel("Scrapped", { exact: true }).check();
    // No reason: the shared schema stops it in the browser.
    await page.getByRole("button", { name: "Record the cut" }).click();
    await expect.poll(() => page.locator(`#cut-${jobId}-reason-error`).textContent()).toMatch(/Say why/);
    await page.getByLabel("Cylinder (only if one port)").fill("6");
    await page.getByLabel("Reason").fill("broke into the water jacket under the short side, cylinder 6");
    await page.getByRole("button", { name: "Record the cut" }).click();
    await expect.poll(() => page.getByTestId(`head-${serials[1]}`).textContent()).toMatch(/Scrapped/);
    await expect.poll(() => page.getByTestId("job-state").textContent()).toMatch(/On the machine/i);
    await snap(page, "jobs-machinist-cuts");
    await context.close();
  });

  it("the machine's token fetches the program with a matching hash", async () => {
    const { context, page } = await newPage(browser);
    await signInAs(page, "admin");
    await page.goto("/admin/machine-tokens");
    await page.getByLabel("Label").fill(`e2e cell PC ${stamp}`);
    await page.getByRole("button", { name: "Issue token" }).click();
    const token = (await page.getByTestId("token-value").textContent())!.trim();
    expect(token).toMatch(/^ptm_/);
    await snap(page, "jobs-admin-token");

    const out = path.join(work, "program.nc");
    const res = spawnSync(
      process.execPath,
      ["--import", "tsx", path.join(process.cwd(), "lib/cli/main.ts"), "program", "fetch", "--job", jobNumber, "--port", "intake", "--out", out, "--url", baseUrl(), "--json"],
      { env: { ...process.env, PORTOLAN_MACHINE_TOKEN: token }, encoding: "utf8", timeout: 120_000 },
    );
    expect(res.status, res.stderr).toBe(0);
    const fetched = JSON.parse(res.stdout);
    expect(fetched.ok).toBe(true);
    expect(fs.statSync(out).size).toBe(fetched.bytes);

    // The same checksum is frozen on both cuts of this job.
    const cuts = await (await page.request.get(`/api/cuts?jobId=${jobPath.split("/").pop()}`)).json();
    expect(cuts.rows).toHaveLength(2);
    for (const c of cuts.rows) expect(c.toolpathSha256).toBe(fetched.sha256);

    // Last use shows on the token list.
    await page.reload();
    await expect.poll(async () => (await page.locator("tr", { hasText: `e2e cell PC ${stamp}` }).textContent()) ?? "").not.toMatch(/never/);
    await context.close();
  });

  it("the auditor traces the revision to both heads and downloads the recall list", async () => {
    const { context, page } = await newPage(browser);
    await signInAs(page, "auditor");
    await page.goto("/trace");
    await page.locator("#trace-revision").selectOption(await optionValue(page, "trace-revision", "Street intake B"));
    await page.getByRole("button", { name: "Trace revision" }).click();
    await page.waitForURL(/\/trace\/revision\/\d+$/);
    await page.getByLabel("Head, job, customer or reason").fill(`E2E-${stamp}`);
    for (const serial of serials) await page.getByRole("link", { name: serial }).waitFor();
    await snap(page, "jobs-auditor-trace");

    const [download] = await Promise.all([page.waitForEvent("download"), page.getByTestId("recall-csv").click()]);
    const file = path.join(work, download.suggestedFilename());
    await download.saveAs(file);
    expect(download.suggestedFilename()).toMatch(/^recall-Street-intake-B-\d{4}-\d{2}-\d{2}\.csv$/);
    const csv = fs.readFileSync(file, "utf8");
    const lines = csv.split("\r\n").filter((l) => l.includes(`E2E-${stamp}`));
    expect(lines).toHaveLength(2);
    // The reason holds a comma, so it is quoted (RFC 4180).
    expect(lines.find((l) => l.includes(serials[1]!))).toContain('Scrapped,"broke into the water jacket under the short side, cylinder 6"');
    expect(lines.every((l) => l.includes("Pellucid Motor Works"))).toBe(true);

    // And a head's own page walks back to the master.
    await page.goto(`/trace/head/${serials[0]}`);
    await page.getByText("Matches the file on record").waitFor();
    await snap(page, "jobs-auditor-head");
    // The auditor changes nothing: no cut form, and the API refuses.
    await page.goto(jobPath);
    expect(await page.getByRole("button", { name: "Record the cut" }).count()).toBe(0);
    const refused = await page.request.post("/api/cuts", { data: { headId: 1, port: "intake", startedAt: Date.now(), outcome: "good" } });
    expect(refused.status()).toBe(403);
    await context.close();
  });
});
