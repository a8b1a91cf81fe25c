import type { InputSchemaEntry } from "@floorcast/sampler";
import type { CommandContext } from "./command-context.js";

/**
 * The input schema a loaded model file records (kind, bounds, scale and levels per input), or undefined when it
 * records none (written before input schemas were added, or fitted on a CSV without a manifest): such a file is
 * accepted and its inputs are checked by name only; with `ctx`, a one-line note on stderr says so. Call it after
 * loadSurrogate.
 * @param command - the command's name, starting the note.
 * @param fileName - the model file as the user named it.
 * @param json - the file's JSON text or parsed value.
 * @param ctx - the command's streams, for the note (none without it).
 * @returns the schema, in the order of the file's inputs.
 */
export function modelInputSchema(command: string, fileName: string, json: unknown, ctx?: CommandContext): readonly InputSchemaEntry[] | undefined {
  const value = (typeof json === "string" ? JSON.parse(json) : json) as { inputSchema?: InputSchemaEntry[] };
  if (value.inputSchema === undefined && ctx !== undefined) {
    ctx.stderr.write(`${command}: note: ${fileName} records no input schema (an older model file, or fitted without a manifest), so input kinds and levels are checked by name only\n`);
  }
  return value.inputSchema;
}
