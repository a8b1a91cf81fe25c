import { MODEL_FILE_KIND, MODEL_FORMAT_VERSION } from "./model-file-version.js";
import type { ModelFile } from "./model-file-schema.js";
import { modelFileSchema } from "./model-file-schema.js";
import { checkJsonDepth } from "../predict/check-json-depth.js";

/**
 * Validates a model file: kind, then format version (a newer one is refused with an upgrade message), then the
 * full zod schema of its model type, then the shared length checks (inputScaling per input, outputScaling per target,
 * inputSchema naming the inputs in order).
 * @param json - parsed JSON value, or JSON text.
 * @param fileName - named in messages (default "model file").
 * @param fn - calling function named in messages.
 * @returns the typed model file.
 * @throws TypeError when it is not an object, RangeError naming file, path and problem otherwise.
 */
export function parseModelFile(json: unknown, fileName = "model file", fn = "parseModelFile"): ModelFile {
  let value = json;
  if (typeof value === "string") {
    try {
      value = JSON.parse(value) as unknown;
    } catch (error) {
      throw new RangeError(`${fn}: ${fileName}: not valid JSON (${(error as Error).message})`);
    }
  }
  if (typeof value !== "object" || value === null || Array.isArray(value)) {
    throw new TypeError(`${fn}: ${fileName}: a model file must be a JSON object`);
  }
  checkJsonDepth(fn, fileName, value);
  const rec = value as Record<string, unknown>;
  if (rec.kind !== MODEL_FILE_KIND) {
    throw new RangeError(`${fn}: ${fileName}: kind must be "${MODEL_FILE_KIND}", got ${JSON.stringify(rec.kind)}`);
  }
  const version = rec.formatVersion;
  if (typeof version === "number" && Number.isInteger(version) && version > MODEL_FORMAT_VERSION) {
    throw new RangeError(
      `${fn}: ${fileName}: formatVersion ${version} was written by a newer floorcast; this version reads up to ${MODEL_FORMAT_VERSION}. Upgrade floorcast to load it`,
    );
  }
  if (version !== MODEL_FORMAT_VERSION) {
    throw new RangeError(`${fn}: ${fileName}: formatVersion must be ${MODEL_FORMAT_VERSION}, got ${JSON.stringify(version)}`);
  }
  const parsed = modelFileSchema.safeParse(value);
  if (!parsed.success) {
    const problems = parsed.error.issues
      .slice(0, 3)
      .map((i) => `${i.path.length ? i.path.join(".") : "(root)"}: ${i.message}`)
      .join("; ");
    throw new RangeError(`${fn}: ${fileName}: ${problems}`);
  }
  const file = parsed.data;
  const d = file.inputs.length;
  const t = file.targets.length;
  const lengthChecks: [string, number, number][] = [
    ["inputScaling.lower", file.inputScaling.lower.length, d],
    ["inputScaling.upper", file.inputScaling.upper.length, d],
    ["outputScaling.mean", file.outputScaling.mean.length, t],
    ["outputScaling.std", file.outputScaling.std.length, t],
  ];
  for (const [path, got, want] of lengthChecks) {
    if (got !== want) throw new RangeError(`${fn}: ${fileName}: ${path} must have ${want} entries, got ${got}`);
  }
  const schemaNames = file.inputSchema?.map((e) => e.name);
  if (schemaNames !== undefined && schemaNames.join("\u0000") !== file.inputs.join("\u0000")) {
    throw new RangeError(`${fn}: ${fileName}: inputSchema must name the inputs ${file.inputs.join(", ")} in order, got ${schemaNames.join(", ")}`);
  }
  return file;
}
