import type { CommandContext } from "./command-context.js";

/**
 * Writes a one-line note on stderr when a model file that loaded carries no `checksum` (written before checksums
 * were added, or by hand): it is accepted, but edits to it cannot be detected. Call it after loadSurrogate.
 * @param command - the command's name, starting the line.
 * @param fileName - the model file as the user named it.
 * @param json - the file's JSON text or parsed value.
 * @param ctx - the command's streams.
 */
export function noteUnsealedModel(command: string, fileName: string, json: unknown, ctx: CommandContext): void {
  const value = typeof json === "string" ? (JSON.parse(json) as unknown) : json;
  if (typeof value === "object" && value !== null && !("checksum" in value)) {
    ctx.stderr.write(`${command}: note: ${fileName} has no checksum (written before checksums were added), so edits to it cannot be detected\n`);
  }
}
