import { mkdtemp, readFile, rm } from "node:fs/promises";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { zoningTableSchema } from "./parcel-file-schema.js";
import type { ParcelRankingReport } from "./parcel-ranking.js";
import { rankParcelCollection } from "./rank-parcel-collection.js";
import type { RankParcelsOptions } from "./rank-parcels.js";

/** The demo's parcel files as shipped with the package (datasets/parcels, copied at build time). */
export const DEFAULT_PARCELS_DIR = fileURLToPath(new URL("../demo/parcels/", import.meta.url));

/**
 * The demo's parcel ranking: the Quillmere parcel file (quillmere-parcels.geojson, its zoning table and street
 * lines, street distance 8 m) ranked by the most gfa on both routes, particle swarm with `budget` evaluations per
 * parcel, seed 1, the surrogate a GP with 2 restarts (the demo's quick fit) trained on two thirds of the parcels,
 * its files in a temporary folder removed afterwards.
 * @param budget - evaluations per parcel (default 100).
 * @param dir - the folder holding the three files (default {@link DEFAULT_PARCELS_DIR}).
 * @param onProgress - progress per stage, as rankParcels reports it.
 * @returns the ranking report (for the bench report's plan).
 */
export async function rankDemoParcels(budget = 100, dir = DEFAULT_PARCELS_DIR, onProgress?: RankParcelsOptions["onProgress"]): Promise<ParcelRankingReport> {
  const json = async (name: string): Promise<unknown> => JSON.parse(await readFile(join(dir, name), "utf8")) as unknown;
  const streets = (await json("quillmere-streets.geojson")) as { features: { geometry: { type: string; coordinates: unknown } }[] };
  const lines = streets.features.flatMap((f) => (f.geometry.type === "LineString" ? [f.geometry.coordinates] : (f.geometry.coordinates as unknown[]))) as [number, number][][];
  const work = await mkdtemp(join(tmpdir(), "floorcast-demo-parcels-"));
  try {
    const ranked = await rankParcelCollection(
      await json("quillmere-parcels.geojson"),
      "quillmere-parcels.geojson",
      { coordinates: "lonlat", zoning: zoningTableSchema.parse(await json("quillmere-zoning.json")), streets: lines, streetDistance: 8, plates: false },
      { route: "both", budget, seed: 1, optimizer: "pso", surrogate: { dir: work, model: "gp", fitOptions: { restarts: "2" } }, ...(onProgress ? { onProgress } : {}) },
    );
    return ranked.report;
  } finally {
    await rm(work, { recursive: true, force: true });
  }
}
