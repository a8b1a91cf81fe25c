import { describe, expect, it } from "vitest";
import seedrandom from "seedrandom";
import { isLatin, phiP } from "@floorcast/sampler";
import { PhiPState } from "../../packages/sampler/src/design/phi-p-state.js";
import { latinHypercube } from "../../packages/sampler/src/design/latin-hypercube.js";

// The incremental φp sums of the ESE search, checked against the direct metric (phiP): both are the
// Morris–Mitchell (1995) φp of the same points, so they agree up to float64 rounding of many terms.

describe("PhiPState (O(n) φp updates under column exchanges)", () => {
  for (const p of [50, 5, 16]) {
    it(`matrix and matrix-free modes give φp after an exchange equal to phiP of the exchanged design (p = ${p})`, () => {
      const rng = seedrandom(`ese-${p}`);
      const start = latinHypercube(40, 4, rng, p !== 16);
      const withMatrix = new PhiPState(start, 4, p);
      const matrixFree = new PhiPState(start, 4, p, 0); // limit 0: always recompute rows from coordinates
      for (let t = 0; t < 300; t++) {
        const a = Math.floor(rng() * 40);
        const b = (a + 1 + Math.floor(rng() * 39)) % 40;
        const k = t % 4;
        const s1 = withMatrix.sumAfterExchange(a, b, k);
        const s2 = matrixFree.sumAfterExchange(a, b, k);
        const swapped = withMatrix.points();
        const ra = swapped[a] as number[];
        const rb = swapped[b] as number[];
        [ra[k], rb[k]] = [rb[k] as number, ra[k] as number];
        const direct = phiP(swapped, p);
        // The candidate sum S + Δ carries about n·ε·S of absolute rounding (n = 40, ε = 2.2e-16: ≈ 1e-14·S),
        // growing over up to 25 incremental updates between re-sums, and relative to S_try it is scaled by
        // S / S_try; phiP adds its own rounding. Bound (derived, with margin): 1e-13 · max(1, S / S_try).
        const tol = 1e-13 * Math.max(1, withMatrix.total / s1) * direct;
        expect(Math.abs(withMatrix.phi(s1) - direct)).toBeLessThanOrEqual(tol);
        expect(Math.abs(matrixFree.phi(s2) - direct)).toBeLessThanOrEqual(tol);
        if (rng() < 0.5) {
          withMatrix.exchange(a, b, k, s1);
          matrixFree.exchange(a, b, k, s2);
        }
        if (t % 25 === 24) {
          // As the ESE search does after each batch of exchanges.
          withMatrix.resum();
          matrixFree.recompute();
        }
      }
      const points = withMatrix.points();
      // The current design's sum stays accurate (re-summed after large drops): 1e-12 relative on φp.
      expect(Math.abs(withMatrix.phi() - phiP(points, p)) / phiP(points, p)).toBeLessThan(1e-12);
      expect(Math.abs(matrixFree.phi() - phiP(points, p)) / phiP(points, p)).toBeLessThan(1e-12);
      expect(matrixFree.points()).toEqual(points);
      expect(isLatin(points)).toBe(true);
      expect(Math.abs(withMatrix.phi(withMatrix.resum()) - phiP(points, p)) / phiP(points, p)).toBeLessThan(1e-12);
      expect(Math.abs(matrixFree.phi(matrixFree.recompute()) - phiP(points, p)) / phiP(points, p)).toBeLessThan(1e-12);
    });
  }
});
