import { spawn, spawnSync, type ChildProcessWithoutNullStreams } from "node:child_process";
import { existsSync } from "node:fs";
import { createInterface } from "node:readline";
import { fileURLToPath } from "node:url";

/** Debian's interpreter, whose python3-sklearn and python3-scipy are the peers. */
export const PEER_PYTHON = "/usr/bin/python3";
/** The peer server script, shipped in the package (python/peer_surrogates.py). */
export const PEER_SCRIPT = fileURLToPath(new URL("../../python/peer_surrogates.py", import.meta.url));

/**
 * A running peer server: scikit-learn's GP and MLP and scipy's LHS behind a JSON-lines pipe
 * (python/peer_surrogates.py of this package run with /usr/bin/python3). Requests are answered in order.
 */
export class PeerProcess {
  private readonly child: ChildProcessWithoutNullStreams;
  private readonly waiting: ((line: string) => void)[] = [];
  private stderr = "";

  private constructor() {
    this.child = spawn(PEER_PYTHON, [PEER_SCRIPT], { stdio: ["pipe", "pipe", "pipe"] });
    this.child.stderr.on("data", (d: Buffer) => {
      this.stderr = (this.stderr + d.toString()).slice(-2000);
    });
    createInterface({ input: this.child.stdout }).on("line", (line) => {
      if (line.startsWith("{")) this.waiting.shift()?.(line);
    });
    this.child.on("exit", () => {
      for (const w of this.waiting.splice(0)) w(JSON.stringify({ error: `peer process ended: ${this.stderr}` }));
    });
  }

  /**
   * Whether the peers can run here: the script is present and /usr/bin/python3 imports sklearn and scipy.
   * @returns true when they can.
   */
  static available(): boolean {
    if (!existsSync(PEER_PYTHON) || !existsSync(PEER_SCRIPT)) return false;
    return spawnSync(PEER_PYTHON, ["-c", "import sklearn, scipy.stats.qmc"], { encoding: "utf8" }).status === 0;
  }

  /** Starts the server, or returns null when the peers are not available. */
  static start(): PeerProcess | null {
    return PeerProcess.available() ? new PeerProcess() : null;
  }

  /**
   * Sends one request and resolves to its reply.
   * @throws Error with the server's message when it replies with an error.
   */
  request<T>(req: Readonly<Record<string, unknown>>): Promise<T> {
    return new Promise<T>((resolve, reject) => {
      this.waiting.push((line) => {
        let reply: { error?: string };
        try {
          reply = JSON.parse(line) as { error?: string };
        } catch {
          reply = { error: `unreadable reply ${line.slice(0, 80)}` };
        }
        if (reply.error !== undefined) reject(new Error(`peer: ${reply.error}`));
        else resolve(reply as T);
      });
      this.child.stdin.write(`${JSON.stringify(req)}\n`);
    });
  }

  /** Ends the server. */
  close(): void {
    this.child.stdin.end();
  }
}
