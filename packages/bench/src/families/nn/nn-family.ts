import { UsageError } from "../../cli/usage-error.js";
import type { ModelFamily } from "../model-family.js";
import { parseWhole } from "../../cli/parse-whole.js";

const ACTIVATIONS = ["relu", "tanh", "elu"] as const;
const BACKENDS = ["wasm", "cpu", "auto"] as const;

/**
 * The neural-network family (`--model nn`): a multilayer perceptron fitted with Adam (Kingma & Ba 2015) on the
 * CPU with early stopping on a validation split; tfjs is loaded only when this family fits.
 */
export const nnFamily: ModelFamily = {
  name: "nn",
  modelType: "mlp",
  summary: "multilayer perceptron (tfjs on the CPU)",
  options: [
    { flags: "--layers <w1,w2,...>", description: "nn: hidden-layer widths", default: "64,64" },
    { flags: "--activation <name>", description: "nn: hidden activation (relu, tanh, elu)", default: "relu" },
    { flags: "--epochs <n>", description: "nn: maximum epochs (early stopping on a 15% validation split)", default: "300" },
    { flags: "--batch-size <n>", description: "nn: mini-batch size", default: "32" },
    { flags: "--learning-rate <r>", description: "nn: initial Adam step size (halved on validation plateaus)", default: "0.003" },
    { flags: "--backend <name>", description: "nn: tfjs CPU backend (wasm, cpu, auto = wasm when it loads)", default: "auto" },
  ],
  async fit(data, opts, seed, say) {
    const layers = String(opts.layers)
      .split(",")
      .map((w) => parseWhole("fit", "--layers", w.trim(), 1));
    const activation = String(opts.activation);
    if (!(ACTIVATIONS as readonly string[]).includes(activation)) throw new UsageError(`fit: --activation must be relu, tanh or elu, got ${activation}`);
    const backend = String(opts.backend);
    if (!(BACKENDS as readonly string[]).includes(backend)) throw new UsageError(`fit: --backend must be wasm, cpu or auto, got ${backend}`);
    const learningRate = Number(opts.learningRate);
    if (!(Number.isFinite(learningRate) && learningRate > 0 && learningRate <= 1)) {
      throw new UsageError(`fit: --learning-rate must be in (0, 1], got ${String(opts.learningRate)}`);
    }
    const { fitMlp } = await import("@floorcast/surrogate/nn");
    const m = await fitMlp(data, {
      layers,
      activation: activation as (typeof ACTIVATIONS)[number],
      epochs: parseWhole("fit", "--epochs", String(opts.epochs), 1),
      batchSize: parseWhole("fit", "--batch-size", String(opts.batchSize), 1),
      learningRate,
      backend: backend as (typeof BACKENDS)[number],
      seed,
    });
    const t = m.toJSON().training as { backend: string; epochsRun: number; bestEpoch: number; bestLoss: number; nValidation: number };
    say(
      `fit: nn ${layers.join("-")} on ${t.backend}: ${t.epochsRun} epochs, best ${t.bestEpoch}` +
        ` (validation MSE ${t.bestLoss.toExponential(3)} in standardised units, ${t.nValidation} rows)`,
    );
    return m;
  },
  refit(file) {
    const p = file.payload as { activation: (typeof ACTIVATIONS)[number]; layers: { shape: [number, number] }[] };
    const hidden = p.layers.slice(0, -1).map((l) => l.shape[1]);
    // Training settings the file records (fit-mlp's training summary); absent ones take fitMlp's defaults.
    const recorded: Record<string, number> = {};
    for (const key of ["epochs", "batchSize", "learningRate", "l2"] as const) {
      const v = file.training?.[key];
      if (typeof v === "number") recorded[key] = v;
    }
    return async (data, seed) => {
      const { fitMlp } = await import("@floorcast/surrogate/nn");
      return fitMlp(data, { ...recorded, layers: hidden, activation: p.activation, seed });
    };
  },
};
