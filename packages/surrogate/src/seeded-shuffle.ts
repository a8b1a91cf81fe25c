/** Seeded Fisher–Yates shuffle of `idx` in place (Knuth, TAOCP vol. 2, Algorithm P). */
export function shuffleInPlace(idx: Int32Array | number[], rng: () => number): void {
  for (let i = idx.length - 1; i > 0; i--) {
    const j = Math.floor(rng() * (i + 1));
    const t = idx[i]!;
    idx[i] = idx[j]!;
    idx[j] = t;
  }
}
