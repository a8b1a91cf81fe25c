import { FLOORCAST_CAUTION } from "../floorcast-caution.js";
import { createHash } from "node:crypto";
import { mkdir, readFile } from "node:fs/promises";
import { writeFileAtomically } from "@floorcast/sampler";
import { join } from "node:path";
import { cpus } from "node:os";
import type { BenchProblem } from "../problem/bench-problem.js";
import type { BenchReport, ProblemReport } from "./bench-report-types.js";
import { runProblem, type RunProblemOptions } from "./run-problem.js";
import { benchFingerprint } from "./bench-fingerprint.js";

/** What a bench run needs. */
export interface RunBenchOptions {
  readonly suite: string;
  readonly problems: readonly BenchProblem[];
  /** Output directory; finished problems are kept in `<out>/problems/<name>.json`. */
  readonly out: string;
  /** The run's options as report.json records them; a finished problem is reused only when these match. */
  readonly settings: Readonly<Record<string, unknown>>;
  /** Builds the measurement of one problem (trial plans, budgets). */
  readonly plan: (problem: BenchProblem) => RunProblemOptions | Promise<RunProblemOptions>;
  readonly peers: boolean;
  /** Called when a problem starts, is skipped (already finished) or ends. */
  readonly onProblem?: (problem: BenchProblem, state: "start" | "skip" | "done", index: number, total: number) => void;
}

/** SHA-256 of a saved problem report's JSON: an edited or damaged cache file is measured again, never trusted. */
const reportHash = (report: unknown): string => createHash("sha256").update(JSON.stringify(report)).digest("hex");

/**
 * Runs a suite problem by problem, writing each finished problem to `<out>/problems/<name>.json`
 * at once (atomically: a temporary file, then a rename). Re-run with the same settings into the
 * same directory, it reuses the problems already finished there and measures only the rest, so
 * an interrupted run resumes where it stopped. A saved problem is reused only when its fingerprint
 * (benchFingerprint: options, problem file, its scenario file, floorcast versions) matches and its
 * report is unedited (a SHA-256 of it is saved beside it). Returns the assembled report (report.json's content).
 * @param options - suite, problems, output directory, settings, plan and progress callback.
 */
export async function runBench(options: RunBenchOptions): Promise<BenchReport> {
  const t0 = performance.now();
  const dir = join(options.out, "problems");
  await mkdir(dir, { recursive: true });
  const reports: ProblemReport[] = [];
  const total = options.problems.length;
  for (const [i, problem] of options.problems.entries()) {
    const file = join(dir, `${problem.name}.json`);
    const key = await benchFingerprint(problem, options.settings);
    let finished: ProblemReport | null = null;
    try {
      const saved = JSON.parse(await readFile(file, "utf8")) as { fingerprint?: string; sha256?: string; report?: ProblemReport };
      if (saved.fingerprint === key && saved.report && saved.sha256 === reportHash(saved.report)) finished = saved.report;
    } catch {
      finished = null;
    }
    if (finished) {
      options.onProblem?.(problem, "skip", i, total);
      reports.push(finished);
      continue;
    }
    options.onProblem?.(problem, "start", i, total);
    let report: ProblemReport;
    try {
      report = await runProblem(problem, await options.plan(problem));
    } finally {
      await problem.close?.(); // an external evaluator command's processes
    }
    await writeFileAtomically(file, JSON.stringify({ fingerprint: key, sha256: reportHash(report), report }));
    reports.push(report);
    options.onProblem?.(problem, "done", i, total);
  }
  return {
    kind: "floorcast.bench-report",
    formatVersion: 1,
    caution: FLOORCAST_CAUTION,
    suite: options.suite,
    options: options.settings,
    environment: { node: process.version, cpus: cpus().length, peers: options.peers },
    problems: reports,
    seconds: (performance.now() - t0) / 1000,
  };
}
