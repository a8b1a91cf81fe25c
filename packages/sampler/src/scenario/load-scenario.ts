import { readFile } from "node:fs/promises";
import { basename } from "node:path";
import { parseScenario } from "./parse-scenario.js";
import type { Scenario } from "./scenario.js";

/**
 * Reads and validates a scenario file (datasets/scenarios/*.json; see README "Scenario files").
 * @param path - the file.
 * @returns the scenario; its `sha256` is that of the file's bytes.
 * @throws RangeError naming the file when it cannot be read, is not JSON, or breaks the schema (path and problem named).
 */
export async function loadScenario(path: string): Promise<Scenario> {
  if (typeof path !== "string" || path === "") throw new TypeError("loadScenario: path must be a non-empty string");
  let text: string;
  try {
    text = await readFile(path, "utf8");
  } catch (error) {
    throw new RangeError(`loadScenario: cannot read ${path}: ${(error as NodeJS.ErrnoException).code ?? String(error)}`);
  }
  try {
    return parseScenario(text, basename(path));
  } catch (error) {
    if (error instanceof RangeError) throw new RangeError(error.message.replace(/^parseScenario:/, "loadScenario:"));
    throw error;
  }
}
