/**
 * Speed of the exact massing evaluator on the demo's quad-parcel spaces (the three zones of the
 * invented district Quillmere, sampled uniformly from seeded draws), one core, one process.
 * Prints evaluations per CPU-second per zone side by side, with and without plate output, and the ratio
 * to the 50,000/s aim; then, in the same run, the same zones' controls on non-convex lots of four
 * families (L-shaped, flag, notched, star-shaped; at most 12 corners) against the 20,000/s aim, and the
 * convex ÷ non-convex ratio. A script, not a test: run `npm run bench:massing` after `npm run build`.
 */
import seedrandom from "seedrandom";
import { evaluateMassing, quadParcel } from "@floorcast/sampler";
import type { MassingInput, Parcel } from "@floorcast/sampler";
import { SIMPLE_LOT_FAMILIES, simpleLot } from "./simple-lot-families.js";
import { FLOORCAST_CAUTION } from "../floorcast-caution.js";

const AIM = 50_000;
const NON_CONVEX_AIM = 20_000;
const CASES = 20_000;
const SECONDS = Number(process.env.FLOORCAST_BENCH_SECONDS ?? "1");

type Draw = (lo: number, hi: number) => number;

/** Demo-like zones: ranges follow datasets/scenarios (Larkspur Terraces, Ferrow Corner, Quillmere Core). */
const ZONES: Record<string, (u: Draw, pick: <T>(xs: T[]) => T) => MassingInput> = {
  "Larkspur Terraces": (u, pick) => ({
    parcel: quadParcel({ frontage: u(5, 18), depth: u(18, 42) }),
    setbacks: { front: u(2, 7), side: u(0.6, 3.5), rear: u(3, 9) },
    floorHeight: pick([2.9, 3.1, 3.3]),
    maxHeight: u(6, 13),
    maxFar: u(0.5, 1.6),
    maxCoverage: 0.5,
    minPlateWidth: 3.5,
    minPlateArea: 30,
  }),
  "Ferrow Corner": (u) => ({
    parcel: quadParcel({ frontage: u(12, 40), depth: u(18, 45), skew: u(-15, 15), corner: "right" }),
    setbacks: { front: u(0, 3), side: 0, rear: u(3, 8), street: u(0, 3) },
    floorHeight: 3.5,
    maxHeight: u(12, 32),
    skyPlane: { startHeight: u(7, 16), ratio: u(0.8, 3) },
    maxFar: u(1.5, 5),
    minPlateWidth: 6,
    minPlateArea: 80,
  }),
  "Quillmere Core": (u, pick) => {
    const frontage = u(20, 60);
    return {
      parcel: quadParcel({ frontage, depth: u(25, 60), rearWidth: frontage * u(0.6, 1.4), skew: u(-10, 10) }),
      setbacks: { front: 0, side: 0, rear: u(0, 6) },
      floorHeight: pick([3.5, 3.9, 4.2]),
      maxHeight: u(25, 90),
      maxFar: u(3, 12),
      maxCoverage: u(0.4, 0.9),
      minPlateWidth: 8,
      minPlateArea: Math.round(u(100, 400)),
    };
  },
};

/**
 * Non-convex draws: each zone's controls in turn, on a lot of the family (rotated at random). The
 * zone's own parcel is drawn and discarded, so the controls follow the same distributions.
 */
function nonConvexDraws(family: (typeof SIMPLE_LOT_FAMILIES)[number]): MassingInput[] {
  const rng = seedrandom(`massing-speed:non-convex:${family}`);
  const u: Draw = (lo, hi) => lo + (hi - lo) * rng();
  const pick = <T>(xs: T[]): T => xs[Math.floor(rng() * xs.length)]!;
  const zones = Object.keys(ZONES);
  return Array.from({ length: CASES }, (_, i) => {
    const controls = ZONES[zones[i % zones.length]!]!(u, pick);
    const lot = simpleLot(family, u);
    const th = u(0, 2 * Math.PI);
    const parcel: Parcel = {
      vertices: lot.vertices.map(([x, y]) => [x * Math.cos(th) - y * Math.sin(th), x * Math.sin(th) + y * Math.cos(th)]),
      lotLines: lot.lotLines,
    };
    return { ...controls, parcel };
  });
}

function draws(zone: string): MassingInput[] {
  const rng = seedrandom(`massing-speed:${zone}`);
  const u: Draw = (lo, hi) => lo + (hi - lo) * rng();
  const pick = <T>(xs: T[]): T => xs[Math.floor(rng() * xs.length)]!;
  return Array.from({ length: CASES }, () => ZONES[zone]!(u, pick));
}

