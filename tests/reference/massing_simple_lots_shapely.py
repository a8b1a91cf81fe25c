#!/usr/bin/python3
"""Independent reference for floorcast's massing rule on simple (possibly non-convex) lots, with Shapely.

Reads {"cases": [MassingInput, ...]} as JSON on stdin and writes {"results": [...]} on stdout,
one result (lotArea, buildableArea, footprintArea, floors, gfa, facadeLength, limitedBy,
coverageCapped, pieces) per case. Library versions: Debian python3-shapely 1.8.5 (GEOS 3.11),
python3-numpy 1.24.2, python3-scipy 1.10.1 (brentq).

The rule, as the README states it:
- the yard of lot line i (setback s) is the part of the lot inside the strip between the line's
  infinite extension and its parallel s inward, bounded at a re-entrant end of the segment by the
  perpendicular through that corner and unbounded at a convex end, keeping only the piece(s) of that
  intersection that touch the segment; B = lot minus every yard;
- the coverage cap is one uniform inward offset of every edge with mitred corners, solved so that
  the area is maxCoverage x lot area: each piece less the band each edge sweeps moving d inward and,
  at each re-entrant corner, the kite between the moved edges' ends and their lines' crossing;
- above the sky plane's start a storey loses the yards of the street lot lines at depth
  (z - start) / ratio, built by the same yard rule;
- a piece smaller than minPlateArea or narrower than minPlateWidth is not built on that storey;
  stacking stops at the first storey with no piece left, at the height limit and at the FAR cap.

It shares no code with the TypeScript evaluator and builds the geometry differently: each strip is
a large Shapely polygon intersected with the lot by GEOS (pieces that touch the segment kept by
GEOS's distance test), B and every plate come from GEOS differences, the coverage inset is a GEOS
difference of the bands and kites (built from each piece's exterior as Shapely orients it) with d
found by Brent's method, and a piece's width is the least, over its convex hull's edge directions,
of its perpendicular extent.
"""
import json
import math
import sys

import numpy as np
from scipy.optimize import brentq
from shapely.geometry import LineString, MultiPolygon, Polygon
from shapely.geometry.polygon import orient
from shapely.ops import unary_union

REL = 1e-9


def polys(g):
    if g.is_empty:
        return []
    if isinstance(g, Polygon):
        return [g]
    if isinstance(g, MultiPolygon):
        return list(g.geoms)
    return [p for p in getattr(g, "geoms", []) if isinstance(p, Polygon)]


def area(g):
    return 0.0 if g.is_empty else float(g.area)


def width(poly):
    hull = poly.convex_hull
    if hull.is_empty or hull.area == 0:
        return 0.0
    pts = np.asarray(hull.exterior.coords)[:-1]
    best = math.inf
    for i in range(len(pts)):
        e = pts[(i + 1) % len(pts)] - pts[i]
        ln = np.hypot(e[0], e[1])
        if ln == 0:
            continue
        nrm = np.array([-e[1], e[0]]) / ln
        t = pts @ nrm
        best = min(best, float(t.max() - t.min()))
    return best


class Lot:
    def __init__(self, verts, kinds):
        ring = Polygon(verts)
        if ring.exterior.is_ccw:
            self.v = [np.asarray(p, float) for p in verts]
            self.kinds = list(kinds)
        else:
            n = len(verts)
            self.v = [np.asarray(verts[n - 1 - j], float) for j in range(n)]
            self.kinds = [kinds[(2 * n - 2 - j) % n] for j in range(n)]
        self.poly = Polygon([tuple(p) for p in self.v])
        minx, miny, maxx, maxy = self.poly.bounds
        self.big = 10.0 * (maxx - minx + maxy - miny) + 10.0
        n = len(self.v)
        self.reflex = []
        for j in range(n):
            a = self.v[j - 1]
            b = self.v[j]
            c = self.v[(j + 1) % n]
            cross = (b - a)[0] * (c - b)[1] - (b - a)[1] * (c - b)[0]
            scale = np.linalg.norm(b - a) * np.linalg.norm(c - b)
            self.reflex.append(cross < -1e-12 * scale)

    def yard(self, i, s):
        """Yard of edge i at depth s (a Shapely geometry), by the rule above."""
        n = len(self.v)
        p = self.v[i]
        q = self.v[(i + 1) % n]
        u = (q - p) / np.linalg.norm(q - p)
        nrm = np.array([-u[1], u[0]])  # inward on a counter-clockwise ring
        big = self.big
        lo = p if self.reflex[i] else p - big * u
        hi = q if self.reflex[(i + 1) % n] else q + big * u
        strip = Polygon([tuple(lo), tuple(hi), tuple(hi + s * nrm), tuple(lo + s * nrm)])
        seg = LineString([tuple(p), tuple(q)])
        pieces = [g for g in polys(self.poly.intersection(strip)) if g.distance(seg) <= 1e-9 * big]
        return unary_union(pieces) if pieces else Polygon()


