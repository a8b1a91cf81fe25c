import type { Command } from "commander";
import type { CommandContext } from "./command-context.js";
import { registerSampleCommand } from "./commands/sample.js";
import { registerMergeCommand } from "./commands/merge.js";
import { registerAssessCommand } from "./commands/assess.js";
import { registerBenchCommand } from "./commands/bench.js";
import { registerOptimizeCommand } from "./commands/optimize.js";
import { registerDemoCommand } from "./commands/demo.js";
import { registerMassingCommand } from "./commands/massing.js";
import { registerFitCommand } from "./commands/fit.js";
import { registerPredictCommand } from "./commands/predict.js";
import { registerDesignCommand } from "./commands/design.js";

/**
 * Adds every subcommand to the program. Each command lives in its own file under `commands/`
 * and exports a `register…Command(program, ctx)` function called here.
 */
export function registerCommands(program: Command, ctx: CommandContext): void {
  void program;
  void ctx;
  registerSampleCommand(program, ctx);
  registerMergeCommand(program, ctx);
  registerAssessCommand(program, ctx);
  registerBenchCommand(program, ctx);
  registerOptimizeCommand(program, ctx);
  registerDemoCommand(program, ctx);
  registerMassingCommand(program, ctx);
  registerFitCommand(program, ctx);
  registerPredictCommand(program, ctx);
  registerDesignCommand(program, ctx);
}
