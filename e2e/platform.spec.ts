import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser } from "playwright-core";
import { appUrl, launchBrowser, localOnlyContext } from "./browser";

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

describe("the app shell in a real browser", () => {
  it("serves the sign-in page styled with IBM Plex Sans from the app itself, fetching nothing from outside", async () => {
    const { context, external } = await localOnlyContext(browser);
    const page = await context.newPage();
    const fontResponses: string[] = [];
    page.on("response", (r) => {
      if (r.url().includes(".woff2") && r.ok()) fontResponses.push(r.url());
    });
    await page.goto(`${appUrl}/`);
    await expect.poll(() => new URL(page.url()).pathname).toBe("/sign-in");
    await expect.poll(() => page.evaluate(() => document.fonts.check('16px "IBM Plex Sans"'))).toBe(true);
    await page.evaluate(() => document.fonts.ready);
    const family = await page.locator("h1").evaluate((el) => getComputedStyle(el).fontFamily);
    expect(family).toContain("IBM Plex Sans");
    expect(fontResponses.length).toBeGreaterThan(0);
    expect(fontResponses.every((u) => u.startsWith(appUrl))).toBe(true);
    expect(external).toEqual([]);
    await context.close();
  });

  it("answers /api/health with every service up", async () => {
    const response = await fetch(`${appUrl}/api/health`);
    expect(response.status).toBe(200);
    const body = await response.json();
    expect(body.services.database.status).toBe("up");
    expect(body.services.objectStore.status).toBe("up");
    expect(body.services.mailRelay.status).toBe("up");
  });
});
