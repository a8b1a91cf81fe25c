import { describe, expect, it } from "vitest";
import { fitGaussianProcess, fitGaussianProcessParallel, type GaussianProcess } from "@floorcast/surrogate";
import { hartmann3, maximinLhs } from "./gp-test-functions.js";

// The threaded fit must return the serial fit's model: the serial fit is the one checked against scikit-learn
// (gp-sklearn.test.ts, Debian python3-sklearn 1.2.1), so equality carries that check over.
const x = maximinLhs(90, [0, 0, 0], [1, 1, 1], 4).map((r) => [r[0]! * 10, r[1]! - 5, r[2]! * 200]);
const y = x.map((r) => [hartmann3([r[0]! / 10, r[1]! + 5, r[2]! / 200]), Math.sin(r[0]!) + 0.01 * r[2]!]);
const data = { inputs: ["a", "b", "c"], targets: ["f", "g"], x, y };

/** The model file without the fields that may differ: the fit's wall time and the checksum sealed over it. */
function file(gp: GaussianProcess): unknown {
  return JSON.parse(JSON.stringify(gp.toJSON(), (k, v) => (k === "fitTimeMs" || k === "checksum" ? undefined : v)));
}

describe("fitGaussianProcessParallel", () => {
  it("gives fitGaussianProcess's model bit for bit: two targets, four restarts each, on two threads and on one", async () => {
    const options = { seed: 5, restarts: 4 };
    const serial = fitGaussianProcess(data, options);
    for (const workers of [2, 1]) {
      const threaded = await fitGaussianProcessParallel(data, { ...options, workers });
      expect(file(threaded)).toEqual(file(serial));
      expect(threaded.predict([[5, -4.5, 100]]).mean).toEqual(serial.predict([[5, -4.5, 100]]).mean);
    }
  }, 120_000);
  it("also after a subset fit with its polish on all rows", async () => {
    const options = { seed: 2, restarts: 3, hyperparameterSubset: 50, polishIterations: 5 };
    const serial = fitGaussianProcess(data, options);
    expect(serial.diagnostics.polishIterations).toBe(5);
    expect(file(await fitGaussianProcessParallel(data, { ...options, workers: 3 }))).toEqual(file(serial));
  }, 120_000);
  it("with given hyperparameters (no search) and one restart", async () => {
    const given = { hyperparameters: [{ lengthscales: 0.4, signalVariance: 1, noiseVariance: 1e-4 }, { lengthscales: [0.3, 0.5, 0.7], signalVariance: 2, noiseVariance: 1e-3 }] };
    expect(file(await fitGaussianProcessParallel(data, given))).toEqual(file(fitGaussianProcess(data, given)));
    expect(file(await fitGaussianProcessParallel(data, { restarts: 1, seed: 9 }))).toEqual(file(fitGaussianProcess(data, { restarts: 1, seed: 9 })));
  }, 120_000);
  it("refuses bad options naming the field, before any thread starts", async () => {
    await expect(fitGaussianProcessParallel(data, { workers: 0 })).rejects.toThrow(/fitGaussianProcessParallel: options.workers must be an integer ≥ 1/);
    await expect(fitGaussianProcessParallel(data, { workers: 1.5 })).rejects.toThrow(RangeError);
    await expect(fitGaussianProcessParallel(data, { workers: "2" as unknown as number })).rejects.toThrow(TypeError);
    await expect(fitGaussianProcessParallel(data, { restarts: 0 })).rejects.toThrow(/fitGaussianProcessParallel: options.restarts/);
    await expect(fitGaussianProcessParallel({ ...data, x: [] }, {})).rejects.toThrow(/fitGaussianProcessParallel/);
  });
});
