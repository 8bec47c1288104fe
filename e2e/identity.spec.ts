import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createTestTenant, ownerPool, TEST_PASSWORD, type TestTenant } from "../src/test/tenants";
import { appUrl, launchBrowser, settled, signIn } from "./browser";
import { firstLink, waitForMessage } from "./mailbox";

let browser: Browser;
let tenant: TestTenant;
const pool = ownerPool();

beforeAll(async () => {
  browser = await launchBrowser();
  tenant = await createTestTenant(pool, "e2e-identity");
});
afterAll(async () => {
  await browser?.close();
  await pool.end();
});


describe("invite → e-mail → accept → sign in → sign out, in a real browser", () => {
  it("lets an admin invite an analyst who joins through the e-mailed link", async () => {
    const admin = await (await browser.newContext()).newPage();
    await signIn(admin, tenant.users.admin!.email, TEST_PASSWORD);
    await admin.getByRole("link", { name: "Members" }).click();
    await admin.waitForURL(`${appUrl}/settings/members`);
    const newcomer = `newcomer.${Date.now()}@e2e.test`;
    await admin.getByLabel("E-mail", { exact: true }).fill(newcomer);
    await admin.getByLabel("Role", { exact: true }).selectOption("analyst");
    await admin.getByRole("button", { name: "Send invitation" }).click();
    await admin.getByText("Invitation sent").waitFor();

    const message = await waitForMessage(newcomer, "invitation");
    expect(message.subject).toContain(tenant.name);
    const link = firstLink(message, "/invite/");

    const guest = await (await browser.newContext()).newPage();
    await guest.goto(link);
    await settled(guest);
    await guest.getByRole("heading", { name: `Join ${tenant.name}` }).waitFor();
    await guest.getByLabel("Your name").fill("Nadia Newcomer");
    await guest.getByLabel("Choose a password").fill("a-long-enough-password");
    await guest.getByRole("button", { name: "Accept and sign in" }).click();
    await guest.waitForURL(`${appUrl}/`);
    await guest.getByText("Nadia Newcomer").first().waitFor();
    expect(await guest.getByRole("link", { name: "Members" }).count()).toBe(0);

    await guest.getByRole("button", { name: "Sign out" }).click();
    await guest.waitForURL(`${appUrl}/sign-in`);
    await guest.goto(`${appUrl}/`);
    await guest.waitForURL(`${appUrl}/sign-in`);

    await signIn(guest, newcomer, "a-long-enough-password");
    await guest.getByText("Yield analyst").first().waitFor();

    // The link works once (threat: a forwarded or replayed invitation).
    const replay = await (await browser.newContext()).newPage();
    await replay.goto(link);
    await replay.getByRole("heading", { name: "Invitation not valid" }).waitFor();
  });

  it("answers an analyst who types an admin page's address with the 404 page (threat: URL guessing)", async () => {
    const page = await (await browser.newContext()).newPage();
    await signIn(page, tenant.users.analyst!.email, TEST_PASSWORD);
    const response = await page.goto(`${appUrl}/settings/members`);
    expect(response?.status()).toBe(404);
    await page.getByRole("heading", { name: "Nothing here" }).waitFor();
  });

  it("resets a forgotten password through the e-mailed link, after which only the new password works", async () => {
    const page = await (await browser.newContext()).newPage();
    await page.goto(`${appUrl}/sign-in`);
    await settled(page);
    await page.getByRole("link", { name: "Forgot your password?" }).click();
    await page.waitForURL(`${appUrl}/reset`);
    await settled(page);
    await page.getByLabel("E-mail").fill(tenant.users.engineer!.email);
    await page.getByRole("button", { name: "Send reset link" }).click();
    await page.getByText("a reset link is on its way").waitFor();
    const message = await waitForMessage(tenant.users.engineer!.email, "Reset your Lotwarden password");
    await page.goto(firstLink(message, "/reset/"));
    await settled(page);
    await page.getByLabel("New password").fill("a-brand-new-password");
    await page.getByRole("button", { name: "Set password and sign in" }).click();
    await page.waitForURL(`${appUrl}/`);
    const post = (password: string) =>
      fetch(`${appUrl}/api/v1/session`, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify({ email: tenant.users.engineer!.email, password }) });
    expect((await post(TEST_PASSWORD)).status).toBe(401);
    expect((await post("a-brand-new-password")).status).toBe(200);
  });

  it("lets a member of two tenants switch between them, seeing each tenant's name", async () => {
    const second = await createTestTenant(pool, "e2e-identity-2");
    await pool.query("insert into memberships (tenant_id, user_id, role) values ($1, $2, 'analyst')", [second.id, tenant.users.analyst!.id]);
    const page = await (await browser.newContext()).newPage();
    await signIn(page, tenant.users.analyst!.email, TEST_PASSWORD);
    const switcher = page.getByLabel("Switch tenant");
    await switcher.waitFor();
    await switcher.selectOption({ label: second.name });
    await expect.poll(async () => (await switcher.inputValue()) === second.id).toBe(true);
    await page.locator("header").getByText(second.name).waitFor();
  });
});
