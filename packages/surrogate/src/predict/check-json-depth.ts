/** The deepest nesting of arrays and objects a model file may have (a conformal ensemble of GPs needs about 12). */
export const MAX_MODEL_FILE_DEPTH = 64;

/**
 * Refuses a JSON value nested deeper than `limit` arrays and objects, walking it without recursion, so that the
 * recursive steps after it (schema checks, nested model files, the canonical JSON of the checksum) can never
 * overflow the call stack on a hostile file.
 * @param fn - the public function named in the message.
 * @param label - what the value is, e.g. "model file".
 * @param value - a parsed JSON value.
 * @param limit - the deepest nesting allowed (default {@link MAX_MODEL_FILE_DEPTH}).
 * @throws RangeError naming `fn`, `label` and the limit.
 */
export function checkJsonDepth(fn: string, label: string, value: unknown, limit = MAX_MODEL_FILE_DEPTH): void {
  const stack: [unknown, number][] = [[value, 1]];
  while (stack.length > 0) {
    const [v, depth] = stack.pop()!;
    if (typeof v !== "object" || v === null) continue;
    if (depth > limit) throw new RangeError(`${fn}: ${label} is nested deeper than ${limit} levels of arrays and objects`);
    for (const child of Array.isArray(v) ? v : Object.values(v)) {
      if (typeof child === "object" && child !== null) stack.push([child, depth + 1]);
    }
  }
}
