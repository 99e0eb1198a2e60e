/**
 * Flow tests in the browser: a porter imports a bench CSV (a malformed one first), sees the
 * computed columns and the chart, saves; a lead opens the flow sheet's PDF; an auditor reads
 * without the controls to change anything.
 */
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { launchBrowser, newPage, snap } from "./support/browser";
import { signInAs } from "./support/pages";

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

// Invented bench sheet for a 2.02 in intake valve at 28 inH₂O.
const GOOD_CSV = ["lift_in,flow_cfm,remark", "0.100,66.5,", "0.200,128.0,", "0.300,178.5,", "0.400,214.0,", "0.500,238.5,", "0.600,251.0,top"].join("\n");
const BAD_CSV = ["lift_in,flow_cfm", "0.100,66.5", "0.200,abc", "-0.300,178.5", "0.400,", "0.100,70"].join("\n");

const csvFile = (name: string, text: string) => ({ name, mimeType: "text/csv", buffer: Buffer.from(text, "utf8") });

async function chooseCasting(page: Page, casting: string) {
  const select = page.locator("#ft-head-type");
  await expect.poll(() => select.locator("option").count()).toBeGreaterThan(1);
  const labels = await select.locator("option").allTextContents();
  const label = labels.find((l) => l.startsWith(casting));
  if (!label) throw new Error(`no ${casting} among ${labels.join(", ")}`);
  await select.selectOption({ label });
}

let recordedUrl = "";

