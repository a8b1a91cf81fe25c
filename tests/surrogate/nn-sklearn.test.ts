import { describe, expect, it } from "vitest";
import seedrandom from "seedrandom";
import { fitMlp } from "@floorcast/surrogate/nn";
import { referenceAvailable, runReference } from "../reference/python.js";

/**
 * Friedman #1 (Friedman 1991, "Multivariate adaptive regression splines", Ann. Statist. 19, eq. 41
 * without the noise dimensions): y = 10 sin(π x1 x2) + 20 (x3 − 0.5)² + 10 x4 + 5 x5 on [0, 1]⁵.
 */
function friedman1(n: number, seed: string) {
  const rng = seedrandom(seed);
  const x: number[][] = [];
  const y: number[][] = [];
  for (let i = 0; i < n; i++) {
    const r = Array.from({ length: 5 }, () => rng());
    x.push(r);
    y.push([10 * Math.sin(Math.PI * r[0]! * r[1]!) + 20 * (r[2]! - 0.5) ** 2 + 10 * r[3]! + 5 * r[4]!]);
  }
  return { x, y };
}

const hasRef = referenceAvailable(["sklearn", "numpy"]);

describe.skipIf(!hasRef)("MLP against scikit-learn 1.2.1 MLPRegressor (tests/reference/mlp_sklearn.py)", () => {
  it("test RMSE on Friedman #1 (n = 400 train, 400 test) is at most 1.2 × scikit-learn's", async () => {
    const train = friedman1(400, "friedman-train");
    const test = friedman1(400, "friedman-test");
    const settings = { hidden: [32, 32], activation: "relu", alpha: 1e-5, learningRate: 0.003, batchSize: 32, maxIter: 300, patience: 30, validationFraction: 0.15 };
    const ref = runReference<{ rmse: number[]; sklearn: string }>("mlp_sklearn.py", {
      xTrain: train.x, yTrain: train.y, xTest: test.x, yTest: test.y, seed: 0, ...settings,
    });
    expect(ref.sklearn).toBe("1.2.1");
    const m = await fitMlp(
      { inputs: ["x1", "x2", "x3", "x4", "x5"], targets: ["y"], ...train },
      { layers: settings.hidden, activation: "relu", l2: settings.alpha, learningRate: settings.learningRate, batchSize: 32, epochs: 300, patience: 30, validationFraction: 0.15, seed: 0 },
    );
    const p = m.predict(test.x).mean;
    const ours = Math.sqrt(p.reduce((s, r, i) => s + (r[0]! - test.y[i]![0]!) ** 2, 0) / p.length);
    console.info(`Friedman #1 test RMSE: floorcast MLP ${ours.toFixed(4)} | scikit-learn ${ref.sklearn} MLPRegressor ${ref.rmse[0]!.toFixed(4)} (ratio ${(ours / ref.rmse[0]!).toFixed(3)})`);
    // The acceptance bound: no worse than 1.2 × scikit-learn's RMSE on the same data.
    expect(ours).toBeLessThanOrEqual(1.2 * ref.rmse[0]!);
  }, 300_000); // a hang guard: on a heavily loaded machine training and the reference take minutes
});
