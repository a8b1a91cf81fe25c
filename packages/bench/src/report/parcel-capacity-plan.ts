import type { Point } from "@floorcast/sampler";
import { escapeHtml } from "./escape-html.js";
import { formatNumber } from "./format-number.js";

/** One parcel of the plan: its outline in local metres, its estimated capacity and rank. */
export interface PlanParcel {
  readonly id: string;
  readonly vertices: readonly Point[];
  /** Estimated capacity (null: no feasible design; drawn grey). */
  readonly capacity: number | null;
  readonly rank: number;
}

/** Viridis colour map stops (Smith & van der Walt 2015, matplotlib's `viridis`), low to high. */
const RAMP = ["#440154", "#3b528b", "#21918c", "#5ec962", "#fde725"];

/**
 * The colour of a share along the ramp (piecewise linear between the stops).
 * @param t - share in [0, 1] (clamped).
 * @returns "#rrggbb".
 */
function rampColour(t: number): string {
  const x = Math.min(1, Math.max(0, t)) * (RAMP.length - 1);
  const i = Math.min(RAMP.length - 2, Math.floor(x));
  const f = x - i;
  const c = (s: string, k: number): number => parseInt(s.slice(1 + 2 * k, 3 + 2 * k), 16);
  const mix = [0, 1, 2].map((k) => Math.round(c(RAMP[i]!, k) * (1 - f) + c(RAMP[i + 1]!, k) * f));
  return `#${mix.map((v) => v.toString(16).padStart(2, "0")).join("")}`;
}

/** Area centroid of a simple polygon (shoelace; the vertex mean for a degenerate one). */
function centroid(v: readonly Point[]): Point {
  let a = 0;
  let cx = 0;
  let cy = 0;
  for (let i = 0; i < v.length; i++) {
    const p = v[i]!;
    const q = v[(i + 1) % v.length]!;
    const w = p[0] * q[1] - q[0] * p[1];
    a += w;
    cx += (p[0] + q[0]) * w;
    cy += (p[1] + q[1]) * w;
  }
  if (Math.abs(a) < 1e-12) return [v.reduce((s, p) => s + p[0], 0) / v.length, v.reduce((s, p) => s + p[1], 0) / v.length];
  return [cx / (3 * a), cy / (3 * a)];
}

/**
 * A plan of parcels coloured by their estimated capacity, as inline SVG in a `<figure>`: north up, one scale
 * for both axes, each parcel filled along the viridis ramp from the lowest to the highest capacity (grey
 * without one) and labelled with its id and rank (turned upright on a lot taller than wide), a colour bar with the range and a 10 m-rounded scale bar.
 * @param parcels - the parcels (local metres), ≥ 1.
 * @param caption - what the figure shows (escaped).
 * @param unit - the capacity's label on the colour bar, e.g. "best gfa (m²)".
 * @returns `<figure>` HTML.
 * @throws RangeError when there is no parcel or a parcel has fewer than 3 vertices.
 */
export function parcelCapacityPlan(parcels: readonly PlanParcel[], caption: string, unit: string): string {
  if (!Array.isArray(parcels) || parcels.length === 0) throw new RangeError("parcelCapacityPlan: parcels must hold at least one parcel");
  for (const p of parcels) if (p.vertices.length < 3) throw new RangeError(`parcelCapacityPlan: parcel ${p.id} has fewer than 3 vertices`);
  const all = parcels.flatMap((p) => p.vertices);
  const minX = Math.min(...all.map((p) => p[0]));
  const maxX = Math.max(...all.map((p) => p[0]));
  const minY = Math.min(...all.map((p) => p[1]));
  const maxY = Math.max(...all.map((p) => p[1]));
  const width = 640;
  const pad = 16;
  const scale = (width - 2 * pad) / Math.max(maxX - minX, maxY - minY, 1e-9);
  const plotH = (maxY - minY) * scale;
  const height = Math.ceil(plotH + 2 * pad + 70);
  const sx = (x: number): string => (pad + (x - minX) * scale).toFixed(2);
  const sy = (y: number): string => (pad + (maxY - y) * scale).toFixed(2);
  const values = parcels.map((p) => p.capacity).filter((v): v is number => v !== null && Number.isFinite(v));
  const lo = values.length > 0 ? Math.min(...values) : 0;
  const hi = values.length > 0 ? Math.max(...values) : 1;
  const share = (v: number): number => (hi > lo ? (v - lo) / (hi - lo) : 1);
  const shapes = parcels.map((p) => {
    const fill = p.capacity === null || !Number.isFinite(p.capacity) ? "#bbbbbb" : rampColour(share(p.capacity));
    const pts = p.vertices.map((q: Point) => `${sx(q[0])},${sy(q[1])}`).join(" ");
    const [cx, cy] = centroid(p.vertices);
    // a parcel taller than wide gets its label turned upright, so narrow lots side by side keep theirs apart
    const xs = p.vertices.map((q: Point) => q[0]);
    const ys = p.vertices.map((q: Point) => q[1]);
    const upright = Math.max(...ys) - Math.min(...ys) > Math.max(...xs) - Math.min(...xs);
    const dark = p.capacity !== null && share(p.capacity) < 0.6;
    const title = `${p.id}: rank ${p.rank}, ${unit} ${formatNumber(p.capacity, 5)}`;
    return (
      `<g class="parcel"><title>${escapeHtml(title)}</title><polygon points="${pts}" fill="${fill}" stroke="#222" stroke-width="1"/>` +
      `<text x="${sx(cx)}" y="${sy(cy)}"${upright ? ` transform="rotate(-90 ${sx(cx)} ${sy(cy)})"` : ""} text-anchor="middle" dominant-baseline="middle" font-size="10" fill="${dark ? "#fff" : "#111"}">${escapeHtml(p.id)} · ${p.rank}</text></g>`
    );
  });
  const barY = pad + plotH + 22;
  const stops = RAMP.map((c, i) => `<stop offset="${(i / (RAMP.length - 1)) * 100}%" stop-color="${c}"/>`).join("");
  const metres = Math.max(10, Math.round((maxX - minX) / 4 / 10) * 10);
  const legend = [
    `<defs><linearGradient id="capacity-ramp">${stops}</linearGradient></defs>`,
    `<rect x="${pad}" y="${barY}" width="240" height="12" fill="url(#capacity-ramp)" stroke="#222" stroke-width="0.5"/>`,
    `<text x="${pad}" y="${barY + 26}" font-size="11">${escapeHtml(formatNumber(lo, 4))}</text>`,
    `<text x="${pad + 240}" y="${barY + 26}" font-size="11" text-anchor="end">${escapeHtml(formatNumber(hi, 4))}</text>`,
    `<text x="${pad + 120}" y="${barY - 4}" font-size="11" text-anchor="middle">${escapeHtml(unit)}</text>`,
    `<line x1="${width - pad - metres * scale}" y1="${barY + 6}" x2="${width - pad}" y2="${barY + 6}" stroke="#222" stroke-width="2"/>`,
    `<text x="${width - pad - (metres * scale) / 2}" y="${barY + 22}" font-size="11" text-anchor="middle">${metres} m</text>`,
  ];
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" class="parcel-capacity-plan" width="${width}" height="${height}" viewBox="0 0 ${width} ${height}" role="img" aria-label="${escapeHtml(unit)} by parcel">${shapes.join("")}${legend.join("")}</svg>`;
  return `<figure>\n${svg}\n<figcaption>${escapeHtml(caption)}</figcaption>\n</figure>`;
}
