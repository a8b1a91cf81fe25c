// The bench report's hard cases, checked where a reader sees them: the terminal headline's width and
// number format, and the HTML page in headless Chromium, by screenshots of its figures (pixels counted
// in the page's own canvas) and by the drawn axes.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import type { Page } from "playwright-core";
import { FLOORCAST_CAUTION, renderBenchHtml, type ParcelRankingReport } from "@floorcast/bench";
import { headlineTable } from "../../packages/bench/src/harness/headline-table.js";
import { formatTextTable } from "../../packages/bench/src/harness/format-text-table.js";
import { hardCaseReport, SERIES } from "./bench-report-fixture.js";
import { chromiumAvailable, withOfflinePage } from "./offline-page.js";

const hasChromium = chromiumAvailable();

describe("headline table", () => {
  const h = headlineTable(hardCaseReport());
  it("fits 100 columns with the longest names of a demo with peers", () => {
    const text = formatTextTable(h);
    for (const line of text.split("\n")) expect(line.length, line).toBeLessThanOrEqual(100);
    expect(text).toMatch(/sklearn-mlp/);
    expect(text).toMatch(/gp\+scipy-lhs/);
  });
  it("says which training size it shows, gives units, and follows one precision rule", () => {
    // every row at n = 80: said once, in the caption
    expect(h.caption).toMatch(/largest training size \(n = 80\)/);
    expect(h.header).toEqual(["problem", "model", "gap", "worst", "refined", "R²", "evals", "exact (evals)", "rho"]);
    const single = h.rows.find((r) => r[0] === "larkspur-fit-gfa")!;
    expect(single[7]).toMatch(/^\d+ m² \(5115\)$/);
    // 3 significant digits with trailing zeros kept: R² 0.63 is "0.630"; a zero gap "0.00%"
    expect(single[5]).toBe("0.630");
    expect(single[2]).toBe("0.00%");
    const threeDigits = (c: string): boolean => {
      if (c === "—" || c === "0.00" || c === "0.00%") return true;
      const digits = c.replace(/%$/, "").replace(".", "").replace(/^0+/, "");
      return /^\d+$/.test(digits) && (digits.length === 3 || (!c.includes(".") && digits.length >= 3) || c.replace(/%$/, "") === "0.00");
    };
    for (const r of h.rows) for (const c of [r[2]!, r[3]!, r[4]!, r[5]!]) expect(threeDigits(c), c).toBe(true);
  });
  it("names the two-objective gap a hypervolume gap and shows the exact front's hypervolume", () => {
    const two = h.rows.find((r) => r[0]!.startsWith("ferrow-gfa-open-space"))!;
    expect(two[0]).toBe("ferrow-gfa-open-space (HV)");
    expect(two[4]).toBe("—");
    expect(two[7]).toBe("HV 1900000");
    expect(h.notes.join(" ")).toMatch(/\(HV\): two objectives; gap is the hypervolume gap/);
  });
});

/** Counts the pixels of a PNG (its left `leftShare` of the width) within `tolerance` (per channel) of each colour, decoded by the page's canvas. */
async function countColours(page: Page, png: Buffer, colours: readonly string[], tolerance = 24, leftShare = 1): Promise<number[]> {
  return page.evaluate(
    async ({ b64, colours, tolerance, leftShare }) => {
      const img = new Image();
      img.src = `data:image/png;base64,${b64}`;
      await img.decode();
      const canvas = document.createElement("canvas");
      canvas.width = img.width;
      canvas.height = img.height;
      const g = canvas.getContext("2d")!;
      g.drawImage(img, 0, 0);
      const data = g.getImageData(0, 0, Math.max(1, Math.floor(img.width * leftShare)), img.height).data;
      const rgb = colours.map((c) => [1, 3, 5].map((i) => parseInt(c.slice(i, i + 2), 16)));
      const counts = colours.map(() => 0);
      for (let p = 0; p < data.length; p += 4) {
        rgb.forEach(([r, gr, b], k) => {
          if (Math.abs(data[p]! - r!) <= tolerance && Math.abs(data[p + 1]! - gr!) <= tolerance && Math.abs(data[p + 2]! - b!) <= tolerance) counts[k]!++;
        });
      }
      return counts;
    },
    { b64: png.toString("base64"), colours, tolerance, leftShare },
  );
}

