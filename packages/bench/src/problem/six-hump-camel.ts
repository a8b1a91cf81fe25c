/**
 * Six-hump camel function f = (4 − 2.1x1² + x1⁴/3)x1² + x1x2 + (−4 + 4x2²)x2², usually on
 * x1 ∈ [−3, 3], x2 ∈ [−2, 2]. Global minimum −1.0316284535 at ±(0.08984201, −0.71265641)
 * (Virtual Library of Simulation Experiments).
 * @param x1 - first coordinate.
 * @param x2 - second coordinate.
 * @returns f(x1, x2).
 */
export function sixHumpCamel(x1: number, x2: number): number {
  const a = x1 * x1;
  return (4 - 2.1 * a + (a * a) / 3) * a + x1 * x2 + (-4 + 4 * x2 * x2) * x2 * x2;
}
