import { readFile, writeFile } from "node:fs/promises";
import { loadSurrogate } from "@floorcast/surrogate";
import type { FitOptions } from "../families/model-family.js";
import { fitModelFile } from "../families/fit-model-file.js";
import type { BenchTrainer } from "./bench-trainer.js";

/** The demo's and tests' smaller fits, given as `floorcast fit` options (everything else at fit's defaults). */
const QUICK: Readonly<Record<string, FitOptions>> = {
  gp: { restarts: "2" },
  nn: { layers: "32,32", epochs: "150", batchSize: "16", learningRate: "0.005" },
};

/**
 * floorcast's own surrogates as benchmark trainers, fitted exactly as a user fits them: the training set's CSV
 * goes through the one fit entry `floorcast fit` uses (fitModelFile: its defaults, its input schema from the
 * manifest), the model file is written and loaded back with loadSurrogate, so the model measured is the file a
 * user would hold.
 * @param family - a registered family name, e.g. "gp" or "nn".
 * @param quick - the demo's smaller fits (as fit options: GP 2 restarts; NN 32-32, 150 epochs, batch 16, step 0.005).
 * @returns the trainer.
 */
export function floorcastTrainer(family: string, quick = false): BenchTrainer {
  return {
    name: family,
    async fit(train, seed, modelFile) {
      const { text } = await fitModelFile({
        data: train.csv,
        inputs: train.inputs,
        targets: train.targets,
        model: family,
        seed,
        options: quick ? (QUICK[family] ?? {}) : {},
      });
      await writeFile(modelFile, text);
      return loadSurrogate(await readFile(modelFile, "utf8"), modelFile);
    },
  };
}
