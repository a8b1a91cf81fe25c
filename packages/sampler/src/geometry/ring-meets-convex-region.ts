/**
 * Whether a ring reaches into a convex region S = {a_j·x + b_j·y ≥ c_j} by more than eps: some edge
 * has a stretch longer than eps inside S shrunk by eps (every half-plane moved eps inward), by
 * clipping the edge's parameter against each half-plane (Cyrus and Beck 1978). A ring that does not
 * reach into S may still enclose a bounded S; the caller rules that out.
 * @param ring - interleaved ring.
 * @param planes - the half-planes as triples [a, b, c], (a, b) unit normals pointing into S.
 * @param k - number of half-planes.
 * @param eps - length tolerance (≥ 0).
 * @returns true when some edge reaches into S.
 */
export function ringMeetsConvexRegion(ring: Float64Array, planes: Float64Array, k: number, eps: number): boolean {
  const m = ring.length >> 1;
  for (let i = 0; i < m; i++) {
    const j = i + 1 === m ? 0 : i + 1;
    const px = ring[2 * i]!;
    const py = ring[2 * i + 1]!;
    const dx = ring[2 * j]! - px;
    const dy = ring[2 * j + 1]! - py;
    let tin = 0;
    let tout = 1;
    for (let h = 0; h < k && tin <= tout; h++) {
      const dp = planes[3 * h]! * px + planes[3 * h + 1]! * py - planes[3 * h + 2]! - eps;
      const dq = dp + planes[3 * h]! * dx + planes[3 * h + 1]! * dy;
      if (dp < 0 && dq < 0) tout = -1;
      else if (dp < 0) tin = Math.max(tin, dp / (dp - dq));
      else if (dq < 0) tout = Math.min(tout, dp / (dp - dq));
    }
    if ((tout - tin) * Math.sqrt(dx * dx + dy * dy) > eps) return true;
  }
  return false;
}

