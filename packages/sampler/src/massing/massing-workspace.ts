/**
 * Reusable scratch buffers for one massing evaluation, grown on demand so that repeated
 * evaluations allocate nothing in their hot loops. Polygons are interleaved `[x0, y0, x1, y1, …]`.
 */
export class MassingWorkspace {
  /** The parcel, counter-clockwise. */
  parcel = new Float64Array(0);
  /** The buildable area B after the yards. */
  buildable = new Float64Array(0);
  /** The base plate (B, or its coverage inset). */
  base = new Float64Array(0);
  /** The plate of the current floor. */
  plate = new Float64Array(0);
  /** Work buffers for clipping. */
  scratch = new Float64Array(0);
  /** Half-planes of the yards, triples `[a, b, c]`. */
  yardPlanes = new Float64Array(0);
  /** Half-planes of the street lot lines at distance 0 (for the sky plane). */
  streetPlanes = new Float64Array(0);
  /** Half-planes of the base edges and their shifted copies (coverage solve, sky cut). */
  planes = new Float64Array(0);
  shifted = new Float64Array(0);
  private capacity = 0;

  /** Makes room for a parcel of `n` vertices. */
  ensure(n: number): void {
    if (n <= this.capacity) return;
    const cap = Math.max(n, 8);
    // Each half-plane clip of a convex polygon adds at most one vertex: B ≤ 2n, its inset ≤ 4n,
    // a sky-plane cut of that ≤ 5n vertices.
    const verts = 6 * cap + 8;
    this.parcel = new Float64Array(2 * cap);
    this.buildable = new Float64Array(2 * verts);
    this.base = new Float64Array(2 * verts);
    this.plate = new Float64Array(2 * verts);
    this.scratch = new Float64Array(2 * verts);
    this.yardPlanes = new Float64Array(3 * cap);
    this.streetPlanes = new Float64Array(3 * cap);
    this.planes = new Float64Array(3 * verts);
    this.shifted = new Float64Array(3 * verts);
    this.capacity = cap;
  }
}
