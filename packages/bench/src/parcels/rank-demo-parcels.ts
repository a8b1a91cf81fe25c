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

/** Options of {@link rankDemoParcels}. */
export interface DemoParcelRankingOptions {
  /** Evaluations per parcel (default 100). */
  readonly budget?: number;
  /** Seed (default 1). */
  readonly seed?: number;
  /** The folder holding the three files (default {@link DEFAULT_PARCELS_DIR}). */
  readonly dir?: string;
  /** The demo's quick GP fit (2 restarts; default true); false fits with `floorcast fit`'s defaults. */
  readonly quickFit?: boolean;
  readonly onProgress?: RankParcelsOptions["onProgress"];
}

/**
 * The demo's parcel ranking: the Quillmere parcel file (quillmere-parcels.geojson, its zoning table and street
 * lines, street distance 8 m) ranked by the most gfa on both routes with particle swarm, the surrogate a GP
 * trained on two thirds of the parcels, its files in a temporary folder removed afterwards.
 * @param options - budget, seed, folder, fit and progress.
 * @returns the ranking report (for the bench report's plan).
 */
export async function rankDemoParcels(options: DemoParcelRankingOptions = {}): Promise<ParcelRankingReport> {
  const dir = options.dir ?? DEFAULT_PARCELS_DIR;
  const json = async (name: string): Promise<unknown> => JSON.parse(await readFile(join(dir, name), "utf8")) as unknown;
  const streets = (await json("quillmere-streets.geojson")) as { features: { geometry: { type: string; coordinates: unknown } }[] };
  const lines = streets.features.flatMap((f) => (f.geometry.type === "LineString" ? [f.geometry.coordinates] : (f.geometry.coordinates as unknown[]))) as [number, number][][];
  const work = await mkdtemp(join(tmpdir(), "floorcast-demo-parcels-"));
  try {
    const fit = options.quickFit === false ? {} : { fitOptions: { restarts: "2" } };
    const ranked = await rankParcelCollection(
      await json("quillmere-parcels.geojson"),
      "quillmere-parcels.geojson",
      { coordinates: "lonlat", zoning: zoningTableSchema.parse(await json("quillmere-zoning.json")), streets: lines, streetDistance: 8, plates: false },
      { route: "both", budget: options.budget ?? 100, seed: options.seed ?? 1, optimizer: "pso", surrogate: { dir: work, model: "gp", ...fit }, ...(options.onProgress ? { onProgress: options.onProgress } : {}) },
    );
    return ranked.report;
  } finally {
    await rm(work, { recursive: true, force: true });
  }
}
