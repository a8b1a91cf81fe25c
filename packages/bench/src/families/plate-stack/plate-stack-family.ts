import { openTableStream, readTable } from "@floorcast/sampler";
import { PLATE_STACK_OUTPUTS, fitPlateStack, plateStackColumns, type KernelName, type PlateStackOptions, type SurrogateTrainer } from "@floorcast/surrogate";
import { UsageError } from "../../cli/usage-error.js";
import type { ModelFamily } from "../model-family.js";
import { nnFamily } from "../nn/nn-family.js";

/** Input rows and plate-profile columns of a CSV (the profile columns plateStackColumns finds in its header). */
interface ProfileTable {
  readonly x: number[][];
  readonly columns: Record<string, number[]>;
}

/**
 * Reads the input columns and the plate profile of a training CSV; refuses, naming them, when profile columns are
 * missing.
 * @param command - the command named in messages (fit, assess).
 * @param path - the CSV.
 * @param inputs - the model's input columns.
 */
async function readProfile(command: string, path: string, inputs: readonly string[]): Promise<ProfileTable> {
  const stream = await openTableStream(path, { columns: [] });
  const header = [...stream.header];
  stream.close();
  const { columns, missing } = plateStackColumns(header);
  if (missing.length > 0) {
    throw new UsageError(
      `${command}: --model plate-stack needs the plate-profile columns; ${path} lacks ${missing.join(", ")} ` +
        "(sample with --plate-profile, or have the evaluator report them: README \"Plate profiles\")",
    );
  }
  const check = ["gfa", "floors"].filter((c) => header.includes(c));
  const table = await readTable(path, { inputs: [...inputs], targets: [...columns, ...check] });
  return { x: table.x, columns: Object.fromEntries(table.targets.map((c, j) => [c, table.y.map((r) => r[j]!)])) };
}

/** The profile columns of the given rows, each looked up by its input values in the table (assess refits folds). */
function profileOfRows(table: ProfileTable, x: readonly (readonly number[])[], path: string): Record<string, number[]> {
  const index = new Map(table.x.map((r, i) => [r.join(","), i] as const));
  const rows = x.map((r) => {
    const i = index.get(r.join(","));
    if (i === undefined) throw new UsageError(`assess: a training row (${r.join(", ")}) has no plate profile in ${path}`);
    return i;
  });
  return Object.fromEntries(Object.entries(table.columns).map(([c, v]) => [c, rows.map((i) => v[i]!)]));
}

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
    {
      flags: "--width-trend <kind>",
      description: "plate-stack: trend of the plate widths (min-affine = least of affine pieces, the inner model learning the rest; none)",
      default: "min-affine",
    },
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
    const widthTrend = String(opts.widthTrend ?? "min-affine");
    if (widthTrend !== "min-affine" && widthTrend !== "none") throw new UsageError(`fit: --width-trend must be min-affine or none, got ${widthTrend}`);
    const table = await readProfile("fit", path, inputs);
    const innerNn = (d: Parameters<NonNullable<typeof nnFamily.fit>>[0], s: number) => nnFamily.fit!(d, opts, s, say);
    return fitPlateStack(
      { inputs: [...inputs], x: table.x, columns: table.columns },
      { targets: [...targets], seed, pointMode: point, draws, widthTrend, ...(inner === "nn" ? { innerTrainer: innerNn } : {}) },
    );
  },
  refit(file, trainCsv) {
    const p = file.payload as {
      pointMode: "expected" | "plugin";
      draws: unknown[];
      quantities: Record<string, { model?: { modelType: string; payload?: { kernel?: KernelName; ard?: boolean } }; trend?: unknown } | undefined>;
    };
    const models = Object.entries(p.quantities).filter(([, q]) => q?.model !== undefined);
    const template = models[0]?.[1]?.model;
    const widths = models.filter(([name]) => name === "baseWidth" || name === "cutWidth");
    const settings: PlateStackOptions = {
      pointMode: p.pointMode,
      draws: p.draws.length,
      // a file without a learned width keeps the default; one with learned widths says whether they had a trend
      ...(widths.length > 0 ? { widthTrend: widths.some(([, q]) => q?.trend !== undefined) ? "min-affine" : "none" } : {}),
      ...(template?.modelType === "mlp"
        ? { innerTrainer: nnFamily.refit!(template) }
        : template?.payload?.kernel !== undefined
          ? { gp: { kernel: template.payload.kernel, ard: template.payload.ard ?? true } }
          : {}),
    };
    let table: Promise<ProfileTable> | undefined;
    const trainer: SurrogateTrainer = async (data, seed) => {
      if (trainCsv === undefined) throw new UsageError("assess: a plate-stack model refits from the plate profile of --train");
      table ??= readProfile("assess", trainCsv, data.inputs);
      const columns = profileOfRows(await table, data.x, trainCsv);
      return fitPlateStack({ inputs: [...data.inputs], x: data.x, columns }, { ...settings, targets: [...data.targets], seed });
    };
    return trainer;
  },
};
