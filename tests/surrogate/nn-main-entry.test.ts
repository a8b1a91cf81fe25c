import { describe, expect, it } from "vitest";
import { readFileSync } from "node:fs";
import { dirname, resolve } from "node:path";
import { fileURLToPath } from "node:url";

const dist = fileURLToPath(new URL("../../packages/surrogate/dist/", import.meta.url));
const specifier = /(?:import|export)\s[^;]*?from\s*["']([^"']+)["']|import\s*["']([^"']+)["']|import\s*\(\s*["']([^"']+)["']/g;

/** Every module reachable from `entry` by static or dynamic imports: local files and package names. */
function importGraph(entry: string): { files: Set<string>; packages: Set<string> } {
  const files = new Set<string>();
  const packages = new Set<string>();
  const todo = [entry];
  while (todo.length) {
    const f = todo.pop()!;
    if (files.has(f)) continue;
    files.add(f);
    for (const m of readFileSync(f, "utf8").matchAll(specifier)) {
      const spec = m[1] ?? m[2] ?? m[3]!;
      if (spec.startsWith(".")) todo.push(resolve(dirname(f), spec));
      else packages.add(spec);
    }
  }
  return { files, packages };
}

describe("entry points and tfjs", () => {
  it("the main entry (loadSurrogate, ensembles, conformal) never reaches tfjs", () => {
    const g = importGraph(`${dist}index.js`);
    expect(g.files.size).toBeGreaterThan(20);
    expect([...g.files].some((f) => f.includes("/nn/"))).toBe(false);
    expect([...g.packages].filter((p) => p.startsWith("@tensorflow"))).toEqual([]);
  });
  it("the nn entry does load tfjs and its WebAssembly backend", () => {
    const g = importGraph(`${dist}nn/index.js`);
    expect(g.packages).toContain("@tensorflow/tfjs");
    expect(g.packages).toContain("@tensorflow/tfjs-backend-wasm");
  });
});
