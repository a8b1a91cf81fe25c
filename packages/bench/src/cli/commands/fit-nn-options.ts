import type { Command } from "commander";
import type { Surrogate, TrainingData } from "@floorcast/surrogate";
import { UsageError } from "../usage-error.js";

type Opts = Record<string, string | boolean | undefined>;

/**
 * Adds the `--model nn` options of `floorcast fit`.
 * @param cmd - the fit command.
 */
export function addNnOptions(cmd: Command): void {
  cmd
    .option("--layers <w1,w2,...>", "nn: hidden-layer widths", "64,64")
    .option("--activation <name>", "nn: hidden activation (relu, tanh, elu)", "relu")
    .option("--epochs <n>", "nn: maximum epochs (early stopping on a 15% validation split)", "300")
    .option("--batch-size <n>", "nn: mini-batch size", "32")
    .option("--learning-rate <r>", "nn: initial Adam step size (halved on validation plateaus)", "0.003")
    .option("--backend <name>", "nn: tfjs CPU backend (wasm, cpu, auto = wasm when it loads)", "auto");
}

function positiveInt(flag: string, v: unknown): number {
  const n = Number(v);
  if (!Number.isInteger(n) || n < 1) throw new UsageError(`fit: ${flag} must be an integer ≥ 1, got ${String(v)}`);
  return n;
}

/**
 * Fits `--model nn`: an MLP on the CPU (tfjs, loaded only here). Writes the backend and the
 * early-stopping summary as notes.
 * @param data - training rows.
 * @param opts - parsed fit options.
 * @param seed - the seed.
 * @param say - writes a note to stderr.
 */
export async function fitNn(data: TrainingData, opts: Opts, seed: number, say: (line: string) => void): Promise<Surrogate> {
  const layers = String(opts.layers)
    .split(",")
    .map((w) => positiveInt("--layers", w.trim()));
  const activation = String(opts.activation);
  if (!["relu", "tanh", "elu"].includes(activation)) throw new UsageError(`fit: --activation must be relu, tanh or elu, got ${activation}`);
  const backend = String(opts.backend);
  if (!["wasm", "cpu", "auto"].includes(backend)) throw new UsageError(`fit: --backend must be wasm, cpu or auto, got ${backend}`);
  const learningRate = Number(opts.learningRate);
  if (!(Number.isFinite(learningRate) && learningRate > 0 && learningRate <= 1)) {
    throw new UsageError(`fit: --learning-rate must be in (0, 1], got ${String(opts.learningRate)}`);
  }
  const { fitMlp } = await import("@floorcast/surrogate/nn");
  const m = await fitMlp(data, {
    layers,
    activation: activation as "relu" | "tanh" | "elu",
    epochs: positiveInt("--epochs", opts.epochs),
    batchSize: positiveInt("--batch-size", opts.batchSize),
    learningRate,
    backend: backend as "wasm" | "cpu" | "auto",
    seed,
  });
  const t = m.toJSON().training as { backend: string; epochsRun: number; bestEpoch: number; bestLoss: number; nValidation: number };
  say(
    `fit: nn ${layers.join("-")} on ${t.backend}: ${t.epochsRun} epochs, best ${t.bestEpoch}` +
      ` (validation MSE ${t.bestLoss.toExponential(3)} in standardised units, ${t.nValidation} rows)`,
  );
  return m;
}
