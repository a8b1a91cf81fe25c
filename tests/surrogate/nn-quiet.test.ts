import { afterEach, describe, expect, it, vi } from "vitest";
import { fitMlp } from "@floorcast/surrogate/nn";

// tfjs prints a "Hi, looks like you are running TensorFlow.js in Node.js" banner through console.warn
// on the CPU backend's first tensor (tfjs-backend-cpu 4.22 source); floorcast must print nothing.
describe("tfjs stays silent", () => {
  afterEach(() => vi.restoreAllMocks());
  it("fit and predict on both backends write nothing to the console or the process streams", async () => {
    const spies = (["log", "warn", "info", "error", "debug"] as const).map((m) => vi.spyOn(console, m));
    const out = vi.spyOn(process.stdout, "write");
    const err = vi.spyOn(process.stderr, "write");
    const data = { inputs: ["a"], targets: ["b"], x: [[0], [1], [2], [3]], y: [[0], [1], [4], [9]] };
    for (const backend of ["cpu", "wasm", "auto"] as const) {
      const m = await fitMlp(data, { layers: [4], epochs: 3, backend });
      m.predict([[1.5]]);
      m.gradient([1.5]);
    }
    for (const s of [...spies, out, err]) expect(s).not.toHaveBeenCalled();
  });
});
