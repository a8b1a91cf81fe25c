import { createHash } from "node:crypto";
import { readFile } from "node:fs/promises";
import { createRequire } from "node:module";
import { dirname, resolve } from "node:path";
import type { BenchProblem } from "../problem/bench-problem.js";

const require = createRequire(import.meta.url);

/** The versions of the three floorcast packages (a new version may change any measured number). */
function floorcastVersions(): Record<string, string> {
  const out: Record<string, string> = {};
  for (const name of ["@floorcast/bench", "@floorcast/sampler", "@floorcast/surrogate"]) {
    out[name] = (require(`${name}/package.json`) as { version: string }).version;
  }
  return out;
}

/**
 * What a finished bench problem depends on, as one SHA-256 (FIPS 180-4): the run's options, the problem
 * file's bytes, the bytes of the scenario file it names (a scenario edited in place changes the exact
 * answers), and the versions of the floorcast packages. A saved result is reused only when this matches.
 * @param problem - the loaded problem (its `file` is read again; an in-memory problem is hashed as JSON).
 * @param settings - the run's options as report.json records them.
 * @returns the lower-case hex digest.
 */
export async function benchFingerprint(problem: BenchProblem, settings: Readonly<Record<string, unknown>>): Promise<string> {
  const hash = createHash("sha256");
  hash.update(JSON.stringify({ settings, versions: floorcastVersions() })).update("\n");
  let text: string;
  try {
    text = await readFile(problem.file, "utf8");
  } catch {
    text = JSON.stringify({ name: problem.name, optimization: problem.optimization });
  }
  hash.update(text).update("\n");
  let scenario: unknown;
  try {
    scenario = (JSON.parse(text) as { scenario?: unknown }).scenario;
  } catch {
    scenario = undefined;
  }
  if (typeof scenario === "string") {
    // the same path rule as loadProblem: relative to the problem file's folder
    hash.update(await readFile(resolve(dirname(problem.file), scenario)));
  }
  return hash.digest("hex");
}
