import { Writable } from "node:stream";
import { main } from "@floorcast/bench";

/**
 * Runs the `floorcast` CLI in-process with captured streams.
 * @param args - arguments after `floorcast`.
 * @returns the exit status and everything written to stdout and stderr.
 */
export async function runCli(args: string[]): Promise<{ code: number; out: string; err: string }> {
  let out = "";
  let err = "";
  const sink = (f: (s: string) => void) => new Writable({ write: (c, _e, cb) => (f(String(c)), cb()) });
  const code = await main(["node", "floorcast", ...args], { stdout: sink((s) => (out += s)), stderr: sink((s) => (err += s)) });
  return { code, out, err };
}
