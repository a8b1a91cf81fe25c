import { readdir } from "node:fs/promises";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import type { BenchProblem } from "./bench-problem.js";
import { loadProblem } from "./load-problem.js";

/**
 * The problems directory shipped with floorcast: dist/demo/problems inside the installed package
 * (a copy of the workspace's datasets/problems made by the build, with datasets/scenarios beside it).
 */
export const DEFAULT_PROBLEMS_DIR = fileURLToPath(new URL("../demo/problems/", import.meta.url));

/**
 * Loads every problem file (*.json) of a directory that belongs to a suite, sorted by name.
 * @param suite - suite name, e.g. "demo" or "standard".
 * @param dir - the directory (default {@link DEFAULT_PROBLEMS_DIR}).
 * @returns the suite's problems; a RangeError when none belongs to it.
 */
export async function loadSuite(suite: string, dir: string = DEFAULT_PROBLEMS_DIR): Promise<BenchProblem[]> {
  let files: string[];
  try {
    files = (await readdir(dir)).filter((f) => f.endsWith(".json")).sort();
  } catch (error) {
    throw new RangeError(`loadSuite: cannot read the problems directory ${dir} (${(error as NodeJS.ErrnoException).code ?? String(error)})`);
  }
  const problems = await Promise.all(files.map((f) => loadProblem(join(dir, f))));
  const members = problems.filter((p) => p.suites.includes(suite)).sort((a, b) => a.name.localeCompare(b.name));
  if (members.length === 0) {
    const known = [...new Set(problems.flatMap((p) => p.suites))].sort();
    throw new RangeError(`loadSuite: no problem in ${dir} belongs to suite "${suite}"; suites: ${known.join(", ")}`);
  }
  return members;
}