describe("flow tests", () => {
  it("lets a porter import a bench CSV, see the computed columns and chart, and save", async () => {
    const { context, page } = await newPage(browser);
    await signInAs(page, "porter");
    await page.goto("/flow-tests");
    // The demo shop's baselines are listed with their corrected peak flow.
    await page.getByText("Stock baseline", { exact: false }).first().waitFor().catch(() => undefined);
    await expect.poll(() => page.locator("tbody tr").count()).toBeGreaterThanOrEqual(2);
    await snap(page, "flow-list-porter");

    await page.getByTestId("record-flow-test").click();
    await page.waitForURL(/\/flow-tests\/new/);
    await chooseCasting(page, "HL-4471-A");
    // Valve and seat come from the casting (2.02 in / 1.82 in valve and seat).
    await expect.poll(() => page.locator("#ft-valve").inputValue()).toBe("51.31");
    await expect.poll(() => page.locator("#ft-seat").inputValue()).toBe("46.23");
    await page.locator("#ft-cylinder").fill("4");
    await page.locator("#ft-temp").fill("21");
    await page.locator("#ft-baro").fill("100.8");

    // A malformed file: one message per bad line, nothing taken into the table.
    await page.getByTestId("csv-file").setInputFiles(csvFile("bench-bad.csv", BAD_CSV));
    const errors = page.getByTestId("csv-errors");
    await errors.waitFor();
    expect(await errors.locator("tbody tr").count()).toBe(4);
    expect(await errors.textContent()).toContain("not a number");
    expect(await page.getByTestId("lift-table").locator("input").count()).toBe(0);
    await snap(page, "flow-import-errors");

    await page.getByTestId("csv-file").setInputFiles(csvFile("bench-2025-05-06.csv", GOOD_CSV));
    await page.getByTestId("csv-loaded").waitFor();
    expect(await page.getByTestId("csv-loaded").textContent()).toMatch(/Read 6 rows .* lift from “lift_in” in in, flow from “flow_cfm” in cfm/);
    await expect.poll(() => page.getByTestId("lift-table").locator("tbody tr").count()).toBe(6);
    // Computed columns follow the table at once.
    await expect.poll(() => page.getByTestId("live-summary").textContent()).toMatch(/Peak \d+\.\d cfm/);
    await page.getByTestId("flow-chart").waitFor();
    await snap(page, "flow-form-imported");

    await page.getByRole("button", { name: "Save flow test" }).click();
    await page.waitForURL(/\/flow-tests\/\d+$/);
    recordedUrl = new URL(page.url()).pathname;
    const table = page.getByTestId("computed-table");
    await table.waitFor();
    expect(await table.locator("tbody tr").count()).toBe(6);
    // First row: 0.100 in lift is 2.54 mm.
    expect(await table.locator("tbody tr").first().locator("td").first().textContent()).toBe("2.54");
    await expect.poll(() => page.locator("[data-testid=flow-chart] .recharts-line-curve").count()).toBeGreaterThanOrEqual(1);
    await page.getByTestId("cd-chart").waitFor();
    const conventions = await page.getByTestId("flow-conventions").textContent();
    expect(conventions).toContain("CIPM-2007");
    expect(conventions).toContain("Compressibility is neglected");
    expect(await page.getByRole("note").last().textContent()).toMatch(/flow bench and the inspection decide/);
    // A porter records but does not change recorded tests.
    expect(await page.getByRole("link", { name: "Edit" }).count()).toBe(0);
    await snap(page, "flow-sheet-porter");
    await context.close();
  });

  it("lets the lead open the flow sheet's PDF, print it and correct the test", async () => {
    expect(recordedUrl).toMatch(/^\/flow-tests\/\d+$/);
    const { context, page } = await newPage(browser);
    await signInAs(page, "lead");
    await page.goto(recordedUrl);
    await page.getByTestId("computed-table").waitFor();
    expect(await page.getByRole("link", { name: "Edit" }).count()).toBe(1);
    expect(await page.getByRole("button", { name: "Delete" }).count()).toBe(1);
    const href = await page.getByTestId("open-pdf").getAttribute("href");
    expect(href).toBe(`/api${recordedUrl}/pdf`);
    const pdf = await page.request.get(href!);
    expect(pdf.status()).toBe(200);
    expect(pdf.headers()["content-type"]).toBe("application/pdf");
    const bytes = await pdf.body();
    expect(bytes.subarray(0, 5).toString()).toBe("%PDF-");
    expect(bytes.length).toBeGreaterThan(3000);
    await snap(page, "flow-sheet-lead");
    // On paper: the navigation and the controls drop out, the sheet, chart and caution stay.
    await page.emulateMedia({ media: "print" });
    expect(await page.getByRole("button", { name: "Print flow sheet" }).isVisible()).toBe(false);
    expect(await page.getByRole("navigation", { name: "Main" }).isVisible()).toBe(false);
    expect(await page.getByTestId("computed-table").isVisible()).toBe(true);
    expect(await page.getByTestId("flow-chart").isVisible()).toBe(true);
    await snap(page, "flow-sheet-print");
    await page.emulateMedia({ media: "screen" });

    // The lead corrects a recorded test: the form opens with the stored values.
    await page.getByRole("link", { name: "Edit" }).click();
    await page.waitForURL(/\/edit$/);
    await expect.poll(() => page.locator("#ft-head-type option:checked").textContent()).toMatch(/^HL-4471-A/);
    expect(await page.locator("#ft-valve").inputValue()).toBe("51.31");
    expect(await page.getByTestId("lift-table").locator("tbody tr").count()).toBe(6);
    await page.locator("#ft-notes").fill("Re-checked against the bench log: cylinder 4, intake.");
    await page.getByRole("button", { name: "Save changes" }).click();
    await page.waitForURL(new RegExp(`${recordedUrl}$`));
    await page.getByText("Re-checked against the bench log").waitFor();
    expect(await page.getByTestId("computed-table").locator("tbody tr").count()).toBe(6);
    await context.close();
  });

  it("shows an auditor the sheet without controls to change it, on a tablet-width screen", async () => {
    const { context, page } = await newPage(browser, { width: 820, height: 1180 });
    await signInAs(page, "auditor");
    await page.goto("/flow-tests");
    expect(await page.getByTestId("record-flow-test").count()).toBe(0);
    await page.goto(recordedUrl);
    await page.getByTestId("computed-table").waitFor();
    expect(await page.getByRole("link", { name: "Edit" }).count()).toBe(0);
    expect(await page.getByRole("button", { name: "Delete" }).count()).toBe(0);
    const res = await page.goto(`${recordedUrl}/edit`);
    expect(res?.status()).toBe(403);
    await page.goto(recordedUrl);
    await page.getByTestId("computed-table").waitFor();
    await snap(page, "flow-sheet-auditor-tablet");
    await context.close();
  });
});
