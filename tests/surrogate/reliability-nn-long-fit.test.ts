import { describe, expect, it } from "vitest";
import * as tf from "@tensorflow/tfjs";
import seedrandom from "seedrandom";
import { fitMlp, useNnBackend } from "@floorcast/surrogate/nn";

describe("tfjs tensors over a long fit", () => {
  it("400 epochs leave no tensor and no byte behind (a leak of one tensor per step would leave thousands)", async () => {
    await useNnBackend("cpu");
    const rng = seedrandom("long-fit");
    const x = Array.from({ length: 64 }, () => [rng(), rng()]);
    const data = { inputs: ["a", "b"], targets: ["y"], x, y: x.map((r) => [Math.sin(6 * r[0]!) * r[1]!]) };
    const before = tf.memory();
    // patience above the epoch count: early stopping must not cut the run short; batch 16 → 4 steps per epoch.
    const m = await fitMlp(data, { layers: [8, 8], epochs: 400, batchSize: 16, patience: 1000, seed: 2, backend: "cpu" });
    const after = tf.memory();
    expect((m.toJSON().training as { epochs: number }).epochs).toBe(400);
    expect(after.numTensors).toBe(before.numTensors);
    expect(after.numBytes).toBe(before.numBytes);
  }, 60_000);
});
