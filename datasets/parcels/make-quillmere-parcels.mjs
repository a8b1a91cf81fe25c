// Regenerates the demo parcels of Quillmere, an invented district. The coordinates are placed in the
// open South Atlantic (about 38° S, 25° W, over deep ocean), where nobody's real parcels are.
// Run from the repository root after `npm ci`: node datasets/parcels/make-quillmere-parcels.mjs
import { writeFileSync } from "node:fs";
import { createRequire } from "node:module";

const require = createRequire(new URL("../../packages/bench/package.json", import.meta.url));
const proj4 = require("proj4");
const LON0 = -25.0;
const LAT0 = -38.0;
const tm = proj4("WGS84", `+proj=tmerc +lat_0=${LAT0} +lon_0=${LON0} +k=1 +x_0=0 +y_0=0 +ellps=WGS84 +units=m +no_defs`);
const round = (v) => Math.round(v * 1e9) / 1e9;
const toLonLat = (ring) => {
  const out = ring.map(([x, y]) => tm.inverse([x, y]).map(round));
  out.push(out[0]);
  return out;
};

// Harrow Lane runs east along y = 0; Tallis Row runs north along x = 0. Lot fronts sit 5 m back.
const lots = [
  { id: "QM-001", zone: "QM-R1", ring: [[5, 5], [25, 5], [25, 45], [5, 45]] },
  { id: "QM-002", zone: "QM-R1", ring: [[25, 5], [43, 5], [43, 45], [25, 45]] },
  {
    id: "QM-003", zone: "QM-R1", ring: [[43, 5], [63, 5], [63, 28], [54, 28], [54, 45], [43, 45]],
    lotLines: ["front", "side", "rear", "side", "rear", "side"],
  },
  { id: "QM-004", zone: "QM-R1", ring: [[63, 5], [83, 5], [86, 45], [63, 45]] },
  { id: "QM-005", zone: "QM-MX", ring: [[83, 5], [90, 5], [90, 12], [97, 12], [97, 5], [110, 5], [110, 45], [86, 45]] },
  { id: "QM-006", zone: "QM-MX", ring: [[110, 5], [128, 5], [128, 45], [110, 45]] },
  { id: "QM-007", zone: "QM-MX", ring: [[128, 5], [134, 5], [134, 45], [160, 45], [160, 80], [110, 80], [110, 45], [128, 45]] },
  { id: "QM-008", zone: "QM-MX", ring: [[134, 5], [160, 5], [160, 45], [134, 45]] },
  { id: "QM-009", zone: "QM-C", ring: [[160, 5], [200, 5], [200, 60], [182, 60], [182, 45], [160, 45]] },
  { id: "QM-010", zone: "QM-C", ring: [[200, 5], [240, 5], [244, 50], [200, 60]] },
  { id: "QM-011", zone: "QM-C", ring: [[240, 5], [275, 5], [275, 70], [258, 70], [258, 40], [244, 50]] },
  { id: "QM-012", zone: "QM-R1", ring: [[5, 45], [30, 45], [30, 80], [5, 80]] },
];

const parcels = {
  type: "FeatureCollection",
  name: "Quillmere demo parcels (invented district; coordinates over open ocean)",
  features: lots.map((l) => ({
    type: "Feature",
    id: l.id,
    properties: { zone: l.zone, ...(l.lotLines ? { lotLines: l.lotLines } : {}) },
    geometry: { type: "Polygon", coordinates: [toLonLat(l.ring)] },
  })),
};
const line = (pts) => {
  const c = pts.map(([x, y]) => tm.inverse([x, y]).map(round));
  return { type: "LineString", coordinates: c };
};
const streets = {
  type: "FeatureCollection",
  name: "Quillmere demo street centre lines",
  features: [
    { type: "Feature", properties: { name: "Harrow Lane" }, geometry: line([[-20, 0], [300, 0]]) },
    { type: "Feature", properties: { name: "Tallis Row" }, geometry: line([[0, -20], [0, 120]]) },
  ],
};
const zoning = {
  zones: {
    "QM-R1": { setbacks: { front: 4.5, side: 1.5, rear: 6 }, floorHeight: 3.1, maxHeight: 11, maxFar: 1.2, maxCoverage: 0.5, minPlateWidth: 3.5, minPlateArea: 30 },
    "QM-MX": { setbacks: { front: 2, side: 0, rear: 5, street: 2 }, floorHeight: 3.5, maxHeight: 24, maxFar: 3, skyPlane: { startHeight: 12, ratio: 1.5 }, minPlateWidth: 6, minPlateArea: 80 },
    "QM-C": { setbacks: { front: 0, side: 0, rear: 4 }, floorHeight: 3.9, maxHeight: 45, maxFar: 6, maxCoverage: 0.8, minPlateWidth: 8, minPlateArea: 150 },
  },
};
const here = new URL(".", import.meta.url);
writeFileSync(new URL("quillmere-parcels.geojson", here), `${JSON.stringify(parcels, null, 1)}\n`);
writeFileSync(new URL("quillmere-streets.geojson", here), `${JSON.stringify(streets, null, 1)}\n`);
writeFileSync(new URL("quillmere-zoning.json", here), `${JSON.stringify(zoning, null, 2)}\n`);
