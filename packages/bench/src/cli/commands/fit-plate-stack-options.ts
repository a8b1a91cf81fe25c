import type { Command } from "commander";
import { openTableStream, readTable } from "@floorcast/sampler";
import { PLATE_STACK_OUTPUTS, fitPlateStack, plateStackColumns, type Surrogate, type SurrogateTrainer } from "@floorcast/surrogate";
import { UsageError } from "../usage-error.js";

type Opts = Record<string, string | boolean | undefined>;

/**
 * Adds the `--model plate-stack` options of `floorcast fit`.
 * @param cmd - the fit command.
 */
export function addPlateStackOptions(cmd: Command): void {
  cmd
    .option("--inner <family>", "plate-stack: model of the plate geometry (gp, nn)", "gp")
    .option("--point <mode>", "plate-stack: point prediction (expected = mean of the rule over the inner posterior, plugin = rule at the inner means)", "expected")
    .option("--draws <n>", "plate-stack: quasi-Monte Carlo draws through the rule (uncertainty, expected mode)", "64");
}

/**
 * Fits `--model plate-stack` from a CSV with plate-profile columns (README "Plate profiles"): refuses, naming them,
 * when the columns the family needs are missing.
 * @param path - the training CSV.
 * @param inputs - input columns.
 * @param targets - outputs of the plate stack to predict.
 * @param opts - parsed fit options.
 * @param seed - the seed.
 * @param innerNn - fits an MLP inner model (for `--inner nn`).
 * @returns the fitted plate stack.
 */
export async function fitPlateStackCsv(
  path: string,
  inputs: readonly string[],
  targets: readonly string[],
  opts: Opts,
  seed: number,
  innerNn: SurrogateTrainer,
): Promise<Surrogate> {
  const bad = targets.find((t) => !(PLATE_STACK_OUTPUTS as readonly string[]).includes(t));
  if (bad !== undefined) throw new UsageError(`fit: --model plate-stack predicts ${PLATE_STACK_OUTPUTS.join(", ")}; ${bad} is not one of them`);
  const inner = String(opts.inner);
  if (inner !== "gp" && inner !== "nn") throw new UsageError(`fit: --inner must be gp or nn, got ${inner}`);
  const point = String(opts.point);
  if (point !== "expected" && point !== "plugin") throw new UsageError(`fit: --point must be expected or plugin, got ${point}`);
  const draws = Number(opts.draws);
  if (!Number.isInteger(draws) || draws < 0 || draws > 4096) throw new UsageError(`fit: --draws must be an integer in [0, 4096], got ${String(opts.draws)}`);
  const stream = await openTableStream(path, { columns: [] });
  const header = [...stream.header];
  stream.close();
  const { columns, missing } = plateStackColumns(header);
  if (missing.length > 0) {
    throw new UsageError(
      `fit: --model plate-stack needs the plate-profile columns; ${path} lacks ${missing.join(", ")} ` +
        "(sample with --plate-profile, or have the evaluator report them: README \"Plate profiles\")",
    );
  }
  const check = ["gfa", "floors"].filter((c) => header.includes(c));
  const table = await readTable(path, { inputs, targets: [...columns, ...check] });
  const cols = Object.fromEntries(table.targets.map((c, j) => [c, table.y.map((r) => r[j]!)]));
  return fitPlateStack(
    { inputs, x: table.x, columns: cols },
    { targets, seed, pointMode: point, draws, ...(inner === "nn" ? { innerTrainer: innerNn } : {}) },
  );
}
