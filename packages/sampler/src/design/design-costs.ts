import type { DesignKind } from "./create-design.js";

/**
 * What each design kind costs for n points in d dimensions (time; memory), as shown by `floorcast sample --help`
 * (derived from each algorithm: ESE tries a bounded number of exchanges per outer iteration at O(n) each
 * (Jin, Chen & Sudjianto 2005), the discrepancy polish 120·n exchanges at O(n) each; Sobol' points cost O(d)
 * each from the previous one (Antonov & Saleev 1979)). "Streamed" kinds are produced row by row in O(d) memory.
 */
export const DESIGN_COSTS: Readonly<Record<DesignKind, string>> = {
  random: "O(n·d) time, streamed",
  lhs: "O(n·d) time and memory",
  "lhs-centred": "O(n·d) time and memory",
  "lhs-maximin": "O(n²·d) time, O(n·d) memory",
  "lhs-maximin-cd": "O(n²·d) time, O(n²) memory up to n = 4,000",
  sobol: "O(n·d) time, streamed",
};
