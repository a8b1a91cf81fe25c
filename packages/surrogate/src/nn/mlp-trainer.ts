import type { SurrogateTrainer } from "../surrogate-types.js";
import type { MlpOptions } from "./mlp-options.js";
import { fitMlp } from "./fit-mlp.js";

/**
 * A {@link SurrogateTrainer} that fits an MLP with fixed options and the seed it is given, for
 * ensembles, conformal wrappers and cross-validation.
 * @param options - MLP options; `seed` is replaced by the trainer's seed argument.
 */
export function mlpTrainer(options: MlpOptions = {}): SurrogateTrainer {
  return (data, seed) => fitMlp(data, { ...options, seed });
}