def mitre_inset(geom, d):
    """Each piece of geom less its edges' inward bands of depth d and its re-entrant corners' mitre kites."""
    out = []
    for piece in polys(geom):
        pts = np.asarray(orient(piece, 1.0).exterior.coords)[:-1]
        m = len(pts)
        cut = []
        for i in range(m):
            p = pts[i]
            q = pts[(i + 1) % m]
            e = q - p
            ln = np.hypot(e[0], e[1])
            if ln == 0:
                continue
            nrm = np.array([-e[1], e[0]]) / ln
            cut.append(Polygon([tuple(p), tuple(q), tuple(q + d * nrm), tuple(p + d * nrm)]))
            r = pts[(i + 2) % m]
            f = r - q
            lf = np.hypot(f[0], f[1])
            if lf == 0 or e[0] * f[1] - e[1] * f[0] >= -1e-12 * ln * lf:
                continue
            nf = np.array([-f[1], f[0]]) / lf
            # Crossing of the two moved lines: q + d*nrm + t*e/ln = q + d*nf + s*f/lf.
            a = np.array([[e[0] / ln, -f[0] / lf], [e[1] / ln, -f[1] / lf]])
            t = np.linalg.solve(a, d * (nf - nrm))
            mtr = q + d * nrm + t[0] * e / ln
            cut.append(Polygon([tuple(q), tuple(q + d * nf), tuple(mtr), tuple(q + d * nrm)]))
        out.append(piece.difference(unary_union([c for c in cut if c.is_valid and c.area > 0])))
    return unary_union(out) if out else Polygon()


def evaluate(case):
    kinds_in = case["parcel"]["lotLines"]
    lot = Lot([tuple(v) for v in case["parcel"]["vertices"]], kinds_in)
    sb = case["setbacks"]
    setback = {"front": sb["front"], "side": sb["side"], "rear": sb["rear"],
               "street": sb.get("street", sb["front"])}
    parcel = lot.poly
    lot_area = float(parcel.area)
    tol = REL * lot_area
    wtol = REL * math.sqrt(lot_area)
    n = len(lot.v)
    yards = [lot.yard(i, setback[lot.kinds[i]]) for i in range(n) if setback[lot.kinds[i]] > 0]
    b = parcel.difference(unary_union(yards)) if yards else parcel
    buildable = area(b)

    cov = case.get("maxCoverage", 1.0)
    target = cov * lot_area
    capped = False
    base = b
    if buildable > tol and buildable > target + tol:
        capped = True
        hi = max(width(p) for p in polys(b)) / 2.0
        # Brent's method on area(d) - target (continuous and decreasing in d), to a step far below
        # the rule's 1e-9 x lot area tolerance.
        d = brentq(lambda x: area(mitre_inset(b, x)) - target, 0.0, hi, xtol=1e-13 * hi, rtol=8.9e-16, maxiter=500)
        base = mitre_inset(b, d)

    sky = case.get("skyPlane")
    streets = [i for i in range(n) if lot.kinds[i] in ("front", "street")]
    fh = case["floorHeight"]
    mh = case["maxHeight"]
    far_cap = math.inf if "maxFar" not in case else case["maxFar"] * lot_area + tol
    min_area = case.get("minPlateArea", 0.0)
    min_width = case.get("minPlateWidth", 0.0)

    floors, gfa, footprint, facade, pieces = 0, 0.0, 0.0, 0.0, 0
    k = 0
    while True:
        k += 1
        z = k * fh
        if z > mh + 1e-9:
            reason = "height"
            break
        if buildable <= tol:
            reason = "setbacks"
            break
        plate = base
        if sky is not None and z > sky["startHeight"] and streets:
            d = (z - sky["startHeight"]) / sky["ratio"]
            plate = base.difference(unary_union([lot.yard(i, d) for i in streets]))
        kept = [p for p in polys(plate)
                if not (p.area <= tol or p.area < min_area - tol or (min_width > 0 and width(p) < min_width - wtol))]
        if not kept:
            reason = "plate"
            break
        a = sum(p.area for p in kept)
        if gfa + a > far_cap:
            reason = "far"
            break
        gfa += a
        floors = k
        if k == 1:
            footprint = a
            facade = sum(p.length for p in kept)
            pieces = len(kept)
    return {"lotArea": lot_area, "buildableArea": buildable, "footprintArea": footprint, "floors": floors,
            "gfa": gfa, "facadeLength": facade, "limitedBy": reason, "coverageCapped": capped,
            "pieces": pieces}


def main():
    data = json.load(sys.stdin)
    json.dump({"results": [evaluate(c) for c in data["cases"]]}, sys.stdout)


if __name__ == "__main__":
    main()
