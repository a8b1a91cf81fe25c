import type { InputSchemaEntry } from "./input-schema.js";

/**
 * The levels of an input schema's categorical inputs, name → levels, as `readTable`'s `levels` option takes them,
 * so a CSV whose categorical cells are string levels reads into model rows (a string level as its position).
 * @param schema - an input schema (from a dataset manifest or a model file), or undefined.
 * @returns the levels by input name (empty without a schema or categorical inputs).
 */
export function schemaLevels(schema: readonly InputSchemaEntry[] | undefined): Record<string, readonly (string | number)[]> {
  const levels: Record<string, readonly (string | number)[]> = {};
  for (const e of schema ?? []) if (e.kind === "categorical") levels[e.name] = e.levels;
  return levels;
}
