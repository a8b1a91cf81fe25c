import { spawnSync } from "node:child_process";
import { fileURLToPath } from "node:url";
import { existsSync } from "node:fs";

/** The Debian interpreter whose python3-scipy, python3-sklearn and python3-shapely are the references. */
export const PYTHON = "/usr/bin/python3";

/** True when `/usr/bin/python3` can import every named module. */
export function hasPythonModules(modules: readonly string[]): boolean {
  if (!existsSync(PYTHON)) return false;
  const r = spawnSync(PYTHON, ["-c", modules.map((m) => `import ${m}`).join("; ")], {
    encoding: "utf8",
  });
  return r.status === 0;
}

/**
 * Whether reference tests needing `modules` can run. When they cannot, prints a loud warning
 * (so a skip is never silent) and, under FLOORCAST_REQUIRE_REFERENCE=1 (set by .ci/run), throws.
 */
export function referenceAvailable(modules: readonly string[]): boolean {
  const ok = hasPythonModules(modules);
  if (!ok) {
    const msg =
      `\n!!! REFERENCE LIBRARIES MISSING: ${modules.join(", ")} not importable by ${PYTHON}.\n` +
      `!!! Reference checks are SKIPPED. Install: apt-get update && apt-get install -y python3-scipy python3-sklearn python3-shapely python3-pyproj\n`;
    if (process.env.FLOORCAST_REQUIRE_REFERENCE === "1") throw new Error(msg);
    console.warn(msg);
  }
  return ok;
}

/**
 * Runs a script in tests/reference with JSON on stdin and returns its JSON stdout.
 * @param script - file name inside tests/reference.
 * @param input - any JSON-serialisable value.
 */
export function runReference<T>(script: string, input: unknown, timeoutMs = 300_000): T {
  const path = fileURLToPath(new URL(`./${script}`, import.meta.url));
  const r = spawnSync(PYTHON, [path], {
    input: JSON.stringify(input),
    encoding: "utf8",
    maxBuffer: 512 * 1024 * 1024,
    timeout: timeoutMs,
  });
  if (r.status !== 0) {
    throw new Error(`reference script ${script} failed (${r.status}): ${r.stderr}`);
  }
  return JSON.parse(r.stdout) as T;
}
