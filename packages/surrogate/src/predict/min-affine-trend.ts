/**
 * A trend that is the least of a few affine functions of a quantity's inputs: t(x) = min_k (b_k + a_k · x). Each
 * piece is `[b_k, a_k1, …, a_kd]` in the quantity's input units (the columns its inner model reads). The least
 * width of a convex plate is the least, over its edge directions, of the plate's extent across that direction
 * (the rotating-calipers theorem; Houle & Toussaint 1988), and each extent moves almost linearly with the yards
 * and the lot's dimensions: a min of affine pieces captures the width's kinks, and the inner model learns the
 * smooth remainder w − t(x).
 */
export interface MinAffineTrend {
  readonly pieces: readonly (readonly number[])[];
}

/**
 * Evaluates a min-of-affine trend at one row.
 * @param trend - the trend's pieces.
 * @param row - one row of the quantity's inputs (length = piece length − 1).
 * @returns min_k (b_k + a_k · row).
 */
export function minAffineAt(trend: MinAffineTrend, row: readonly number[]): number {
  let best = Infinity;
  for (const p of trend.pieces) {
    let v = p[0]!;
    for (let j = 0; j < row.length; j++) v += p[j + 1]! * row[j]!;
    if (v < best) best = v;
  }
  return best;
}
