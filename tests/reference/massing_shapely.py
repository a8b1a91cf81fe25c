#!/usr/bin/python3
"""Independent reference for floorcast's massing rule (version 1), written with Shapely.

Reads {"cases": [MassingInput, ...]} as JSON on stdin and writes {"results": [...]} on stdout,
one result (lotArea, buildableArea, footprintArea, floors, gfa, facadeLength, limitedBy,
coverageCapped) per case; with {"profile": true} each result also holds the plate profile (area and
width of every storey the height limit allows, before the plate and FAR stops). Library versions: Debian python3-shapely 1.8.5, python3-numpy 1.24.2.

It shares no code with the TypeScript evaluator and builds the geometry differently:
- each yard is a large half-plane polygon on the parcel's side of the lot line (the side found
  from the parcel's centroid, not from the vertex order), intersected with the parcel by GEOS;
- the coverage inset is GEOS's negative buffer with mitre joins (for a convex polygon, eroding by
  d equals moving every edge inward by d), with d found by plain bisection;
- plate width is the least, over the plate's edge directions, of the vertices' perpendicular extent.
Tolerances follow the rule as documented in the README: areas 1e-9 x lot area, widths
1e-9 x sqrt(lot area), heights 1e-9 m.
"""
import json
import math
import sys

import numpy as np
from shapely.geometry import Polygon

REL = 1e-9


def half_plane(p, q, inside, dist, big):
    """Polygon of the points at distance >= dist from line pq, on the side of point `inside`."""
    p = np.asarray(p, float)
    q = np.asarray(q, float)
    u = (q - p) / np.linalg.norm(q - p)
    nrm = np.array([-u[1], u[0]])
    if np.dot(np.asarray(inside) - p, nrm) < 0:
        nrm = -nrm
    a = p - big * u + dist * nrm
    b = q + big * u + dist * nrm
    return Polygon([tuple(a), tuple(b), tuple(b + big * nrm), tuple(a + big * nrm)])


def width(poly):
    if poly.is_empty or poly.area == 0:
        return 0.0
    pts = np.asarray(poly.exterior.coords)[:-1]
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


def area(g):
    return 0.0 if g.is_empty else float(g.area)


def evaluate(case, with_profile=False):
    verts = [tuple(v) for v in case["parcel"]["vertices"]]
    kinds = case["parcel"]["lotLines"]
    sb = case["setbacks"]
    setback = {"front": sb["front"], "side": sb["side"], "rear": sb["rear"],
               "street": sb.get("street", sb["front"])}
    parcel = Polygon(verts)
    lot = float(parcel.area)
    tol = REL * lot
    wtol = REL * math.sqrt(lot)
    centre = np.asarray(parcel.centroid.coords[0])
    minx, miny, maxx, maxy = parcel.bounds
    big = 10.0 * (maxx - minx + maxy - miny) + 10.0
    n = len(verts)
    edges = [(verts[i], verts[(i + 1) % n], kinds[i]) for i in range(n)]

    b = parcel
    for p, q, kind in edges:
        b = b.intersection(half_plane(p, q, centre, setback[kind], big))
    buildable = area(b)

    cov = case.get("maxCoverage", 1.0)
    target = cov * lot
    capped = False
    base = b
    if buildable > tol and buildable > target + tol:
        capped = True
        lo, hi = 0.0, width(b) / 2.0
        for _ in range(300):
            mid = (lo + hi) / 2.0
            g = b.buffer(-mid, join_style=2, mitre_limit=1e6)
            a = area(g)
            if abs(a - target) <= tol * 1e-3:  # as the evaluator: well inside the 1e-9 tolerance
                break
            if a > target:
                lo = mid
            else:
                hi = mid
        base = g

    sky = case.get("skyPlane")
    streets = [(p, q) for p, q, kind in edges if kind in ("front", "street")]
    fh = case["floorHeight"]
    mh = case["maxHeight"]
    far_cap = math.inf if "maxFar" not in case else case["maxFar"] * lot + tol
    min_area = case.get("minPlateArea", 0.0)
    min_width = case.get("minPlateWidth", 0.0)

    floors, gfa, footprint, facade = 0, 0.0, 0.0, 0.0
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
        if sky is not None and z > sky["startHeight"]:
            d = (z - sky["startHeight"]) / sky["ratio"]
            for p, q in streets:
                plate = plate.intersection(half_plane(p, q, centre, d, big))
        a = area(plate)
        if a <= tol or a < min_area - tol or (min_width > 0 and width(plate) < min_width - wtol):
            reason = "plate"
            break
        if gfa + a > far_cap:
            reason = "far"
            break
        gfa += a
        floors = k
        if k == 1:
            footprint = a
            facade = float(plate.length)
    result = {"lotArea": lot, "buildableArea": buildable, "footprintArea": footprint, "floors": floors,
              "gfa": gfa, "facadeLength": facade, "limitedBy": reason, "coverageCapped": capped}
    if with_profile:
        # plate profile: every storey the height limit allows, before the plate and FAR stops
        storeys = []
        k = 1
        while k * fh <= mh + 1e-9:
            z = k * fh
            plate = base if buildable > tol else Polygon()
            d = 0.0
            if sky is not None and z > sky["startHeight"]:
                d = (z - sky["startHeight"]) / sky["ratio"]
                for p, q in streets:
                    plate = plate.intersection(half_plane(p, q, centre, d, big))
            a = area(plate)
            storeys.append({"topHeight": z, "inset": d, "area": a, "width": width(plate) if a > tol else 0.0})
            k += 1
        result["profile"] = storeys
    return result


def main():
    data = json.load(sys.stdin)
    with_profile = bool(data.get("profile", False))
    json.dump({"results": [evaluate(c, with_profile) for c in data["cases"]]}, sys.stdout)


if __name__ == "__main__":
    main()
