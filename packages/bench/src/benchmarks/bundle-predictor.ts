/**
 * Bundles the dependency-free predictor (`@floorcast/surrogate/predict`, as installed in a project)
 * for a browser with vite: one minified script that sets `globalThis.floorcastPredict(modelJson, rows)`.
 * Used by the install test (the bundle runs in headless Chromium) and the predictor-footprint benchmark.
 */
import { writeFileSync } from "node:fs";
import { join } from "node:path";
import { build } from "vite";

/**
 * Bundles the predictor installed in `project` (its node_modules/@floorcast/surrogate).
 * @param project - a folder where `@floorcast/surrogate` is installed.
 * @returns the minified IIFE script.
 */
export async function bundlePredictor(project: string): Promise<string> {
  const entry = join(project, "predictor-entry.js");
  writeFileSync(
    entry,
    'import { loadPredictor } from "@floorcast/surrogate/predict";\n' +
      "globalThis.floorcastPredict = (json, rows) => loadPredictor(json).predict(rows);\n",
  );
  const result = await build({
    root: project,
    configFile: false,
    logLevel: "silent",
    build: {
      write: false,
      minify: true,
      lib: { entry, formats: ["iife"], name: "floorcastPredictor", fileName: () => "predictor.js" },
    },
  });
  const outputs = (Array.isArray(result) ? result : [result]) as { output: { type: string; code?: string }[] }[];
  const chunk = outputs.flatMap((o) => o.output).find((o) => o.type === "chunk");
  if (chunk?.code === undefined) throw new Error("bundlePredictor: vite produced no script");
  return chunk.code;
}
