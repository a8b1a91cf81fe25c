import { readFile } from "node:fs/promises";
import { basename, dirname, resolve } from "node:path";
import { loadScenario, type Scenario } from "@floorcast/sampler";
import type { BenchProblem } from "./bench-problem.js";
import { parseProblem } from "./parse-problem.js";
import { ProblemFileError } from "./problem-file-error.js";

/**
 * Reads a benchmark problem file (datasets/problems/*.json) and the scenario it names (a path
 * relative to the problem file), and builds the problem.
 * @param path - the problem file.
 * @returns the problem; its `file` is the path given.
 * @throws ProblemFileError (a RangeError) naming the file, the path in it and the problem.
 */
export async function loadProblem(path: string): Promise<BenchProblem> {
  if (typeof path !== "string" || path === "") throw new TypeError("loadProblem: path must be a non-empty string");
  const name = basename(path);
  let text: string;
  try {
    text = await readFile(path, "utf8");
  } catch (error) {
    throw new ProblemFileError(name, "", `cannot be read (${(error as NodeJS.ErrnoException).code ?? String(error)})`);
  }
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch (error) {
    throw new ProblemFileError(name, "", `is not JSON: ${(error as Error).message}`);
  }
  let scenario: Scenario | undefined;
  const ref = typeof json === "object" && json !== null ? (json as { scenario?: unknown }).scenario : undefined;
  if (typeof ref === "string" && ref !== "") {
    try {
      scenario = await loadScenario(resolve(dirname(path), ref));
    } catch (error) {
      throw new ProblemFileError(name, "scenario", (error as Error).message);
    }
  }
  const problem = parseProblem(json, name, scenario, { dir: dirname(path) });
  return { ...problem, file: path };
}
