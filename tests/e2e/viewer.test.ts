/**
 * The 3D views in Debian's chromium (WebGL on the software renderer): the seeded scan of master
 * M-4471-01 draws its point cloud, the section slider changes the shown area and jumps to the
 * analysis' minimum; a seeded revision draws its toolpath and the scrubber moves; three.js is
 * fetched only by the pages that draw in 3D. Ids are looked up through the list page, not assumed.
 */
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { DEFAULT_PREVIEW_MAX_VERTICES, encodePreview, generatePortProgram, ToolpathAnalyzer } from "@/lib/toolpath";
import { launchBrowser, newPage, snap } from "./support/browser";
import { signInAs } from "./support/pages";

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

/**
 * Distinct colours in a WebGL canvas, read back from its kept drawing buffer through a 2D canvas:
 * an empty view is one colour (the paper background), a drawn one has many.
 */
async function canvasColours(page: Page, testId: string): Promise<number> {
  return page.evaluate(async (id) => {
    const canvas = document.querySelector<HTMLCanvasElement>(`[data-testid="${id}"] canvas`);
    if (!canvas || canvas.width === 0) return 0;
    const img = new Image();
    img.src = canvas.toDataURL("image/png");
    await img.decode();
    const flat = document.createElement("canvas");
    flat.width = img.width;
    flat.height = img.height;
    const ctx = flat.getContext("2d")!;
    ctx.drawImage(img, 0, 0);
    const data = ctx.getImageData(0, 0, flat.width, flat.height).data;
    const seen = new Set<number>();
    for (let i = 0; i < data.length; i += 4) seen.add((data[i] << 16) | (data[i + 1] << 8) | data[i + 2]);
    return seen.size;
  }, testId);
}

/** Bodies of the JavaScript files a page loads, to see which pages fetch three.js. */
function collectScripts(page: Page): string[] {
  const bodies: string[] = [];
  page.on("response", async (res) => {
    if (!res.url().endsWith(".js")) return;
    try {
      bodies.push(await res.text());
    } catch {
      // a response that went away with a navigation
    }
  });
  return bodies;
}

async function pickOption(select: ReturnType<Page["locator"]>, part: string) {
  const labels = (await select.locator("option").allTextContents()).map((l) => l.trim());
  const label = labels.find((l) => l.includes(part));
  if (!label) throw new Error(`no option with "${part}" among ${labels.join(", ")}`);
  await select.selectOption({ label });
}

// three.js keeps this text in its renderer's messages, whatever the minifier does to names.
const THREE_MARK = "THREE.WebGLRenderer";

/** The page's "1,234" as the analysis' number formats it (en-US, no decimals). */
const asShown = (n: number) => n.toLocaleString("en-US", { minimumFractionDigits: 0, maximumFractionDigits: 0 });

