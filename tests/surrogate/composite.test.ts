import { describe, expect, it } from "vitest";
import { fitComposite, loadCompositeSurrogate, loadSurrogate, type Combiner } from "@floorcast/surrogate";

// Toy composite (derived): intermediates a(x) = x₁ + x₂ and b(x) = x₁ − x₂, combined exactly by f = a·b = x₁² − x₂².
// The intermediates are linear, so GPs learn them almost exactly while f itself is a saddle.
const product: Combiner = { name: "product-of-a-and-b", outputs: ["f"], combine: (m) => ({ f: m.a! * m.b! }) };
const grid = Array.from({ length: 25 }, (_, i) => [(i % 5) / 4, Math.floor(i / 5) / 4]);

describe("fitComposite / loadCompositeSurrogate", () => {
  it("combines the intermediates with the caller's function, and the file only names it", async () => {
    const model = await fitComposite(
      { inputs: ["x1", "x2"], x: grid, intermediates: { a: grid.map(([p, q]) => p! + q!), b: grid.map(([p, q]) => p! - q!) } },
      product,
      { seed: 2 },
    );
    const q = [[0.3, 0.7], [0.9, 0.1]];
    const p = model.predict(q);
    q.forEach(([x1, x2], i) => expect(Math.abs(p.mean[i]![0]! - (x1! ** 2 - x2! ** 2))).toBeLessThan(1e-3));
    expect(p.sd?.[0]?.[0]).toBeGreaterThanOrEqual(0);
    const text = JSON.stringify(model.toJSON());
    expect(JSON.parse(text).payload.combine).toBe("product-of-a-and-b");
    expect(text).not.toMatch(/=>|function/);
    expect(loadCompositeSurrogate(text, { [product.name]: product }).predict(q).mean).toEqual(p.mean);
    expect(() => loadSurrogate(text)).toThrow(/combined by "product-of-a-and-b"; load it with loadCompositeSurrogate/);
    expect(() => loadCompositeSurrogate(text, {})).toThrow(/pass that function in combiners/);
  }, 120_000);
});
