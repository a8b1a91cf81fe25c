import { Readable, Writable } from "node:stream";
import { main } from "../../packages/bench/dist/cli/main.js";

/** What one in-process CLI run printed and returned. */
export interface CliOutcome {
  code: number;
  out: string;
  err: string;
}

/**
 * Runs the `floorcast` CLI in-process (main, as bin/floorcast.js does) with captured streams.
 * @param args - arguments after `floorcast`.
 * @param stdin - text fed to the command's stdin (empty by default).
 * @returns the exit status and everything written to stdout and stderr.
 */
export async function runCli(args: string[], stdin = ""): Promise<CliOutcome> {
  let out = "";
  let err = "";
  const sink = (f: (s: string) => void) => new Writable({ write: (c, _e, cb) => (f(String(c)), cb()) });
  const code = await main(["node", "floorcast", ...args], {
    stdin: Readable.from([stdin]),
    stdout: sink((s) => (out += s)),
    stderr: sink((s) => (err += s)),
  });
  return { code, out, err };
}
