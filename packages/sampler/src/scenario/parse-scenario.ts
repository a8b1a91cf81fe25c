import { createHash } from "node:crypto";
import { scenarioSchema } from "./scenario-schema.js";
import type { Scenario } from "./scenario.js";

function formatPath(path: readonly PropertyKey[]): string {
  let out = "";
  for (const key of path) {
    if (typeof key === "number") out += `[${key}]`;
    else out += out === "" ? String(key) : `.${String(key)}`;
  }
  return out === "" ? "(top level)" : out;
}

/**
 * Parses and validates a scenario (zod schema, format version 1; see README "Scenario files").
 * @param json - the file's text, or an already-parsed value (then hashed as its `JSON.stringify` text).
 * @param fileName - names the file in error messages and in the result.
 * @returns the scenario, with `fileName` and the SHA-256 (FIPS 180-4) of the text.
 * @throws RangeError `parseScenario: <file>: <path>: <problem>` (every problem, separated by "; ");
 *   TypeError when fileName is not a string.
 */
export function parseScenario(json: unknown, fileName: string): Scenario {
  if (typeof fileName !== "string") throw new TypeError("parseScenario: fileName must be a string");
  let value: unknown = json;
  const textOf = typeof json === "string" ? json : JSON.stringify(json);
  if (typeof json === "string") {
    try {
      value = JSON.parse(json.replace(/^\ufeff/, ""));
    } catch (error) {
      throw new RangeError(`parseScenario: ${fileName}: not valid JSON: ${(error as Error).message}`);
    }
  }
  const result = scenarioSchema.safeParse(value);
  if (!result.success) {
    const problems = result.error.issues.map((i) => `${formatPath(i.path)}: ${i.message}`);
    throw new RangeError(`parseScenario: ${fileName}: ${problems.join("; ")}`);
  }
  const sha256 = createHash("sha256").update(textOf ?? "", "utf8").digest("hex");
  return { ...result.data, fileName, sha256 };
}
