import { evaluateMassing, type MassingInput } from "@floorcast/sampler";
import type { TopLevelSpec } from "vega-lite";

const SCHEMA = "https://vega.github.io/schema/vega-lite/v6.json";

type Pt = readonly [number, number];

/** Yard lines: each lot line moved inward by its setback (a dashed line in the plan). */
function yardLines(input: MassingInput): { id: string; x: number; y: number; k: number }[] {
  const v = input.parcel.vertices;
  const n = v.length;
  let area2 = 0;
  for (let i = 0; i < n; i++) area2 += v[i]![0] * v[(i + 1) % n]![1] - v[(i + 1) % n]![0] * v[i]![1];
  const orient = area2 > 0 ? 1 : -1;
  const s = input.setbacks;
  const out: { id: string; x: number; y: number; k: number }[] = [];
  input.parcel.lotLines.forEach((kind, i) => {
    const d = kind === "front" ? s.front : kind === "side" ? s.side : kind === "rear" ? s.rear : (s.street ?? s.front);
    if (!(d > 0)) return;
    const a = v[i]!;
    const b = v[(i + 1) % n]!;
    const len = Math.hypot(b[0] - a[0], b[1] - a[1]);
    const nx = (-orient * (b[1] - a[1])) / len;
    const ny = (orient * (b[0] - a[0])) / len;
    out.push({ id: `yard ${i}`, x: a[0] + d * nx, y: a[1] + d * ny, k: 0 }, { id: `yard ${i}`, x: b[0] + d * nx, y: b[1] + d * ny, k: 1 });
  });
  return out;
}

/** The plates' colours, the same in every layer: ground floor blue, top floor orange. */
const PLATE_COLOR = { field: "id", type: "nominal", title: "plates", scale: { domain: ["ground floor", "top floor"], range: ["#2b6cb0", "#dd6b20"] } } as const;

/**
 * A common top for the section's height axis of drawings compared side by side: 8% above the
 * tallest height limit or building among them.
 * @param inputs - the massing inputs drawn.
 * @returns the top in metres.
 */
export function massingSectionTop(inputs: readonly MassingInput[]): number {
  return Math.max(...inputs.map((i) => Math.max(i.maxHeight, evaluateMassing(i).height))) * 1.08;
}

const ring = (id: string, pts: readonly Pt[]): { id: string; x: number; y: number; k: number }[] =>
  [...pts, pts[0]!].map((p, k) => ({ id, x: p[0], y: p[1], k }));

/**
 * A plan and a section of a massing, drawn with Vega-Lite from the exact evaluator's floor plates
 * (`evaluateMassing(input, { plates: true })`): in plan the parcel, its yard lines (each lot line
 * moved in by its setback), the ground-floor plate and the top plate; in section (across the lot
 * depth) every floor as a band from its plate's front to its back edge, and the height limit.
 * The parcel and yard lines are drawn first, then the top plate, wide and light, and the
 * ground-floor plate over it, thin, so both outlines show where they coincide (with each other, and
 * with a yard line when the yards alone shape the plate). Drawings meant to be compared share their section's vertical
 * scale through `sectionTop` (see {@link massingSectionTop}).
 * @param input - the full massing input.
 * @param title - the drawing's title.
 * @param sectionTop - top of the section's height axis in metres (default this massing's own).
 * @returns a Vega-Lite spec (two panels side by side).
 */
export function massingDrawingSpec(input: MassingInput, title: string, sectionTop = massingSectionTop([input])): TopLevelSpec {
  const r = evaluateMassing(input, { plates: true });
  const plates = r.plates ?? [];
  const lines = [...ring("parcel", input.parcel.vertices), ...yardLines(input)];
  const ground = plates.length > 0 ? ring("ground floor", plates[0]!) : [];
  const topPlate = plates.length > 1 ? ring("top floor", plates[plates.length - 1]!) : [];
  const xs = input.parcel.vertices.map((p) => p[0]);
  const ys = input.parcel.vertices.map((p) => p[1]);
  const span = Math.max(Math.max(...xs) - Math.min(...xs), Math.max(...ys) - Math.min(...ys));
  const size = 240;
  const dom = (v: number[]): [number, number] => {
    const mid = (Math.min(...v) + Math.max(...v)) / 2;
    return [mid - span / 2 - 1, mid + span / 2 + 1];
  };
  const bands = plates.map((pl, k) => ({
    floor: k + 1,
    y0: Math.min(...pl.map((p) => p[1])),
    y1: Math.max(...pl.map((p) => p[1])),
    z0: k * input.floorHeight,
    z1: (k + 1) * input.floorHeight,
  }));
  return {
    $schema: SCHEMA,
    title,
    hconcat: [
      {
        title: "plan",
        width: size,
        height: size,
        layer: [
          { data: { values: lines }, mark: { type: "line", color: "#333" }, encoding: { x: { field: "x", type: "quantitative", scale: { domain: dom(xs) }, title: "x (m)" }, y: { field: "y", type: "quantitative", scale: { domain: dom(ys) }, title: "y (m, front to rear)" }, detail: { field: "id" }, order: { field: "k" }, strokeDash: { condition: { test: "datum.id !== 'parcel'", value: [4, 3] }, value: [1, 0] } } },
          { data: { values: topPlate }, mark: { type: "line", strokeWidth: 6, opacity: 0.6 }, encoding: { x: { field: "x", type: "quantitative" }, y: { field: "y", type: "quantitative" }, detail: { field: "id" }, order: { field: "k" }, color: PLATE_COLOR } },
          { data: { values: ground }, mark: { type: "line", strokeWidth: 2.5 }, encoding: { x: { field: "x", type: "quantitative" }, y: { field: "y", type: "quantitative" }, detail: { field: "id" }, order: { field: "k" }, color: PLATE_COLOR } },
        ],
      },
      {
        title: "section",
        width: size,
        height: size,
        layer: [
          { data: { values: bands }, mark: { type: "rect", color: "#90cdf4", stroke: "#2b6cb0" }, encoding: { x: { field: "y0", type: "quantitative", scale: { domain: [Math.min(...ys), Math.max(...ys)] }, title: "y (m, front to rear)" }, x2: { field: "y1" }, y: { field: "z0", type: "quantitative", scale: { domain: [0, sectionTop] }, title: "height (m)" }, y2: { field: "z1" } } },
          { data: { values: [{ h: input.maxHeight }] }, mark: { type: "rule", color: "#a33", strokeDash: [4, 4] }, encoding: { y: { field: "h", type: "quantitative" } } },
        ],
      },
    ],
  };
}
