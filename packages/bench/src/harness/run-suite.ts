import { mkdir } from "node:fs/promises";
import type { Writable } from "node:stream";
import { claimOutput } from "@floorcast/sampler";
import type { BenchProblem } from "../problem/bench-problem.js";
import { DEFAULT_PROBLEMS_DIR, loadSuite } from "../problem/load-suite.js";
import type { BenchReport } from "./bench-report-types.js";
import { BENCH_SURROGATES, benchPlans, type BenchSurrogate } from "./bench-plans.js";
import { benchProgress } from "./bench-progress.js";
import { benchSettings } from "./bench-settings.js";
import { PEER_PYTHON, PeerProcess } from "./peer-process.js";
import { runBench } from "./run-bench.js";
import { benchReportPaths, writeBenchReport } from "./write-bench-report.js";
import { rankDemoParcels } from "../parcels/rank-demo-parcels.js";

/** Options of {@link runSuite} (what `floorcast bench` and `floorcast demo` take). */
export interface RunSuiteOptions {
  readonly suite: string;
  /** Only this problem of the suite. */
  readonly problem?: string;
  readonly seeds?: number;
  readonly quick: boolean;
  readonly out: string;
  /** Replace report files already in `out` (without it they are refused before any work). */
  readonly force?: boolean;
  /** Run the scikit-learn / scipy peers when present (default true). */
  readonly peers?: boolean;
  /** Problems directory (default {@link DEFAULT_PROBLEMS_DIR}, the problems shipped with floorcast). */
  readonly problemsDir?: string;
  /**
   * Rank the demo parcel file by capacity and add its plan to the report (`floorcast demo`): evaluations per parcel,
   * and the folder of the parcel files (default DEFAULT_PARCELS_DIR, the files shipped with floorcast).
   */
  readonly parcels?: { readonly budget: number; readonly dir?: string };
  /** Progress messages (stderr). */
  readonly progress?: Writable;
  /** Overrides for tests: training sizes, test size, budgets. */
  readonly overrides?: Partial<ReturnType<typeof benchSettings>> & { readonly gridPoints?: number; readonly surrogates?: readonly BenchSurrogate[] };
}

/**
 * Runs a suite end to end — for every problem: the exact optimum, then per surrogate, training
 * size and seed: sample, fit, assess, optimize on the surrogate, re-evaluate exactly, refine — with
 * the peers when Debian's python3-sklearn and python3-scipy are present; writes each finished
 * problem as it goes (resumable), with `parcels` ranks the demo parcel file (rankDemoParcels), and then
 * writes report.json, report.md and report.html into `out`.
 * @param options - suite, problem, seeds, quick, output directory.
 * @returns the report and the paths written.
 */
export async function runSuite(options: RunSuiteOptions): Promise<{ report: BenchReport; paths: { json: string; markdown: string; html: string } }> {
  let problems: BenchProblem[] = await loadSuite(options.suite, options.problemsDir ?? DEFAULT_PROBLEMS_DIR);
  if (options.problem !== undefined) {
    const names = problems.map((p) => p.name);
    problems = problems.filter((p) => p.name === options.problem);
    if (problems.length === 0) throw new RangeError(`bench: no problem "${options.problem}" in suite ${options.suite}; problems: ${names.join(", ")}`);
  }
  await mkdir(options.out, { recursive: true });
  const reportPaths = benchReportPaths(options.out);
  const claim = await claimOutput([reportPaths.json, reportPaths.markdown, reportPaths.html], {
    fn: options.suite === "demo" ? "demo" : "bench",
    force: options.force === true,
    inputs: problems.map((p) => p.file).filter((f) => f !== ""),
  });
  const { surrogates, gridPoints, ...over } = options.overrides ?? {};
  const settings = { ...benchSettings(options.quick, options.seeds), ...over };
  const peer = options.peers === false ? null : PeerProcess.start();
  const progress = options.progress ? benchProgress(options.progress) : null;
  const notes = peer
    ? []
    : options.peers === false
      ? ["Peers skipped: turned off (--no-peers)."]
      : [`Peers skipped: ${PEER_PYTHON} could not import Debian's python3-sklearn and python3-scipy.`];
  try {
    const report = await runBench({
      suite: options.suite,
      problems,
      out: options.out,
      settings: { suite: options.suite, quick: options.quick, ...settings, peers: peer !== null, surrogates: surrogates ?? [...BENCH_SURROGATES], gridPoints: gridPoints ?? null },
      peers: peer !== null,
      plan: (problem) => ({
        plans: benchPlans(problem, settings, options.quick, peer, surrogates),
        testSize: settings.testSize,
        refineBudget: settings.refineBudget,
        targets: settings.targets,
        candidates: settings.candidates,
        notes,
        ...(gridPoints === undefined ? {} : { gridPoints }),
        ...(progress ? { onStep: (label: string, done: number, total: number) => progress.step(label, done, total) } : {}),
      }),
      ...(progress ? { onProblem: (p: BenchProblem, state: "start" | "skip" | "done", i: number, n: number) => progress.problem(p.name, state, i, n) } : {}),
    });
    progress?.stop();
    let full = report;
    if (options.parcels !== undefined) {
      options.progress?.write("parcel ranking: the Quillmere demo parcels, exact and surrogate routes\n");
      full = { ...report, parcels: await rankDemoParcels({ budget: options.parcels.budget, ...(options.parcels.dir === undefined ? {} : { dir: options.parcels.dir }) }) };
    }
    const paths = await writeBenchReport(full, options.out, claim);
    return { report: full, paths };
  } finally {
    await claim.release();
    progress?.stop();
    peer?.close();
  }
}
