import { describe, expect, it } from "vitest";
import { mkdtemp, writeFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { renderTrustHtml } from "@floorcast/bench";
import { SAMPLE_FIGURES, sampleTrustReport } from "./report-fixture.js";
import { chromiumAvailable, withOfflinePage } from "./offline-page.js";

const hasChromium = chromiumAvailable();

describe.skipIf(!hasChromium)("trust report page in headless Chromium (Debian chromium via playwright-core)", () => {
  it("opens from file:// with no console errors, every figure drawn and no network request", async () => {
    const { report, figures } = sampleTrustReport();
    const dir = await mkdtemp(join(tmpdir(), "floorcast-report-"));
    const file = join(dir, "report.html");
    await writeFile(file, await renderTrustHtml(report, figures));
    await withOfflinePage(file, async ({ page, errors, requests }) => {
      expect(errors).toEqual([]);
      expect(requests).toEqual([]);
      expect(await page.locator("figure > svg").count()).toBe(SAMPLE_FIGURES);
      expect(await page.locator("figure > figcaption").count()).toBe(SAMPLE_FIGURES);
      for (const box of await page.locator("figure > svg").evaluateAll((els) => els.map((e) => e.getBoundingClientRect().width * e.getBoundingClientRect().height))) {
        expect(box).toBeGreaterThan(10_000); // each figure is drawn at a visible size
      }
      const caution = page.locator(".caution");
      await expect(caution.isVisible()).resolves.toBe(true);
      expect(await caution.innerText()).toMatch(/not a zoning determination.*licensed professionals decide/s);
      expect(await page.title()).toBe("Trust report: gfa (toy)");
    });
  });
});
