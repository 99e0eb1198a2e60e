import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { launchBrowser, newPage, snap } from "./support/browser";
import { DEMO, firstLink, navLabels, signIn, signInAs, waitForMail, type DemoRole } from "./support/pages";

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

const EXPECTED_NAV: Record<DemoRole, { has: string[]; lacks: string[] }> = {
  porter: { has: ["Overview", "Head types"], lacks: ["Users and invitations", "Audit log"] },
  machinist: { has: ["Overview", "Head types"], lacks: ["Users and invitations", "Audit log"] },
  lead: { has: ["Overview", "Audit log"], lacks: ["Users and invitations"] },
  auditor: { has: ["Overview", "Audit log"], lacks: ["Users and invitations"] },
  admin: { has: ["Overview", "Audit log", "Users and invitations"], lacks: [] },
};

describe("signing in", () => {
  for (const role of Object.keys(DEMO) as DemoRole[]) {
    it(`shows the ${role}'s navigation`, async () => {
      const { context, page } = await newPage(browser);
      await signInAs(page, role);
      expect(await page.getByTestId("signed-in-name").textContent()).toBe(DEMO[role].name);
      const labels = await navLabels(page);
      for (const label of EXPECTED_NAV[role].has) expect(labels).toContain(label);
      for (const label of EXPECTED_NAV[role].lacks) expect(labels).not.toContain(label);
      // The overview shows real counts: the demo shop has three head types.
      expect(await page.getByTestId("count-head-types").textContent()).toBe("3");
      await snap(page, `home-${role}`);
      await context.close();
    });
  }

  it("says so when the password is wrong, and stays on the sign-in page", async () => {
    const { context, page } = await newPage(browser);
    await signIn(page, DEMO.porter.email, "not-the-password");
    await expect.poll(() => page.getByTestId("sign-in-error").textContent()).toMatch(/do not match an active account/);
    expect(new URL(page.url()).pathname).toBe("/sign-in");
    await context.close();
  });

  it("sends someone without a session to the sign-in page", async () => {
    const { context, page } = await newPage(browser);
    await page.goto("/head-types");
    expect(new URL(page.url()).pathname).toBe("/sign-in");
    expect(new URL(page.url()).searchParams.get("callbackUrl")).toBe("/head-types");
    await context.close();
  });
});

describe("roles on the server", () => {
  it("shows a porter the 403 page on an admin page", async () => {
    const { context, page } = await newPage(browser);
    await signInAs(page, "porter");
    const res = await page.goto("/admin/users");
    expect(res?.status()).toBe(403);
    await expect.poll(() => page.getByTestId("forbidden-title").textContent()).toBe("Not open to your role");
    // And the API refuses the same person, whatever the screen shows.
    const api = await page.request.get("/api/users");
    expect(api.status()).toBe(403);
    expect((await api.json()).error.code).toBe("forbidden");
    await snap(page, "forbidden-porter");
    await context.close();
  });
});

describe("invitations", () => {
  it("lets an invited person set a password from the e-mailed link and signs them in", async () => {
    const admin = await newPage(browser);
    await signInAs(admin.page, "admin");
    await admin.page.goto("/admin/users");
    const email = `new.machinist.${Date.now()}@harbourline.invalid`;
    await admin.page.getByLabel("E-mail", { exact: true }).fill(email);
    await admin.page.locator("#invite-role").selectOption("machinist");
    await admin.page.getByRole("button", { name: "Send invitation" }).click();
    await admin.page.getByText(`Invitation sent to ${email}.`).waitFor();
    await snap(admin.page, "admin-users");
    await admin.context.close();

    const mail = await waitForMail(email, "invited");
    const link = firstLink(mail.text, "/invite/");

    const invitee = await newPage(browser);
    await invitee.page.goto(link);
    await invitee.page.getByLabel("Your name").fill("Noor Feldspar");
    // The form checks with the server's own schema before anything is sent.
    await invitee.page.getByLabel("New password").fill("short");
    await invitee.page.getByLabel("Repeat the password").fill("short");
    await invitee.page.getByRole("button", { name: "Create my account" }).click();
    await expect.poll(() => invitee.page.getByText("Use at least 10 characters.").count()).toBe(1);
    await invitee.page.getByLabel("New password").fill("a-long-enough-password");
    await invitee.page.getByLabel("Repeat the password").fill("a-long-enough-password");
    await invitee.page.getByRole("button", { name: "Create my account" }).click();
    await invitee.page.getByTestId("signed-in-name").waitFor();
    expect(await invitee.page.getByTestId("signed-in-name").textContent()).toBe("Noor Feldspar");
    expect(await invitee.page.getByTestId("signed-in-role").textContent()).toBe("Machinist");

    // The link works once.
    await invitee.page.goto(link);
    await expect.poll(() => invitee.page.getByTestId("link-problem").textContent()).toMatch(/already been used/);
    await invitee.context.close();
  });
});
