import type { InputSchemaEntry } from "./input-schema.js";

/**
 * Checks model rows (one number per schema entry, in order) against an input schema: a categorical input's value
 * must be one of its levels' row values (a number level as itself, a string level as its position), an integer
 * input's value a whole number. Bounds are left to the domain-of-validity check.
 * @param schema - the model's input schema.
 * @param rows - the rows.
 * @param fn - calling function named in messages.
 * @param what - names the rows' source in messages, e.g. the CSV's name.
 * @returns nothing.
 * @throws RangeError naming the column, the row and the value.
 */
export function checkSchemaRows(schema: readonly InputSchemaEntry[], rows: readonly (readonly number[])[], fn: string, what: string): void {
  schema.forEach((e, j) => {
    if (e.kind === "continuous") return;
    const legal = e.kind === "categorical" ? new Set(e.levels.map((l, k) => (typeof l === "number" ? l : k))) : undefined;
    rows.forEach((row, i) => {
      const x = row[j] as number;
      if (e.kind === "categorical" && !legal!.has(x)) {
        throw new RangeError(`${fn}: ${what}: column ${e.name}, row ${i + 1}: ${x} is not one of the levels ${e.levels.join(", ")} the model was trained on`);
      }
      if (e.kind === "integer" && !Number.isInteger(x)) {
        throw new RangeError(`${fn}: ${what}: column ${e.name}, row ${i + 1}: ${x} is not a whole number (the model takes integers)`);
      }
    });
  });
}
