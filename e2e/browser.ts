// Shared browser set-up for the e2e suite: Debian's Chromium through playwright-core (no browser download).
import { chromium, type Browser, type BrowserContext, type Page } from "playwright-core";

export const appUrl = process.env.LOTWARDEN_TEST_APP_URL ?? "http://127.0.0.1:3100";

export async function launchBrowser(): Promise<Browser> {
  // playwright-core gives every launch a fresh, empty profile directory of its own.
  return chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
    headless: true,
    args: [
      "--no-sandbox",
      "--disable-gpu",
      "--disable-quic",
      "--no-first-run",
      "--disable-background-networking",
      "--disable-component-update",
      "--disable-sync",
    ],
  });
}

/** A context that records every request leaving 127.0.0.1, so tests can prove nothing is fetched from outside. */
export async function localOnlyContext(browser: Browser): Promise<{ context: BrowserContext; external: string[] }> {
  const context = await browser.newContext({ viewport: { width: 1440, height: 900 } });
  const external: string[] = [];
  context.on("request", (request) => {
    const url = new URL(request.url());
    if (!["127.0.0.1", "localhost"].includes(url.hostname) && url.protocol !== "data:" && url.protocol !== "blob:") external.push(request.url());
  });
  return { context, external };
}

/**
 * Waits until the page's scripts have loaded: a form clicked before React hydrates it is submitted natively and
 * its result never shows (seen on a loaded machine).
 */
export async function settled(page: Page): Promise<void> {
  await page.waitForLoadState("networkidle");
}

/** Signs in through the sign-in form, as a person would, and waits for the home page. */
export async function signIn(page: Page, email: string, password: string): Promise<void> {
  await page.goto(`${appUrl}/sign-in`);
  await settled(page);
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill(password);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL(`${appUrl}/`);
}
