// @floorcast/bench: every library export of the four audiences' subpaths (optimizers, problems, harness, report).
// The floorcast command line is not a library export: it is the package's bin.
export * from "./optimize/index.js";
export * from "./problem/index.js";
export * from "./harness/index.js";
export * from "./report/index.js";
