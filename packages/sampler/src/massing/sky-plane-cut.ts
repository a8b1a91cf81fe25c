import { clipHalfPlanes } from "../geometry/clip-half-planes.js";
import type { MassingWorkspace } from "./massing-workspace.js";

/**
 * Cuts a floor plate by the sky exposure plane: keeps the points at perpendicular distance ≥ d
 * from every street lot line (d = (z − startHeight) / ratio at the floor's top z; the plane's
 * definition, e.g. New York City Zoning Resolution §12-10 "sky exposure plane").
 * @param ws - workspace; `ws.streetPlanes` holds the street lines' inward half-planes at distance 0.
 * @param base - the uncut plate (interleaved, counter-clockwise, convex).
 * @param m - number of vertices of `base`.
 * @param streets - number of street lot lines.
 * @param d - required distance from the street lines.
 * @returns the number of vertices of the cut plate, written to `ws.plate` (0: empty).
 */
export function skyPlaneCut(ws: MassingWorkspace, base: Float64Array, m: number, streets: number, d: number): number {
  const src = ws.streetPlanes;
  const dst = ws.shifted;
  for (let j = 0; j < streets; j++) {
    dst[3 * j] = src[3 * j]!;
    dst[3 * j + 1] = src[3 * j + 1]!;
    dst[3 * j + 2] = src[3 * j + 2]! + d;
  }
  return clipHalfPlanes(base, m, dst, streets, ws.plate, ws.scratch);
}
