import type { LotLine, Parcel, Point } from "./massing-types.js";

/** Parameters of {@link quadParcel} (metres, degrees). */
export interface QuadParcelOptions {
  /** Width W of the front lot line, > 0. */
  readonly frontage: number;
  /** Depth D from the front to the rear lot line, > 0. */
  readonly depth: number;
  /** Width R of the rear lot line, > 0 (default W). */
  readonly rearWidth?: number;
  /** Skew of the parcel in degrees, |skew| < 90 (default 0): the rear line shifts by D·tan(skew). */
  readonly skew?: number;
  /** Which side line faces a street on a corner lot (default "none"). */
  readonly corner?: "none" | "left" | "right";
}

function check(field: string, v: unknown, min: number, max: number, inclusive: boolean): number {
  if (typeof v !== "number") throw new TypeError(`quadParcel: ${field} must be a number, got ${typeof v}`);
  if (!Number.isFinite(v)) throw new RangeError(`quadParcel: ${field} must be finite, got ${v}`);
  if (inclusive ? !(v > min && v < max) : !(v > min)) {
    throw new RangeError(
      `quadParcel: ${field} must be ${inclusive ? `between ${min} and ${max} (exclusive)` : `> ${min}`}, got ${v}`,
    );
  }
  return v;
}

/**
 * The demo's parcel family: a trapezoid with its front line on the x axis, vertices
 * (0, 0), (W, 0), (x0 + R, D), (x0, D) with x0 = (W − R)/2 + D·tan(skew), counter-clockwise, and lot
 * lines front, right side, rear, left side; `corner: "right"` or `"left"` makes that side a street
 * line. Always convex (two parallel sides of positive length).
 * @param options - frontage W, depth D, rearWidth R (default W), skew in degrees (default 0), corner.
 * @returns the parcel.
 * @throws TypeError for a wrong type, RangeError for a bad value (message starts `quadParcel: <field>`).
 */
export function quadParcel(options: QuadParcelOptions): Parcel {
  if (typeof options !== "object" || options === null) {
    throw new TypeError(`quadParcel: options must be an object, got ${String(options)}`);
  }
  const w = check("frontage", options.frontage, 0, Infinity, false);
  const d = check("depth", options.depth, 0, Infinity, false);
  const r = options.rearWidth === undefined ? w : check("rearWidth", options.rearWidth, 0, Infinity, false);
  const skew = options.skew === undefined ? 0 : check("skew", options.skew, -90, 90, true);
  const corner = options.corner ?? "none";
  if (typeof corner !== "string") throw new TypeError(`quadParcel: corner must be a string, got ${typeof corner}`);
  if (corner !== "none" && corner !== "left" && corner !== "right") {
    throw new RangeError(`quadParcel: corner must be "none", "left" or "right", got ${JSON.stringify(corner)}`);
  }
  const x0 = (w - r) / 2 + d * Math.tan((skew * Math.PI) / 180);
  const vertices: Point[] = [
    [0, 0],
    [w, 0],
    [x0 + r, d],
    [x0, d],
  ];
  const lotLines: LotLine[] = [
    "front",
    corner === "right" ? "street" : "side",
    "rear",
    corner === "left" ? "street" : "side",
  ];
  return { vertices, lotLines };
}