describe("3D views", () => {
  it("draws a seeded scan, moves the section slider, and jumps to the analysis' smallest section", async () => {
    const { context, page } = await newPage(browser);
    await signInAs(page, "machinist");
    const scripts = collectScripts(page);
    await page.goto("/view");
    const row = page.getByTestId("view-scans").getByRole("row").filter({ hasText: "M-4471-01 · intake" });
    const link = row.getByRole("link");
    const href = (await link.getAttribute("href"))!;
    const scanId = Number(href.split("/").at(-1));
    expect(scanId).toBeGreaterThan(0);
    // The list page itself does not load three.js.
    await page.waitForLoadState("networkidle");
    expect(scripts.some((s) => s.includes(THREE_MARK))).toBe(false);

    await link.click();
    await page.getByTestId("cloud-viewer").waitFor({ timeout: 90_000 });
    await expect.poll(() => canvasColours(page, "cloud-canvas"), { timeout: 30_000 }).toBeGreaterThan(20);
    expect(scripts.some((s) => s.includes(THREE_MARK))).toBe(true);

    const area = page.getByTestId("section-area");
    const slider = page.getByTestId("section-slider");
    await slider.focus();
    await page.keyboard.press("Home");
    const first = await area.textContent();
    const firstStation = await page.getByTestId("section-station").textContent();
    for (let i = 0; i < 8; i++) await page.keyboard.press("ArrowRight");
    await expect.poll(() => page.getByTestId("section-station").textContent()).not.toBe(firstStation);
    expect(await area.textContent()).not.toBe(first);

    // The analysis' own minimum, read from the API the way any client would.
    const scan = (await (await page.request.get(`/api/scans/${scanId}`)).json()) as { files: Array<{ analysis: { state: string; result: { minSection: { areaMm2: number } | null } } | null }> };
    const done = scan.files.filter((f) => f.analysis?.state === "done").at(-1)!;
    const minArea = done.analysis!.result.minSection!.areaMm2;
    await page.getByTestId("jump-to-min").click();
    await expect.poll(() => area.textContent()).toBe(asShown(minArea));
    await expect.poll(() => page.getByTestId("at-min").isVisible()).toBe(true);
    await page.getByTestId("cloud-canvas").scrollIntoViewIfNeeded();
    await snap(page, "viewer-scan");
    await context.close();
  });

  it("draws a seeded revision's toolpath and scrubs it with the keyboard", async () => {
    const { context, page } = await newPage(browser);
    await signInAs(page, "lead");
    await page.goto("/view");
    await page.getByTestId("view-revisions").getByRole("link", { name: "Street intake B" }).click();
    await page.getByTestId("toolpath-viewer").waitFor({ timeout: 90_000 });
    await expect.poll(() => canvasColours(page, "toolpath-canvas"), { timeout: 30_000 }).toBeGreaterThan(20);
    const position = page.getByTestId("scrub-position");
    const full = await position.textContent();
    expect(full).toMatch(/100 %/);
    await page.getByTestId("toolpath-scrubber").focus();
    await page.keyboard.press("Home");
    await expect.poll(() => position.textContent()).toMatch(/point 1 of/);
    await page.keyboard.press("PageUp");
    await expect.poll(() => position.textContent()).not.toMatch(/point 1 of/);
    // Switching every tool off leaves only the boxes and axes: fewer colours than with the path.
    await page.keyboard.press("End");
    const drawn = await canvasColours(page, "toolpath-canvas");
    for (const box of await page.getByRole("group", { name: /Tools/ }).getByRole("checkbox").all()) await box.uncheck();
    await expect.poll(() => canvasColours(page, "toolpath-canvas")).toBeLessThan(drawn);
    for (const box of await page.getByRole("group", { name: /Tools/ }).getByRole("checkbox").all()) await box.check();
    await page.getByRole("button", { name: "Top" }).click();
    await snap(page, "viewer-toolpath");
    await context.close();
  });

  it("draws a preview of over 200,000 vertices (a long program's, served in place of the seeded one)", async () => {
    // A generated 4-tool program of 1.4 M lines, streamed through the engine chunk by chunk, with
    // the preview budget raised a little so it ends above the stored previews' 200,000 cap.
    const analyzer = new ToolpathAnalyzer({ previewMaxVertices: DEFAULT_PREVIEW_MAX_VERTICES * 1.2 });
    const encoder = new TextEncoder();
    for (const chunk of generatePortProgram({ lines: 1_400_000, tools: 4, seed: 9 })) analyzer.push(encoder.encode(chunk));
    const { preview } = analyzer.finish();
    const n = preview.flags.length;
    expect(n).toBeGreaterThanOrEqual(DEFAULT_PREVIEW_MAX_VERTICES);
    const shown = n.toLocaleString("en-US");
    const blob = Buffer.from(encodePreview(preview));

    const { context, page } = await newPage(browser);
    await signInAs(page, "porter");
    await page.route("**/api/analyses/*/preview", (route) =>
      route.fulfill({ status: 200, body: blob, headers: { "content-type": "application/octet-stream", "content-length": String(blob.length), "x-preview-format": "PTVW" } }),
    );
    await page.goto("/view");
    await page.getByTestId("view-revisions").getByRole("link", { name: "Street intake A" }).click();
    await page.getByTestId("toolpath-viewer").waitFor({ timeout: 90_000 });
    await expect.poll(() => page.getByTestId("toolpath-view-figures").textContent()).toContain(shown);
    await expect.poll(() => canvasColours(page, "toolpath-canvas"), { timeout: 30_000 }).toBeGreaterThan(20);
    await page.getByTestId("toolpath-scrubber").focus();
    await page.keyboard.press("Home");
    await expect.poll(() => page.getByTestId("scrub-position").textContent()).toContain(`point 1 of ${shown}`);
    await page.keyboard.press("End");
    await expect.poll(() => page.getByTestId("scrub-position").textContent()).toContain(`point ${shown} of ${shown}`);
    await snap(page, "viewer-toolpath-200k");
    await context.close();
  });

  it("compares two scans: deviation scale with numbers, profiles and their difference", async () => {
    const { context, page } = await newPage(browser);
    await signInAs(page, "porter");
    await page.goto("/view");
    const form = page.getByRole("form", { name: "Compare two scans" });
    // The demo digitized one master, intake and exhaust: the only two scans there are to compare.
    await pickOption(form.getByLabel("Scan A"), "M-4471-01 intake");
    await pickOption(form.getByLabel("Scan B"), "M-4471-01 exhaust");
    await form.getByRole("button", { name: "Compare the scans" }).click();
    await page.getByTestId("cloud-compare-viewer").waitFor({ timeout: 90_000 });
    // The deviation is measured in slices; its figures appear when every point is done.
    await page.getByTestId("deviation-figures").waitFor({ timeout: 90_000 });
    await expect.poll(() => canvasColours(page, "compare-canvas"), { timeout: 30_000 }).toBeGreaterThan(20);
    expect(await page.getByTestId("deviation-scale").textContent()).toMatch(/more room in B/);
    await page.getByTestId("area-difference-chart").waitFor();
    await snap(page, "viewer-scan-compare");
    await context.close();
  });

  it("fits a tablet-width screen", async () => {
    const { context, page } = await newPage(browser, { width: 768, height: 1024 });
    await signInAs(page, "machinist");
    await page.goto("/view");
    await page.getByTestId("view-scans").getByRole("row").filter({ hasText: "M-4471-01 · intake" }).getByRole("link").click();
    await page.getByTestId("cloud-viewer").waitFor({ timeout: 90_000 });
    await expect.poll(() => canvasColours(page, "cloud-canvas"), { timeout: 30_000 }).toBeGreaterThan(20);
    // Nothing wider than the screen: the page does not scroll sideways.
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(768);
    await snap(page, "viewer-scan-tablet");
    await context.close();
  });

  it("compares two revisions with charts", async () => {
    const { context, page } = await newPage(browser);
    await signInAs(page, "auditor");
    await page.goto("/view");
    const form = page.getByRole("form", { name: "Compare two revisions" });
    await snap(page, "viewer-index");
    await form.getByLabel("Revision A").selectOption({ label: "Street intake A" });
    await form.getByLabel("Revision B").selectOption({ label: "Street intake B" });
    await form.getByRole("button", { name: "Compare the revisions" }).click();
    await page.getByTestId("revision-charts").waitFor();
    await page.getByTestId("revision-figures").waitFor();
    await page.getByTestId("section-area-chart").waitFor();
    await snap(page, "viewer-revision-compare");
    await context.close();
  });
});
