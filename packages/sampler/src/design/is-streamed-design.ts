import type { DesignKind } from "./create-design.js";

/**
 * Whether designRows produces this design kind row by row in O(d) memory ("random", "sobol"): such rows depend
 * only on the seed and their index, not on the other rows, so a dataset of any size streams in bounded memory.
 * Their integer and categorical parameters take level ⌊x · levels⌋ of each coordinate (stratumIndex).
 * @param kind - a design kind.
 * @returns true for the streamed kinds.
 */
export function isStreamedDesign(kind: DesignKind): boolean {
  return kind === "random" || kind === "sobol";
}
