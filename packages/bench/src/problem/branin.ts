/**
 * Branin–Hoo function with a = 1, b = 5.1/(4π²), c = 5/π, r = 6, s = 10, t = 1/(8π), on
 * x1 ∈ [−5, 10], x2 ∈ [0, 15]. Global minimum 5/(4π) ≈ 0.397887 at (−π, 12.275), (π, 2.275)
 * and (3π, 2.475) (Virtual Library of Simulation Experiments, Surjanovic & Bingham).
 * @param x1 - first coordinate.
 * @param x2 - second coordinate.
 * @returns f(x1, x2).
 */
export function branin(x1: number, x2: number): number {
  const b = 5.1 / (4 * Math.PI * Math.PI);
  const c = 5 / Math.PI;
  const t = 1 / (8 * Math.PI);
  return (x2 - b * x1 * x1 + c * x1 - 6) ** 2 + 10 * (1 - t) * Math.cos(x1) + 10;
}