describe.skipIf(!hasChromium)("bench report page in headless Chromium: the hard cases", () => {
  let dir = "";
  let file = "";
  beforeAll(async () => {
    dir = mkdtempSync(join(tmpdir(), "floorcast-report-shots-"));
    file = join(dir, "report.html");
    writeFileSync(file, await renderBenchHtml(hardCaseReport()));
  });
  afterAll(() => rmSync(dir, { recursive: true, force: true }));

  it("an all-zero gap figure shows every series and a readable axis", async () => {
    await withOfflinePage(file, async ({ page, errors }) => {
      expect(errors).toEqual([]);
      const figure = page.locator("figure").nth(0);
      expect(await figure.locator("figcaption").innerText()).toMatch(/diamonds mark the medians/);
      // Vega-Lite's default categorical colours (scheme tableau10) of the five series, in legend order
      const legend = await figure.locator("svg .role-legend-label text").allTextContents();
      expect(legend).toHaveLength(SERIES.length);
      const counts = await countColours(page, await figure.locator("svg").screenshot(), ["#4c78a8", "#f58518", "#e45756", "#72b7b2", "#54a24b"], 12);
      for (const [k, c] of counts.entries()) expect(c, `series ${legend[k]}`).toBeGreaterThan(40);
      const ticks = (await figure.locator("svg .role-axis-label text").allTextContents()).filter((t) => t.endsWith("%"));
      expect(ticks.length).toBeGreaterThanOrEqual(3);
      expect(ticks).toContain("0.0%");
      expect(await figure.locator("svg").innerHTML()).not.toMatch(/0\.000000/);
    });
  });

  it("the ground-floor outline shows in plan where the top floor covers it; the two sections share their height scale", async () => {
    await withOfflinePage(file, async ({ page }) => {
      // the plan is the left half of the exact optimum's drawing (the section, right, has blue edges too)
      const shot = await page.locator("figure").nth(1).locator("svg").screenshot();
      // ground floor #2b6cb0; top floor #dd6b20 at opacity 0.6 over white: #eba679 (derived)
      const [ground, top] = await countColours(page, shot, ["#2b6cb0", "#eba679"], 40, 0.5);
      expect(ground).toBeGreaterThan(100);
      expect(top).toBeGreaterThan(100);
      const heightAxis = (n: number) => page.locator("figure").nth(n).locator("svg [aria-label^=\"Y-axis titled 'height (m)'\"]").getAttribute("aria-label");
      const [a, b] = [await heightAxis(1), await heightAxis(2)];
      expect(a).toMatch(/values from 0 to/);
      expect(a).toBe(b);
    });
  });

  it("designs read without float noise; the two-objective problem shows no refined gap", async () => {
    await withOfflinePage(file, async ({ page }) => {
      const text = await page.locator("body").innerText();
      expect(text).not.toMatch(/42\.900000000000006/);
      expect(text).toMatch(/"maxHeight":42\.9\b/);
      const rows = await page.locator("table").nth(2).locator("tr").allInnerTexts();
      const body = rows.slice(1);
      expect(body.length).toBeGreaterThan(0);
      for (const r of body) expect(r.split("\t")[6]).toBe("—"); // median refined
    });
  });
});

/** Three parcels, exact route only: the most (3000 m²), the least (1000 m²) and one without a feasible design. */
function parcelReport(): ParcelRankingReport {
  const parcel = (id: string, value: number | null, rank: number) => ({
    index: rank - 1,
    id,
    zoneValue: value === null ? null : value * 0.8,
    exact: { value, design: null, outputs: null, evaluations: 10, rank },
    surrogate: null,
  });
  return {
    file: "three-parcels.geojson",
    outlines: [
      [[0, 0], [20, 0], [20, 30], [0, 30]],
      [[25, 0], [45, 0], [45, 30], [25, 30]],
      [[50, 0], [70, 0], [70, 15], [60, 15], [60, 30], [50, 30]],
    ],
    ranking: {
      kind: "floorcast.parcel-ranking",
      formatVersion: 1,
      caution: FLOORCAST_CAUTION,
      objective: { output: "gfa", sense: "max" },
      optimizer: "pso",
      seed: 1,
      budget: 10,
      shortlist: 1,
      parcels: [parcel("low", 1000, 2), parcel("high", 3000, 1), parcel("none", null, 3)],
      evaluations: { zone: 3, exact: 30, surrogate: null },
      surrogate: null,
      agreement: null,
    },
  };
}

describe.skipIf(!hasChromium)("bench report page in headless Chromium: the plan of parcels coloured by capacity", () => {
  let dir = "";
  let file = "";
  beforeAll(async () => {
    dir = mkdtempSync(join(tmpdir(), "floorcast-parcel-plan-"));
    file = join(dir, "report.html");
    writeFileSync(file, await renderBenchHtml({ ...hardCaseReport(), parcels: parcelReport() }));
  });
  afterAll(() => rmSync(dir, { recursive: true, force: true }));

  it("draws each parcel in its colour: the most capacity at the top of the ramp, the least at the bottom, none grey", async () => {
    await withOfflinePage(file, async ({ page, errors, requests }) => {
      expect(errors).toEqual([]);
      expect(requests).toEqual([]);
      const plan = page.locator("svg.parcel-capacity-plan");
      expect(await plan.locator("polygon").count()).toBe(3);
      expect(await plan.locator("title").allTextContents()).toEqual(["low: rank 2, best gfa 1000", "high: rank 1, best gfa 3000", "none: rank 3, best gfa —"]);
      // viridis ends (matplotlib): #fde725 at the top, #440154 at the bottom; grey #bbbbbb without a value. A 20 × 30 m
      // lot spans about 160 × 240 px at this plan's scale (600 px for 70 m, derived); the colour bar adds a few hundred
      // pixels of each end colour, so each count must exceed 10,000 only where a parcel is filled
      const [top, bottom, grey] = await countColours(page, await plan.screenshot(), ["#fde725", "#440154", "#bbbbbb"], 6);
      expect(top).toBeGreaterThan(10_000);
      expect(bottom).toBeGreaterThan(10_000);
      expect(grey).toBeGreaterThan(10_000);
      const text = await plan.locator("text").allTextContents();
      expect(text).toEqual(expect.arrayContaining(["low · 2", "high · 1", "none · 3", "1000", "3000", "best gfa"]));
      const caption = await page.locator("figure", { has: plan }).locator("figcaption").innerText();
      expect(caption).toMatch(/coloured by its best gfa from the exact route/);
      expect(caption).toMatch(/not a zoning determination/);
    });
  });
});
