import type { Command } from "commander";
import type { CommandContext } from "./command-context.js";

type Register = (program: Command, ctx: CommandContext) => void;

/**
 * Every subcommand: its name, the one line `floorcast --help` lists, and its module, loaded only when the command
 * runs (so `--help` and start-up load no command's dependencies). Each command lives in `commands/<name>.ts` and
 * exports a `register…Command(program, ctx)` function; adding one is one line here.
 */
const COMMANDS: readonly { readonly name: string; readonly summary: string; readonly load: () => Promise<Register> }[] = [
  { name: "sample", summary: "sample a scenario (or a problem's own space) with the exact rule into a dataset CSV and manifest", load: async () => (await import("./commands/sample.js")).registerSampleCommand },
  { name: "merge", summary: "join dataset shards into one CSV identical to an unsharded run", load: async () => (await import("./commands/merge.js")).registerMergeCommand },
  { name: "assess", summary: "trust report of a surrogate on an independent test set", load: async () => (await import("./commands/assess.js")).registerAssessCommand },
  { name: "bench", summary: "measure the optimum gap of surrogate-based optimization against the exact optimum", load: async () => (await import("./commands/bench.js")).registerBenchCommand },
  { name: "optimize", summary: "optimize a problem file on the exact rule or on a surrogate", load: async () => (await import("./commands/optimize.js")).registerOptimizeCommand },
  { name: "demo", summary: "run the Quillmere demo suite end to end", load: async () => (await import("./commands/demo.js")).registerDemoCommand },
  { name: "massing", summary: "evaluate the exact massing rule on JSON Lines of inputs", load: async () => (await import("./commands/massing.js")).registerMassingCommand },
  { name: "fit", summary: "fit a surrogate to a CSV and write the model file", load: async () => (await import("./commands/fit.js")).registerFitCommand },
  { name: "predict", summary: "predict with a saved surrogate for every row of a CSV", load: async () => (await import("./commands/predict.js")).registerPredictCommand },
  { name: "design", summary: "write a space-filling design in the unit cube to CSV", load: async () => (await import("./commands/design.js")).registerDesignCommand },
  { name: "parcels", summary: "evaluate the exact rule on the parcels of a GeoJSON file, results as properties", load: async () => (await import("./commands/parcels.js")).registerParcelsCommand },
  { name: "rank-parcels", summary: "rank a GeoJSON file's parcels by their best objective, exactly and with a surrogate", load: async () => (await import("./commands/rank-parcels.js")).registerRankParcelsCommand },
];

/**
 * Adds the subcommands the arguments need: the named command alone (also for `help <command>`), loaded from its
 * module; otherwise (root help, no or an unknown command) every command by name and summary only.
 * @param program - the root command.
 * @param ctx - the streams and exit status.
 * @param argv - process.argv-style arguments (node, script, ...args).
 */
export async function registerCommands(program: Command, ctx: CommandContext, argv: readonly string[]): Promise<void> {
  const args = argv.slice(2);
  const first = args.find((a) => !a.startsWith("-"));
  const wanted = first === "help" ? args[args.indexOf("help") + 1] : first;
  const one = COMMANDS.find((c) => c.name === wanted);
  if (one) {
    (await one.load())(program, ctx);
    program.commands.find((c) => c.name() === one.name)?.summary(one.summary);
    return;
  }
  for (const c of COMMANDS) program.command(c.name).summary(c.summary).allowUnknownOption().allowExcessArguments();
}
