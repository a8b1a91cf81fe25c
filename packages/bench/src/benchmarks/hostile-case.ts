import { spawn } from "node:child_process";
import { createHash } from "node:crypto";
import { existsSync, readFileSync, statSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { loadScenario, writeDataset } from "@floorcast/sampler";
import { HARMLESS_MODES, HOSTILE_MODES, HOSTILE_PROGRAM } from "./hostile-evaluator-program.js";

/** One seeded hostile situation, run through the real `floorcast` command line. */
export type HostileCase =
  | { readonly kind: "evaluator"; readonly mode: string; readonly at: number; readonly n: number; readonly processes: number; readonly seed: number }
  | { readonly kind: "concurrent"; readonly n: number; readonly seed: number }
  | { readonly kind: "kill-resume"; readonly n: number; readonly seed: number; readonly killShare: number }
  | { readonly kind: "predict-far"; readonly rows: number; readonly seed: number };

/** What a case found; every count must be 0. */
export interface HostileFindings {
  /** Dataset rows pairing a design with another design's answer (or differing from an uninterrupted run). */
  readonly misalignedRows: number;
  /** Final output names holding a partial or inconsistent file (wrong row count, hash not the manifest's). */
  readonly partialFiles: number;
  /** NaN cells in any output. */
  readonly nanOutputs: number;
  /** An exit status other than the one expected, described; null when as expected. */
  readonly unexpected: string | null;
}

const root = fileURLToPath(new URL("../../../../", import.meta.url));
const BIN = join(root, "packages/bench/bin/floorcast.js");
const SCENARIO = join(root, "datasets/scenarios/larkspur-terraces.json");

/**
 * Draws one case from a seeded generator (uniform in [0, 1), e.g. seedrandom): a hostile evaluator (every mode,
 * 1–2 processes), two concurrent writers, a kill at a random moment then resumes, or predictions of rows far
 * outside the model's domain.
 * @param rng - the seeded generator.
 * @returns the case.
 */
export function drawHostileCase(rng: () => number): HostileCase {
  const pick = <T>(xs: readonly T[]): T => xs[Math.floor(rng() * xs.length)]!;
  const seed = Math.floor(rng() * 1000);
  const u = rng();
  if (u < 0.6) {
    const n = 10 + Math.floor(rng() * 50);
    const processes = rng() < 0.3 ? 2 : 1;
    return { kind: "evaluator", mode: pick(HOSTILE_MODES), at: Math.floor((rng() * n) / processes), n, processes, seed };
  }
  if (u < 0.75) return { kind: "concurrent", n: 300 + Math.floor(rng() * 1200), seed };
  if (u < 0.9) return { kind: "kill-resume", n: 1000 + Math.floor(rng() * 2000), seed, killShare: 0.05 + 0.9 * rng() };
  return { kind: "predict-far", rows: 5 + Math.floor(rng() * 40), seed };
}

interface Run {
  readonly code: number | null;
  readonly err: string;
  /** Stopped by the hang guard, not by the case. */
  readonly hung: boolean;
}

const HANG_MS = 300_000;

function floorcast(args: string[], killWhen?: () => boolean): Promise<Run> {
  return new Promise((resolve) => {
    const child = spawn(process.execPath, [BIN, ...args], { stdio: ["ignore", "ignore", "pipe"] });
    let err = "";
    child.stderr.on("data", (c: Buffer) => (err += c.toString()));
    const timer = setInterval(() => {
      if (killWhen?.()) child.kill("SIGKILL");
    }, 5);
    // a run that takes this long hangs (the largest case takes seconds): stop it and report it as unexpected
    let hung = false;
    const guard = setTimeout(() => {
      hung = true;
      child.kill("SIGKILL");
    }, HANG_MS);
    child.on("close", (code) => {
      clearInterval(timer);
      clearTimeout(guard);
      resolve({ code, err: hung ? `hung: stopped after ${HANG_MS / 1000} s\n${err}` : err, hung });
    });
  });
}

const farModels = new Map<string, Promise<number | null>>();

/** Fits the predict-far model once per folder (cases may run side by side); resolves with fit's exit status. */
function fitFarModel(dir: string, model: string): Promise<number | null> {
  let fitted = farModels.get(model);
  if (fitted === undefined) {
    const train = join(dir, "train.csv");
    writeFileSync(train, "a,b,y\n" + [[1, 2], [2, 3], [3, 1], [4, 4], [5, 2], [6, 1], [7, 3], [8, 5]].map(([a, b]) => `${a},${b},${a! + 2 * b!}`).join("\n") + "\n");
    fitted = floorcast(["fit", "--data", train, "--inputs", "a,b", "--target", "y", "--restarts", "1", "--out", model]).then((r) => r.code);
    farModels.set(model, fitted);
  }
  return fitted;
}

const sha = (f: string): string => createHash("sha256").update(readFileSync(f)).digest("hex");
const lines = (f: string): string[] => readFileSync(f, "utf8").split("\n").slice(0, -1);

/** Whether a final dataset is whole: n rows, every line ended, size and hash as its manifest says. */
function whole(out: string, n: number): boolean {
  const m = JSON.parse(readFileSync(out.replace(/\.csv$/, ".manifest.json"), "utf8")) as { csv: { bytes: number; sha256: string } };
  const text = readFileSync(out);
  return text.length === m.csv.bytes && sha(out) === m.csv.sha256 && text.at(-1) === 0x0a && lines(out).length === n + 1;
}

/** Rows of a hostile-evaluator dataset whose area is not their own frontage × depth. */
function misalignedByArea(file: string): number {
  if (!existsSync(file)) return 0;
  const [head, ...rows] = lines(file);
  if (head === undefined) return 0;
  const cols = head.split(",");
  const [f, d, a] = ["frontage", "depth", "area"].map((c) => cols.indexOf(c));
  return rows.filter((r) => {
    const v = r.split(",").map(Number);
    return v[a!] !== v[f!]! * v[d!]!;
  }).length;
}

/** Data rows of `file` that differ from the reference's row of the same index. */
function differingRows(file: string, reference: string): number {
  if (!existsSync(file)) return 0;
  const got = lines(file);
  const want = lines(reference);
  return got.filter((l, i) => i > 0 && l !== want[i]).length;
}

const nanCells = (file: string): number => (existsSync(file) ? (readFileSync(file, "utf8").match(/(^|,)NaN(,|$)/gm) ?? []).length : 0);

/**
 * Runs one case in `dir` through the `floorcast` command line and checks what it left behind.
 * @param c - the case.
 * @param dir - a scratch folder of its own.
 * @param name - a unique name for the case's files.
 * @returns the findings (all 0 and unexpected null when floorcast behaved).
 */
export async function runHostileCase(c: HostileCase, dir: string, name: string): Promise<HostileFindings> {
  const out = join(dir, `${name}.csv`);
  if (c.kind === "evaluator") {
    const program = join(dir, "hostile.mjs");
    if (!existsSync(program)) writeFileSync(program, HOSTILE_PROGRAM);
    const cmd = `${JSON.stringify(process.execPath)} ${JSON.stringify(program)} ${c.mode} ${c.at}`;
    const args = ["sample", "--scenario", SCENARIO, "--n", String(c.n), "--seed", String(c.seed), "--design", "lhs", "--evaluator-command", cmd];
    if (c.mode.startsWith("ordered")) args.push("--evaluator-protocol", "ordered");
    if (c.processes > 1) args.push("--processes", String(c.processes));
    const r = await floorcast([...args, "--evaluator-timeout", "120", "--out", out]);
    const want = HARMLESS_MODES.includes(c.mode) ? 0 : 1;
    const partial = existsSync(out) && !whole(out, c.n) ? 1 : 0;
    return {
      misalignedRows: misalignedByArea(out) + misalignedByArea(`${out}.partial`),
      partialFiles: partial + (want === 1 && existsSync(out) ? 1 : 0),
      nanOutputs: nanCells(out),
      unexpected: r.code === want ? null : `exit ${r.code}, expected ${want}: ${r.err.trim().split("\n")[0] ?? ""}`,
    };
  }
  if (c.kind === "concurrent" || c.kind === "kill-resume") {
    const reference = join(dir, `${name}-reference.csv`);
    await writeDataset(await loadScenario(SCENARIO), { out: reference, n: c.n, seed: c.seed, design: "lhs" });
    const args = ["sample", "--scenario", SCENARIO, "--n", String(c.n), "--seed", String(c.seed), "--design", "lhs", "--out", out];
    let unexpected: string | null = null;
    let partial = 0;
    if (c.kind === "concurrent") {
      const [a, b] = await Promise.all([floorcast(args), floorcast(args)]);
      const codes = [a.code, b.code].sort().join(",");
      if (codes !== "0,2") unexpected = `exits ${codes}, expected 0,2`;
    } else {
      const size = readFileSync(reference).length;
      // the partial file is renamed away when the run completes: a vanished file has size 0, not an error
      const sizeOf = (): number => {
        try {
          return statSync(`${out}.partial`).size;
        } catch {
          return 0;
        }
      };
      let attempts = 0;
      while (!existsSync(out) && attempts < 6) {
        const killAt = attempts === 0 ? c.killShare * size : Infinity;
        const r = await floorcast(attempts === 0 ? args : [...args.slice(0, -2), "--resume", "--out", out], () => sizeOf() >= killAt);
        attempts++;
        if (r.code === null && existsSync(out)) partial++; // a killed run must never leave the final name
        if (r.hung) unexpected = r.err.split("\n")[0]!;
        if (r.code !== null && r.code !== 0) unexpected = `exit ${r.code}: ${r.err.trim().split("\n")[0] ?? ""}`;
      }
      if (!existsSync(out)) unexpected ??= "no dataset after 6 attempts";
    }
    const complete = existsSync(out) && whole(out, c.n) && readFileSync(out).equals(readFileSync(reference));
    return { misalignedRows: differingRows(out, reference), partialFiles: partial + (existsSync(out) && !complete ? 1 : 0), nanOutputs: nanCells(out), unexpected };
  }
  // predict-far: a model of y = a + 2b (derived), asked about rows up to ±1e308
  const model = join(dir, "model.json");
  const fitCode = await fitFarModel(dir, model);
  if (fitCode !== 0) return { misalignedRows: 0, partialFiles: 0, nanOutputs: 0, unexpected: `fit exit ${fitCode}` };
  let state = c.seed + 1;
  const next = (): number => ((state = (state * 48271) % 2147483647) / 2147483647); // Park–Miller minimal standard
  const magnitudes = [1, 10, 1e10, 1e150, 1e160, 1e300, 1.7e308];
  const rows = Array.from({ length: c.rows }, () => [0, 1].map(() => (next() < 0.5 ? -1 : 1) * magnitudes[Math.floor(next() * magnitudes.length)]! * next()));
  const data = join(dir, `${name}-rows.csv`);
  writeFileSync(data, `a,b\n${rows.map((r) => r.join(",")).join("\n")}\n`);
  const r = await floorcast(["predict", "--model", model, "--data", data, "--out", out]);
  const got = existsSync(out) ? lines(out) : [];
  return {
    misalignedRows: got.length === c.rows + 1 ? 0 : Math.abs(got.length - c.rows - 1),
    partialFiles: existsSync(out) ? 0 : 1,
    nanOutputs: nanCells(out),
    unexpected: r.code === 0 || r.code === 1 ? null : `predict exit ${r.code}: ${r.err.trim().split("\n")[0] ?? ""}`,
  };
}
