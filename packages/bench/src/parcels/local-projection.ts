import proj4 from "proj4";

/** Converts between a parcel file's coordinates and local metres. */
export interface LocalProjection {
  /** File coordinates → metres. */
  forward(p: readonly [number, number]): [number, number];
  /** Metres → file coordinates. */
  inverse(p: readonly [number, number]): [number, number];
}

/** The identity, for files already in a projected (metre) coordinate system. */
export const METRES: LocalProjection = {
  forward: (p) => [p[0], p[1]],
  inverse: (p) => [p[0], p[1]],
};

/**
 * A transverse Mercator projection on the WGS 84 ellipsoid centred on (lon0, lat0), scale 1 on its
 * central meridian (proj4 `+proj=tmerc`; Snyder 1987, "Map Projections — A Working Manual", §8): within
 * a kilometre of the centre, lengths are true to about 1e-8 (the scale grows as 1 + x²/(2R²); derived),
 * so parcel areas in metres are the ground areas a survey gives.
 * @param lon0 - central meridian, degrees.
 * @param lat0 - latitude of origin, degrees.
 * @returns the projection (file coordinates are [longitude, latitude] in degrees, RFC 7946 §3.1.1).
 */
export function localTransverseMercator(lon0: number, lat0: number): LocalProjection {
  const def = `+proj=tmerc +lat_0=${lat0} +lon_0=${lon0} +k=1 +x_0=0 +y_0=0 +ellps=WGS84 +units=m +no_defs`;
  const converter = proj4("WGS84", def);
  return {
    forward: (p) => converter.forward([p[0], p[1]]) as [number, number],
    inverse: (p) => converter.inverse([p[0], p[1]]) as [number, number],
  };
}
