/**
 * The canonical JSON text of a model file's value, the text its checksum is taken over: object keys in
 * ascending code-unit order, no whitespace, strings and numbers as JSON.stringify writes them (numbers in
 * ECMAScript's shortest round-trip form), properties whose value is undefined left out (as JSON.stringify
 * does). Only JSON values are accepted: a "__proto__" key (a prototype-pollution attempt), a non-finite number
 * or a value JSON cannot hold is refused.
 * @param value - a parsed JSON value.
 * @param fn - calling function named in messages.
 * @param skipTopKey - a top-level key left out (the checksum field itself).
 * @returns the canonical text.
 * @throws RangeError naming the path of the offending key or value.
 */
export function canonicalJson(value: unknown, fn: string, skipTopKey?: string): string {
  const parts: string[] = [];
  write(value, "(root)", fn, parts, skipTopKey);
  return parts.join("");
}

function write(v: unknown, path: string, fn: string, out: string[], skip?: string): void {
  if (v === null || typeof v === "boolean" || typeof v === "string") {
    out.push(JSON.stringify(v));
    return;
  }
  if (typeof v === "number") {
    if (!Number.isFinite(v)) throw new RangeError(`${fn}: ${path} must be a finite number, got ${String(v)}`);
    out.push(JSON.stringify(v));
    return;
  }
  if (Array.isArray(v)) {
    out.push("[");
    for (let i = 0; i < v.length; i++) {
      if (i > 0) out.push(",");
      write(v[i], `${path}[${i}]`, fn, out);
    }
    out.push("]");
    return;
  }
  if (typeof v === "object") {
    const keys = Object.keys(v).sort();
    out.push("{");
    let first = true;
    for (const key of keys) {
      if (key === "__proto__") throw new RangeError(`${fn}: ${path} has a "__proto__" key, which a model file may not contain`);
      if (key === skip) continue;
      const child = (v as Record<string, unknown>)[key];
      if (child === undefined) continue;
      if (!first) out.push(",");
      first = false;
      out.push(JSON.stringify(key), ":");
      write(child, path === "(root)" ? key : `${path}.${key}`, fn, out);
    }
    out.push("}");
    return;
  }
  throw new RangeError(`${fn}: ${path} is a ${typeof v}, which JSON cannot hold`);
}
