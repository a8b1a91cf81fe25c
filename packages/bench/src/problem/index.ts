// @floorcast/bench/problems: problem files, the problem contract and the published test functions.
export type { BenchProblem, BenchProblemKind, BenchSites } from "./bench-problem.js";
export { problemFileSchema } from "./problem-file-schema.js";
export type { ProblemFile } from "./problem-file-schema.js";
export { ProblemFileError } from "./problem-file-error.js";
export { parseProblem } from "./parse-problem.js";
export { loadProblem } from "./load-problem.js";
export { DEFAULT_PROBLEMS_DIR, loadSuite } from "./load-suite.js";
export { MASSING_OUTPUTS, problemMassingOutputs } from "./massing-outputs.js";
export { branin } from "./branin.js";
export { forrester } from "./forrester.js";
export { sixHumpCamel } from "./six-hump-camel.js";
export { problemDataset } from "./problem-dataset.js";
export type { ProblemDataset } from "./problem-dataset.js";
