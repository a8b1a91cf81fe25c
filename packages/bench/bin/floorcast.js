#!/usr/bin/env node
import { main } from "../dist/cli/main.js";

// A reader that stops early (`floorcast massing … | head -1`) closes the pipe: end quietly, as other filters do.
process.stdout.on("error", (error) => {
  if (error && error.code === "EPIPE") process.exit(process.exitCode ?? 0);
  throw error;
});

main(process.argv).then(
  (code) => {
    process.exitCode = code;
  },
  (error) => {
    process.stderr.write(`floorcast: ${error instanceof Error ? error.message : String(error)}\n`);
    process.exitCode = 1;
  },
);
