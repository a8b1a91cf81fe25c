import fc from "fast-check";

/**
 * Property tests run from a fixed seed so a CI run is reproducible; set FLOORCAST_FC_SEED to explore
 * other seeds locally (a failure prints its seed and path for replay).
 */
const seed = Number(process.env.FLOORCAST_FC_SEED ?? 20261201);
fc.configureGlobal({ seed: Number.isFinite(seed) ? seed : 20261201 });
