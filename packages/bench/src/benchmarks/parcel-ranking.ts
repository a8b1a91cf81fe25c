/**
 * How well the two routes of `floorcast rank-parcels` rank parcels, against the exact route, beside the no-search
 * baseline (the objective at the zone's own controls), in one run: (a) the demo parcel file of Quillmere, as the
 * command ranks it by default; (b) 30 generated lots of one zone (Quillmere's mixed-use zone: sky exposure plane,
 * plate minimums), rectangles and L-shaped, flag, notched and star-shaped lots, where the zone does not decide the
 * order. Seeds 1–3 each. Prints Spearman's rho, Kendall's tau-b, top-k overlap and the exact evaluations each route
 * spent, side by side. A script, not a test: `npm run bench:parcel-ranking` after `npm run build`.
 */
import { mkdtemp, rm } from "node:fs/promises";
import { readFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import seedrandom from "seedrandom";
import { quadParcel, type MassingInput } from "@floorcast/sampler";
import { FLOORCAST_CAUTION } from "../floorcast-caution.js";
import { zoningTableSchema } from "../parcels/parcel-file-schema.js";
import type { ParcelRanking, RankAgreement } from "../parcels/parcel-ranking.js";
import { DEFAULT_PARCELS_DIR, rankDemoParcels } from "../parcels/rank-demo-parcels.js";
import { rankParcels } from "../parcels/rank-parcels.js";
import { SIMPLE_LOT_FAMILIES, simpleLot } from "./simple-lot-families.js";

const BUDGET = 150;
const SEEDS = [1, 2, 3];
const LOTS = 30;

/** 30 lots of one zone: a fifth rectangles, the rest from the four non-convex families (seeded). */
function oneZoneLots(): { id: string; input: MassingInput }[] {
  const zoning = zoningTableSchema.parse(JSON.parse(readFileSync(join(DEFAULT_PARCELS_DIR, "quillmere-zoning.json"), "utf8")));
  const zone = zoning.zones["QM-MX"]!;
  const rng = seedrandom("parcel-ranking:one-zone");
  const u = (lo: number, hi: number): number => lo + (hi - lo) * rng();
  return Array.from({ length: LOTS }, (_, i) => {
    const family = i % 5 === 0 ? null : SIMPLE_LOT_FAMILIES[i % 4]!;
    const parcel = family === null ? quadParcel({ frontage: u(12, 40), depth: u(20, 45) }) : simpleLot(family, u);
    return { id: `MX-${String(i + 1).padStart(2, "0")}`, input: { ...zone, parcel } as MassingInput };
  });
}

const f3 = (v: number | undefined): string => (v === undefined || !Number.isFinite(v) ? "—" : v.toFixed(3));
const cell = (a: RankAgreement | null | undefined): string => (a ? `${f3(a.spearman)} / ${f3(a.kendall)} / ${Math.round(a.topOverlap * 100)}%` : "—");

function row(file: string, seed: number, r: ParcelRanking, seconds: number): string {
  const a = r.agreement;
  const e = r.evaluations;
  return [file, String(seed), cell(a?.zone), cell(a?.reevaluated), cell(a?.predicted), String(e.zone), String(e.exact), String(e.surrogate?.total), seconds.toFixed(1)].join(" | ");
}

async function main(): Promise<void> {
  console.log(`Parcel ranking against the exact route (PSO, ${BUDGET} evaluations per parcel); cells: Spearman rho / Kendall tau-b / top-3 overlap.`);
  console.log(["file", "seed", "zone's controls, no search", "surrogate, re-evaluated", "surrogate, predicted", "evals: zone", "evals: exact route", "evals: surrogate route", "s (wall)"].join(" | "));
  for (const seed of SEEDS) {
    const t0 = performance.now();
    const demo = await rankDemoParcels({ budget: BUDGET, seed, quickFit: false });
    console.log(row("quillmere-parcels (12)", seed, demo.ranking, (performance.now() - t0) / 1000));
  }
  const lots = oneZoneLots();
  for (const seed of SEEDS) {
    const dir = await mkdtemp(join(tmpdir(), "floorcast-bench-rank-"));
    try {
      const t0 = performance.now();
      const r = await rankParcels(lots, { route: "both", budget: BUDGET, seed, surrogate: { dir } });
      console.log(row(`one zone, QM-MX (${LOTS})`, seed, r, (performance.now() - t0) / 1000));
    } finally {
      await rm(dir, { recursive: true, force: true });
    }
  }
  console.log(FLOORCAST_CAUTION);
}

await main();
