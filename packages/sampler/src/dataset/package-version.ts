import { readFileSync } from "node:fs";

/** The version of @floorcast/sampler (from its package.json), recorded in manifests. */
export const PACKAGE_VERSION: string = (
  JSON.parse(readFileSync(new URL("../../package.json", import.meta.url), "utf8")) as { version: string }
).version;
