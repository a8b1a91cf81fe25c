import { openTableStream, readTable } from "@floorcast/sampler";
import { PLATE_STACK_OUTPUTS, fitPlateStack, plateStackColumns } from "@floorcast/surrogate";
import { UsageError } from "../../cli/usage-error.js";
import type { ModelFamily } from "../model-family.js";
import { nnFamily } from "../nn/nn-family.js";

/**
 * The structure-aware plate-stack family (`--model plate-stack`): inner models of the plate geometry fitted on a
 * CSV with plate-profile columns (README "Plate profiles"), the massing rule applied to their predictions. It
 * reads the CSV itself and refuses, naming them, when the columns it needs are missing.
 */
export const plateStackFamily: ModelFamily = {
  name: "plate-stack",
  modelType: "plate-stack",
  summary: "plate geometry models put through the massing rule (needs sample --plate-profile)",
  options: [
    { flags: "--inner <family>", description: "plate-stack: model of the plate geometry (gp, nn)", default: "gp" },
    {
      flags: "--point <mode>",
      description: "plate-stack: point prediction (expected = mean of the rule over the inner posterior, plugin = rule at the inner means)",
      default: "expected",
    },
    { flags: "--draws <n>", description: "plate-stack: quasi-Monte Carlo draws through the rule (uncertainty, expected mode)", default: "64" },
  ],
  async fitCsv(path, inputs, targets, opts, seed, say) {
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
    const table = await readTable(path, { inputs: [...inputs], targets: [...columns, ...check] });
    const cols = Object.fromEntries(table.targets.map((c, j) => [c, table.y.map((r) => r[j]!)]));
    const innerNn = (d: Parameters<NonNullable<typeof nnFamily.fit>>[0], s: number) => nnFamily.fit!(d, opts, s, say);
    return fitPlateStack(
      { inputs: [...inputs], x: table.x, columns: cols },
      { targets: [...targets], seed, pointMode: point, draws, ...(inner === "nn" ? { innerTrainer: innerNn } : {}) },
    );
  },
};
