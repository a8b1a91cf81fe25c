import { existsSync, mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import proj4 from "proj4";
import { claimOutput, FLOORCAST_CAUTION } from "@floorcast/sampler";
import { expectOnlyCaution } from "./helpers/only-caution.js";
import { referenceAvailable, runReference } from "../reference/python.js";
import { runCli } from "./run-cli.js";

const dir = mkdtempSync(join(tmpdir(), "floorcast-parcels-"));
const hasPyproj = referenceAvailable(["pyproj"]);

// Test parcels built in local metres and placed over open ocean (about 38.2° S, 25.3° W) through a
// transverse Mercator projection of our own (proj4 2.22.0); nobody's real parcels.
const LON0 = -25.3;
const LAT0 = -38.2;
const tm = proj4("WGS84", `+proj=tmerc +lat_0=${LAT0} +lon_0=${LON0} +k=1 +x_0=0 +y_0=0 +ellps=WGS84 +units=m +no_defs`);
const lonLat = (ring: [number, number][]): number[][] => {
  const out = ring.map((p) => tm.inverse(p) as number[]);
  out.push(out[0]!);
  return out;
};
const controls = { setbacks: { front: 3, side: 1, rear: 4 }, floorHeight: 3, maxHeight: 9 };
const rect: [number, number][] = [[10, 5], [30, 5], [30, 35], [10, 35]];
const ell: [number, number][] = [[40, 5], [60, 5], [60, 15], [50, 15], [50, 25], [40, 25]];
const parcels = {
  type: "FeatureCollection",
  features: [
    { type: "Feature", id: "rect", properties: { ...controls, lotLines: ["front", "side", "rear", "side"] }, geometry: { type: "Polygon", coordinates: [lonLat(rect)] } },
    { type: "Feature", id: "ell", properties: { zone: "Z1" }, geometry: { type: "Polygon", coordinates: [lonLat(ell)] } },
    { type: "Feature", id: "multi", properties: { ...controls }, geometry: { type: "MultiPolygon", coordinates: [[lonLat(rect)]] } },
    { type: "Feature", id: "nocontrols", properties: { lotLines: ["front", "side", "rear", "side"] }, geometry: { type: "Polygon", coordinates: [lonLat(rect)] } },
    { type: "Feature", id: "bowtie", properties: { ...controls, lotLines: ["front", "side", "rear", "side"] }, geometry: { type: "Polygon", coordinates: [lonLat([[0, 0], [10, 10], [10, 0], [0, 10]])] } },
    { type: "Feature", id: "nofront", properties: { ...controls }, geometry: { type: "Polygon", coordinates: [lonLat([[500, 500], [520, 500], [520, 520], [500, 520]])] } },
  ],
};
const streets = {
  type: "FeatureCollection",
  features: [{ type: "Feature", properties: {}, geometry: { type: "LineString", coordinates: [tm.inverse([-50, 0]), tm.inverse([200, 0])] } }],
};
const zoning = { zones: { Z1: { setbacks: { front: 2, side: 1, rear: 3 }, floorHeight: 3, maxHeight: 10 } } };
writeFileSync(join(dir, "parcels.geojson"), JSON.stringify(parcels));
writeFileSync(join(dir, "streets.geojson"), JSON.stringify(streets));
writeFileSync(join(dir, "zoning.json"), JSON.stringify(zoning));

interface Feature {
  id?: string | number;
  properties: Record<string, unknown>;
  geometry: { type: string; coordinates: number[][][] };
}

describe("floorcast parcels: GeoJSON round trip", async () => {
  const out = join(dir, "out.geojson");
  const run = await runCli([
    "parcels", "--input", join(dir, "parcels.geojson"), "--zoning", join(dir, "zoning.json"),
    "--streets", join(dir, "streets.geojson"), "--street-distance", "6", "--plates", "--out", out,
  ]);
  const result = JSON.parse(readFileSync(out, "utf8")) as { features: Feature[]; fc_caution: string };
  const byId = new Map(result.features.filter((f) => f.properties.fc_kind === undefined).map((f) => [f.id, f]));

  it("computes the good parcels, reports the bad ones in place, exits 1", () => {
    expect(run.code).toBe(1);
    expect(run.err).toMatch(/4 of 6 features could not be evaluated/);
    // the one caution word for word on stdout and in the collection's fc_caution, and no other caution wording
    expect(run.out.trimEnd().split("\n").at(-1)).toBe(FLOORCAST_CAUTION);
    expect(result.fc_caution).toBe(FLOORCAST_CAUTION);
    expectOnlyCaution(readFileSync(out, "utf8"), "parcels GeoJSON");
    expect(byId.get("multi")!.properties.fc_error).toMatch(/geometry must be a Polygon, got "MultiPolygon"/);
    expect(byId.get("nocontrols")!.properties.fc_error).toMatch(/missing controls: setbacks, floorHeight, maxHeight/);
    expect(byId.get("bowtie")!.properties.fc_error).toMatch(/not simple/);
    expect(byId.get("nofront")!.properties.fc_error).toMatch(/no front/);
  });

  it("known areas: the 20 × 30 m lot (600 m², B 414 m²) and the L-shaped lot (300 m², B 173 m²), derived", () => {
    const r = byId.get("rect")!.properties;
    // Derived: a 20 × 30 m rectangle, yards front 3, sides 1, rear 4 → 18 × 23 = 414 m², three 3 m storeys under 9 m.
    expect(r.fc_lotArea as number).toBeCloseTo(600, 5);
    expect(r.fc_buildableArea as number).toBeCloseTo(414, 5);
    expect(r.fc_floors).toBe(3);
    const l = byId.get("ell")!.properties;
    // Derived: the L (0,0)-(20,0)-(20,10)-(10,10)-(10,20)-(0,20) shifted, lot lines inferred from the
    // street (front on it, the two lines facing away rear, the rest side) and zone Z1's yards front 2,
    // side 1, rear 3: B = 18 × 5 + 9 × 3 + 8 × 7 = 173 m² (the README's worked check).
    expect(l.fc_lotLines).toEqual(["front", "side", "rear", "side", "rear", "side"]);
    expect(l.fc_lotLinesInferred).toBe(true);
    expect(l.fc_lotArea as number).toBeCloseTo(300, 5);
    expect(l.fc_buildableArea as number).toBeCloseTo(173, 5);
  });

  it("plates come back in longitude/latitude, one feature per piece and storey", () => {
    const plates = result.features.filter((f) => f.properties.fc_parcel === "rect");
    expect(plates.map((f) => f.properties.fc_floor)).toEqual([1, 2, 3]);
    expect(plates[0]!.properties.fc_kind).toBe("footprint");
    const ring = plates[0]!.geometry.coordinates[0]!;
    // The footprint's corners, projected back to our local metres, are the yards' corners (derived: x 11…29, y 8…31).
    const local = ring.map((p) => tm.forward(p as [number, number]) as number[]);
    const xs = local.map((p) => p[0]!);
    const ys = local.map((p) => p[1]!);
    expect(Math.min(...xs)).toBeCloseTo(11, 4);
    expect(Math.max(...xs)).toBeCloseTo(29, 4);
    expect(Math.min(...ys)).toBeCloseTo(8, 4);
    expect(Math.max(...ys)).toBeCloseTo(31, 4);
  });

  it.skipIf(!hasPyproj)("lot and footprint areas agree with pyproj's geodesic areas (Karney 2013) to 1e-6", () => {
    const rect = byId.get("rect")!;
    const ellF = byId.get("ell")!;
    const foot = result.features.find((f) => f.properties.fc_parcel === "rect" && f.properties.fc_floor === 1)!;
    const { areas } = runReference<{ areas: number[] }>("geodesic_area_pyproj.py", {
      polygons: [rect.geometry.coordinates[0], ellF.geometry.coordinates[0], foot.geometry.coordinates[0]],
    });
    // Tolerance: the local transverse Mercator keeps lengths to ~1e-8 within a kilometre of its centre
    // (scale 1 + x²/2R²; derived); 1e-6 leaves room for it and the 1e-9° rounding of nothing else.
    expect(Math.abs((rect.properties.fc_lotArea as number) - areas[0]!) / areas[0]!).toBeLessThan(1e-6);
    expect(Math.abs((ellF.properties.fc_lotArea as number) - areas[1]!) / areas[1]!).toBeLessThan(1e-6);
    expect(Math.abs((rect.properties.fc_footprintArea as number) - areas[2]!) / areas[2]!).toBeLessThan(1e-6);
  });
});

describe("floorcast parcels: user mistakes", () => {
  it("an existing --out without --force, a bad --coordinates, a non-GeoJSON input: exit 2, one line", async () => {
    const out = join(dir, "exists.geojson");
    writeFileSync(out, "{}");
    for (const args of [
      ["--input", join(dir, "parcels.geojson"), "--out", out],
      ["--input", join(dir, "parcels.geojson"), "--out", join(dir, "x.geojson"), "--coordinates", "feet"],
      ["--input", join(dir, "zoning.json"), "--out", join(dir, "y.geojson")],
    ]) {
      const r = await runCli(["parcels", ...args]);
      expect(r.code).toBe(2);
      expect(r.err.trim().split("\n")).toHaveLength(1);
      expect(r.err).toMatch(/parcels: /);
    }
  });

  it("writes through claimOutput: --force replaces, an input as --out or a held lock is refused before any work, a failed run keeps the previous file", async () => {
    const input = join(dir, "parcels.geojson");
    const before = readFileSync(input, "utf8");
    const out = join(dir, "claimed.geojson");
    writeFileSync(out, "previous\n");
    // an existing file is replaced only with --force, and then through the temporary name: none is left behind
    expect((await runCli(["parcels", "--input", input, "--out", out])).code).toBe(2);
    expect(readFileSync(out, "utf8")).toBe("previous\n");
    const forced = await runCli(["parcels", "--input", input, "--out", out, "--force"]);
    expect(forced.code).toBe(1); // the bowtie and nofront parcels fail in place (first describe)
    expect((JSON.parse(readFileSync(out, "utf8")) as { features: unknown[] }).features.length).toBeGreaterThan(0);
    expect(existsSync(`${out}.partial`)).toBe(false);
    expect(existsSync(`${out}.lock`)).toBe(false);
    // an output that is an input is refused, even with --force, and the input is untouched
    const self = await runCli(["parcels", "--input", input, "--out", input, "--force"]);
    expect(self.code).toBe(2);
    expect(self.err).toMatch(/^floorcast: parcels: .*input/);
    expect(readFileSync(input, "utf8")).toBe(before);
    // a failed run (an input that is not GeoJSON) leaves the previous file as it was
    writeFileSync(out, "previous\n");
    const failed = await runCli(["parcels", "--input", join(dir, "zoning.json"), "--out", out, "--force"]);
    expect(failed.code).toBe(2);
    expect(readFileSync(out, "utf8")).toBe("previous\n");
    expect(existsSync(`${out}.partial`)).toBe(false);
    // a second writer of the same output is refused while the first holds its lock
    const held = await claimOutput(out, { force: true });
    try {
      const second = await runCli(["parcels", "--input", input, "--out", out, "--force"]);
      expect(second.code).toBe(2);
      expect(second.err.trim().split("\n")).toHaveLength(1);
      expect(readFileSync(out, "utf8")).toBe("previous\n");
    } finally {
      await held.release();
    }
  });

  it("the demo parcels of Quillmere evaluate without failures", async () => {
    const out = join(dir, "demo.geojson");
    const base = new URL("../../datasets/parcels/", import.meta.url).pathname;
    const r = await runCli([
      "parcels", "--input", `${base}quillmere-parcels.geojson`, "--zoning", `${base}quillmere-zoning.json`,
      "--streets", `${base}quillmere-streets.geojson`, "--street-distance", "8", "--out", out,
    ]);
    expect(r.code).toBe(0);
    const fc = JSON.parse(readFileSync(out, "utf8")) as { features: Feature[] };
    expect(fc.features).toHaveLength(12);
    expect(fc.features.every((f) => typeof f.properties.fc_gfa === "number")).toBe(true);
  });
});
