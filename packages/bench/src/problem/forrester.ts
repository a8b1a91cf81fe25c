/**
 * Forrester et al. (2008) one-dimensional function f(x) = (6x − 2)² sin(12x − 4) on [0, 1].
 * Global minimum −6.0207400558 at x = 0.7572487585 (Virtual Library of Simulation Experiments).
 * @param x - the coordinate.
 * @returns f(x).
 */
export function forrester(x: number): number {
  return (6 * x - 2) ** 2 * Math.sin(12 * x - 4);
}