/**
 * Evaluations per CPU-second of this process (user + system time, so other jobs on a shared machine
 * slow the figure less than wall-clock time would) over at least SECONDS of CPU time, after one
 * warm-up pass.
 */
function rate(inputs: MassingInput[], plates: boolean): { perSecond: number; checksum: number } {
  let checksum = 0;
  for (const x of inputs) checksum += evaluateMassing(x, { plates }).gfa;
  let n = 0;
  const t0 = process.cpuUsage();
  let elapsed = 0;
  while (elapsed < SECONDS) {
    for (const x of inputs) checksum += evaluateMassing(x, { plates }).gfa;
    n += inputs.length;
    const t = process.cpuUsage(t0);
    elapsed = (t.user + t.system) / 1e6;
  }
  return { perSecond: n / elapsed, checksum };
}

const rows: string[][] = [["zone", "evals/s", "× aim", "evals/s (plates)", "plates ÷ plain", "mean floors"]];
const byZone = Object.keys(ZONES).map((zone) => [zone, draws(zone)] as const);
const all: MassingInput[] = byZone.flatMap(([, inputs]) => inputs);
// Warm the JIT on every zone before timing any of them.
rate(all, false);
rate(all, true);
for (const [zone, inputs] of byZone) {
  const plain = rate(inputs, false);
  const withPlates = rate(inputs, true);
  const floors = inputs.reduce((s, x) => s + evaluateMassing(x).floors, 0) / inputs.length;
  rows.push([
    zone,
    plain.perSecond.toFixed(0),
    (plain.perSecond / AIM).toFixed(1),
    withPlates.perSecond.toFixed(0),
    (withPlates.perSecond / plain.perSecond).toFixed(2),
    floors.toFixed(1),
  ]);
}
const mixed = rate(all, false);
rows.push(["all three, mixed", mixed.perSecond.toFixed(0), (mixed.perSecond / AIM).toFixed(1), "", "", ""]);

// Non-convex lots, same zones' controls, measured in the same run.
const ncRows: string[][] = [["non-convex family", "evals/s", "× aim", "evals/s (plates)", "plates ÷ plain", "mean floors"]];
const byFamily = SIMPLE_LOT_FAMILIES.map((family) => [family, nonConvexDraws(family)] as const);
const allNc: MassingInput[] = byFamily.flatMap(([, inputs]) => inputs);
rate(allNc, false);
rate(allNc, true);
for (const [family, inputs] of byFamily) {
  const plain = rate(inputs, false);
  const withPlates = rate(inputs, true);
  const floors = inputs.reduce((s, x) => s + evaluateMassing(x).floors, 0) / inputs.length;
  ncRows.push([
    family,
    plain.perSecond.toFixed(0),
    (plain.perSecond / NON_CONVEX_AIM).toFixed(1),
    withPlates.perSecond.toFixed(0),
    (withPlates.perSecond / plain.perSecond).toFixed(2),
    floors.toFixed(1),
  ]);
}
const mixedNc = rate(allNc, false);
ncRows.push(["all four, mixed", mixedNc.perSecond.toFixed(0), (mixedNc.perSecond / NON_CONVEX_AIM).toFixed(1), "", "", ""]);

function print(table: string[][]): void {
  const widths = table[0]!.map((_, j) => Math.max(...table.map((r) => r[j]!.length)));
  for (const r of table) process.stdout.write(`${r.map((c, j) => (j === 0 ? c.padEnd(widths[j]!) : c.padStart(widths[j]!))).join("  ")}\n`);
}
process.stdout.write(
  `floorcast massing speed — ${CASES} seeded draws per zone or family, ≥ ${SECONDS} CPU-s per cell, evaluations per CPU-second, one core, Node ${process.version}\n` +
    `aims: ${AIM} evaluations/s on convex lots, ${NON_CONVEX_AIM} on non-convex lots (≤ 12 corners)\n\n`,
);
print(rows);
process.stdout.write("\n");
print(ncRows);
process.stdout.write(
  `\nconvex ÷ non-convex (mixed, plain): ${(mixed.perSecond / mixedNc.perSecond).toFixed(1)}× — ${mixed.perSecond.toFixed(0)} vs ${mixedNc.perSecond.toFixed(0)} evaluations per CPU-second, side by side in this run\n`,
);
console.log(`\n${FLOORCAST_CAUTION}`);
