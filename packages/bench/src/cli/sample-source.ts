import { loadScenario, type Evaluator, type Scenario } from "@floorcast/sampler";
import { loadProblem } from "../problem/load-problem.js";
import { UsageError } from "./usage-error.js";

/** What `floorcast sample` samples: a scenario, and for a problem its own evaluator. */
export interface SampleSource {
  /** The scenario sampled (for a problem: its training variables, its fixed values; see ProblemDataset). */
  readonly scenario: Scenario;
  /** The files read, refused as outputs. */
  readonly inputs: readonly string[];
  /** Starts a problem's own evaluator (massing rule with the plate profile, test function or command); undefined for a scenario. */
  readonly evaluator?: () => Evaluator;
  /** Releases what the problem holds (an external command's processes). */
  close(): Promise<void>;
}

/**
 * Resolves `sample --scenario FILE` or `sample --problem FILE` (exactly one). A problem is sampled the way the
 * benchmark samples its training sets, through `problem.dataset`: its training variables with its fixed values,
 * evaluated by its own evaluator, so the CSV fits a model that `optimize --surrogate` accepts for that problem.
 * @param opts - the two options as given, and whether an evaluator command or --plate-profile was asked for.
 * @returns the scenario, the files read, the problem's evaluator factory and a close function.
 * @throws UsageError when neither or both are given, or when --problem is combined with --evaluator-command or
 *   --plate-profile; ScenarioFileError/ProblemFileError (RangeError) for a bad file.
 */
export async function resolveSampleSource(opts: {
  readonly scenario?: string;
  readonly problem?: string;
  readonly evaluatorCommand?: string;
  readonly plateProfile?: boolean;
}): Promise<SampleSource> {
  if ((opts.scenario === undefined) === (opts.problem === undefined)) {
    throw new UsageError("sample: give one of --scenario FILE and --problem FILE");
  }
  if (opts.scenario !== undefined) {
    return { scenario: await loadScenario(opts.scenario), inputs: [opts.scenario], close: async () => {} };
  }
  if (opts.evaluatorCommand !== undefined) {
    throw new UsageError("sample: --problem evaluates with the problem's own evaluator; an external command goes in the problem file (evaluatorCommand)");
  }
  if (opts.plateProfile === true) {
    throw new UsageError("sample: --problem writes what the benchmark trains on (a massing problem's rows carry the plate profile already); drop --plate-profile");
  }
  const problem = await loadProblem(opts.problem!);
  return {
    scenario: problem.dataset.scenario,
    inputs: [opts.problem!],
    evaluator: () => problem.dataset.evaluator(),
    close: async () => {
      await problem.close?.();
    },
  };
}
