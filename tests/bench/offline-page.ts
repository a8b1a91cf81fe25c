import { existsSync } from "node:fs";
import { pathToFileURL } from "node:url";
import { chromium, type Page } from "playwright-core";

/** Debian's chromium, driven by playwright-core (installed by .ci/run). */
export const CHROMIUM = "/usr/bin/chromium";

/**
 * Whether the headless-browser checks can run. When Debian's chromium is absent, prints a loud
 * warning (a skip is never silent) and, under FLOORCAST_REQUIRE_REFERENCE=1 (set by .ci/run), throws.
 */
export function chromiumAvailable(): boolean {
  const ok = existsSync(CHROMIUM);
  if (!ok) {
    const msg = `\n!!! ${CHROMIUM} MISSING: the headless-browser checks of the HTML reports are SKIPPED. Install: apt-get install -y chromium\n`;
    if (process.env.FLOORCAST_REQUIRE_REFERENCE === "1") throw new Error(msg);
    console.warn(msg);
  }
  return ok;
}

/** A page opened offline, with every console error and every request other than the page itself. */
export interface OfflinePage {
  readonly page: Page;
  readonly errors: readonly string[];
  readonly requests: readonly string[];
}

/**
 * Opens an HTML file from file:// in headless Chromium, records console errors and page errors, and
 * records and fails any request other than the page itself (the page must load nothing), then runs
 * `check` and closes the browser.
 * @param file - path of the HTML file.
 * @param check - assertions on the opened page.
 */
export async function withOfflinePage(file: string, check: (p: OfflinePage) => Promise<void>): Promise<void> {
  const browser = await chromium.launch({
    executablePath: CHROMIUM,
    args: ["--headless", "--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run", "--disable-background-networking", "--disable-component-update", "--disable-sync"],
  });
  try {
    const page = await browser.newPage();
    const errors: string[] = [];
    const requests: string[] = [];
    page.on("console", (m) => {
      if (m.type() === "error") errors.push(m.text());
    });
    page.on("pageerror", (e) => errors.push(String(e)));
    const url = pathToFileURL(file).href;
    await page.route("**/*", (route) => {
      if (route.request().url() === url) return route.continue();
      requests.push(route.request().url());
      return route.abort();
    });
    await page.goto(url, { waitUntil: "load" });
    await check({ page, errors, requests });
  } finally {
    await browser.close();
  }
}
