#!/usr/bin/python3
"""Reference parcel descriptors with Shapely: area, perimeter, convex-hull area and least width.

Reads {"polygons": [[[x, y], ...], ...]} (open rings, metres) as JSON on stdin and writes
{"shapely": version, "results": [{"area", "perimeter", "hullArea", "width"}, ...]} on stdout.
Area, perimeter (Polygon.length) and hull area (Polygon.convex_hull.area) are Shapely's (Debian
python3-shapely 1.8.5, GEOS). The least width (least distance between two parallel lines enclosing
the polygon) is found by a scan of directions, independent of floorcast's edge-based search: for
each of 200,000 directions θ in [0, π) the extent of the vertices' projections on (cos θ, sin θ),
and the least extent. The extent is Lipschitz in θ with constant at most the diameter D, so the
scan overshoots the true width by at most D·π/200,000/2 (derived); with numpy 1.24.
"""
import json
import sys

import numpy as np
import shapely
from shapely.geometry import Polygon

STEPS = 200_000


def least_width(ring):
    pts = np.asarray(ring, dtype=float)
    theta = np.arange(STEPS) * (np.pi / STEPS)
    best = np.inf
    for chunk in np.array_split(theta, 20):
        d = np.stack([np.cos(chunk), np.sin(chunk)], axis=1)
        proj = pts @ d.T
        best = min(best, float(np.min(proj.max(axis=0) - proj.min(axis=0))))
    return best


def main():
    data = json.load(sys.stdin)
    results = []
    for ring in data["polygons"]:
        poly = Polygon(ring)
        results.append({
            "area": poly.area,
            "perimeter": poly.length,
            "hullArea": poly.convex_hull.area,
            "width": least_width(ring),
        })
    json.dump({"shapely": shapely.__version__, "results": results}, sys.stdout)


if __name__ == "__main__":
    main()
