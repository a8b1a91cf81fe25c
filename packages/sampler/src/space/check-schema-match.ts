import type { InputSchemaEntry } from "./input-schema.js";
import type { Variable } from "./variable.js";

/**
 * Checks that variables (a problem's, or the columns of a CSV about to be predicted) can be fed to a model
 * trained on `schema`: every schema input is present by name (another order is fine), a categorical stays
 * categorical with only the model's levels, a numeric variable does not become categorical, and numeric bounds
 * lie within the model's (a wider range would ask the model to extrapolate). A numeric categorical variable may
 * meet a numeric model input: its levels are model-row values and must lie within the input's bounds.
 * @param schema - the model's input schema.
 * @param variables - the variables to check.
 * @param fn - calling function named in messages.
 * @param what - names the model in messages, e.g. the model file's name.
 * @returns nothing.
 * @throws RangeError naming the first column that does not match.
 */
export function checkSchemaMatch(schema: readonly InputSchemaEntry[], variables: readonly Variable[], fn: string, what: string): void {
  const byName = new Map(variables.map((v) => [v.name, v]));
  for (const e of schema) {
    const v = byName.get(e.name);
    const fail = (problem: string): never => {
      throw new RangeError(`${fn}: column ${e.name}: ${problem}`);
    };
    if (v === undefined) fail(`${what} needs it as an input, but it is missing`);
    const variable = v as Variable;
    if (e.kind === "categorical") {
      if (variable.kind !== "categorical") fail(`${what} takes it as categorical (levels ${e.levels.join(", ")}), not ${variable.kind}`);
      const levels = variable.kind === "categorical" ? variable.levels : [];
      const unknown = levels.find((l) => !e.levels.includes(l));
      if (unknown !== undefined) fail(`level ${JSON.stringify(unknown)} is not one of the levels ${e.levels.join(", ")} ${what} was trained on`);
      continue;
    }
    let lo: number;
    let hi: number;
    if (variable.kind === "categorical") {
      const text = variable.levels.find((l) => typeof l !== "number");
      if (text !== undefined) fail(`level ${JSON.stringify(text)} is not a number, and ${what} takes ${e.kind} values`);
      lo = Math.min(...(variable.levels as number[]));
      hi = Math.max(...(variable.levels as number[]));
    } else {
      lo = variable.min;
      hi = variable.max;
    }
    if (lo < e.min || hi > e.max) fail(`range [${lo}, ${hi}] is outside [${e.min}, ${e.max}], the range ${what} was trained on`);
  }
  const extra = variables.find((v) => !schema.some((e) => e.name === v.name));
  if (extra !== undefined) throw new RangeError(`${fn}: column ${extra.name}: ${what} has no such input (inputs: ${schema.map((e) => e.name).join(", ")})`);
}
