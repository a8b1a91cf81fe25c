import { expect } from "vitest";
import { FLOORCAST_CAUTION } from "@floorcast/sampler";
import { execFileSync } from "node:child_process";
import { readFileSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { fileURLToPath } from "node:url";

/** The workspace's README.md. */
export const README = fileURLToPath(new URL("../../README.md", import.meta.url));

/**
 * The first fenced code block of a language after a heading of the README.
 * @param heading - the heading line's text, e.g. "### Library quick start".
 * @param lang - the fence's language, e.g. "js".
 * @returns the block's text.
 */
export function readmeCodeBlock(heading: string, lang: string): string {
  const text = readFileSync(README, "utf8");
  const at = text.indexOf(`\n${heading}\n`);
  if (at < 0) throw new Error(`README has no heading ${heading}`);
  const open = text.indexOf(`\n\`\`\`${lang}\n`, at);
  const close = text.indexOf("\n```\n", open + 1);
  if (open < 0 || close < 0) throw new Error(`README: no ${lang} block after ${heading}`);
  return text.slice(open + lang.length + 5, close + 1);
}

/** Runs the README's library quick start as `quick-start.mjs` in `dir`; returns its stdout lines. */
export function runQuickStart(dir: string): string[] {
  writeFileSync(join(dir, "quick-start.mjs"), readmeCodeBlock("### Library quick start", "js"));
  const out = execFileSync(process.execPath, ["quick-start.mjs"], { cwd: dir, encoding: "utf8", timeout: 120_000 });
  return out.trim().split("\n");
}

/**
 * Checks the quick start's output. The exact values are derived by hand from the massing rule
 * (README, "Procedure"): lot 12 × 32 = 384 m², yards leave (12 − 3) × (32 − 10.5) = 193.5 m², the
 * coverage cap 0.5 × 384 = 192 m² binds, 11 m holds 3 floors of 3.1 m but the FAR cap 1.2 × 384 =
 * 460.8 m² stops at 2 floors: 384 m². Lot 16 × 32 = 512 m²: the plate is capped at 256 m², 7 m holds
 * 2 floors (512 m² ≤ 614.4 m²): 512 m². The GP (40 maximin designs) must be within 3 of its own
 * predictive sd of them (derived: a 3-sigma band of the GP's Gaussian predictive distribution).
 */
export function checkQuickStartOutput(lines: readonly string[]): void {
  expect(lines).toHaveLength(3);
  const exact = [384, 512];
  lines.slice(0, 2).forEach((line, i) => {
    const m = /gfa ≈ (\d+) ± (\d+) m² \(exact (\d+) m²\)$/.exec(line);
    expect(m, line).not.toBeNull();
    const [mean, sd, ex] = [Number(m![1]), Number(m![2]), Number(m![3])];
    expect(ex).toBe(exact[i]);
    expect(sd).toBeGreaterThan(0);
    expect(Math.abs(mean - ex)).toBeLessThanOrEqual(3 * sd + 1);
  });
  expect(lines[2]).toBe(FLOORCAST_CAUTION); // the one caution constant, printed by the block itself
}
