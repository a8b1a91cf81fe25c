import { readFileSync } from "node:fs";

/** The version of @floorcast/bench (from its package.json), which `floorcast --version` prints. */
export const CLI_VERSION: string = (
  JSON.parse(readFileSync(new URL("../../package.json", import.meta.url), "utf8")) as { version: string }
).version;
