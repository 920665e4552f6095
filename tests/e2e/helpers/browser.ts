// Browser-test harness: playwright-core driving the system Chromium (no browser download), one
// browser per test file, a fresh browser context (own cookies) per page, and a screenshot of every
// open page into .data/e2e-shots when a test fails.
//
//   const browser = setUpBrowser();            // at the top of a test file: registers the hooks
//   const page = await browser.newPage();    // inside a test; page.goto("/kits") is relative to the app
import { mkdirSync } from "node:fs";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { chromium, type Browser, type BrowserContext, type Page } from "playwright-core";
import { afterAll, afterEach } from "vitest";
import { chromiumLaunchOptions } from "../../../scripts/lib/chromium";

export const baseUrl = process.env.E2E_BASE_URL ?? "http://127.0.0.1:3100";

/** A made-up client address (TEST-NET-2 range), as a proxy in front of the app would forward it. */
export function randomClientIp(): string {
  const b = () => Math.floor(Math.random() * 254) + 1;
  return `198.18.${b()}.${b()}`;
}

const shotsDir = fileURLToPath(new URL("../../../.data/e2e-shots", import.meta.url));

export interface BrowserHarness {
  /** A page in a new, isolated context whose relative URLs resolve against the app. */
  newPage(viewport?: { width: number; height: number }): Promise<Page>;
}

export function setUpBrowser(): BrowserHarness {
  let browser: Browser | undefined;
  let contexts: BrowserContext[] = [];

  afterEach(async (context) => {
    if (context.task.result?.state === "fail") {
      mkdirSync(shotsDir, { recursive: true });
      const name = `${context.task.file?.name ?? "test"}-${context.task.name}`.replace(/[^\w.-]+/g, "_");
      let n = 0;
      for (const page of contexts.flatMap((c) => c.pages())) {
        const path = join(shotsDir, `${name}-${++n}.png`);
        await page.screenshot({ path, fullPage: true }).catch(() => undefined);
        console.error(`screenshot of the failed test: ${path} (at ${page.url()})`);
      }
    }
    await Promise.all(contexts.map((c) => c.close().catch(() => undefined)));
    contexts = [];
  });

  afterAll(async () => {
    await browser?.close();
    browser = undefined;
  });

  return {
    async newPage(viewport) {
      browser ??= await chromium.launch(chromiumLaunchOptions);
      // A client address of its own per page (the test app trusts one proxy hop), so the auth rate limits
      // count each page apart, as they would count different people.
      const context = await browser.newContext({ baseURL: baseUrl, extraHTTPHeaders: { "x-forwarded-for": randomClientIp() }, ...(viewport ? { viewport } : {}) });
      contexts.push(context);
      return context.newPage();
    },
  };
}
