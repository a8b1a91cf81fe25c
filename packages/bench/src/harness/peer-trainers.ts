import { modelRowBounds, type Variable } from "@floorcast/sampler";
import type { BenchTrainer } from "./bench-trainer.js";
import type { PeerProcess } from "./peer-process.js";
import type { BatchPredictor } from "./surrogate-evaluator.js";

interface PeerModel extends BatchPredictor {
  readonly peerId: number;
}

/**
 * scikit-learn's GP ("sklearn-gp") and MLP ("sklearn-mlp") as benchmark trainers, trained on the
 * same rows as floorcast's and put through the same gap measurement; predictions go through the
 * peer server's pipe.
 * @param peer - a running peer server.
 * @param variables - the surrogate's input variables (declared bounds scale the inputs).
 * @param quick - the demo's cheaper fits: as many GP optimizer starts as floorcast's GP makes (2, else 3),
 *   and at most 500 MLP epochs (else 2000).
 */
export function peerTrainers(peer: PeerProcess, variables: readonly Variable[], quick = false): BenchTrainer[] {
  const { lower, upper } = modelRowBounds(variables);
  const make = (kind: "gp" | "mlp"): BenchTrainer => ({
    name: `sklearn-${kind}`,
    async fit(data, seed) {
      // the same model rows floorcast fits on, read from the training set's CSV
      const { id } = await peer.request<{ id: number }>({ op: "fit", kind, x: data.x, y: data.y, lower, upper, seed, restarts: quick ? 1 : 2, maxIter: quick ? 500 : 2000 });
      const model: PeerModel = {
        peerId: id,
        targets: data.targets,
        predict: (x) => peer.request<{ mean: number[][] }>({ op: "predict", id, x }),
      };
      return model;
    },
    release(model) {
      void peer.request({ op: "release", id: (model as PeerModel).peerId }).catch(() => undefined);
    },
  });
  return [make("gp"), make("mlp")];
}
