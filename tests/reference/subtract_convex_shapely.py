#!/usr/bin/python3
"""Reference for subtractConvexRegion: a simple ring less a convex region, with Shapely.

Reads {"cases": [{"ring": [x0, y0, x1, y1, ...], "planes": [[a, b, c], ...]}]} as JSON on stdin: the
region is the intersection of the half-planes a*x + b*y >= c ((a, b) unit normals), each built as a
square of side 2R = 2000 on the inner side of its line (the rings lie within 100 of the origin, so the
squares' far sides never matter). Writes {"results": [[area, ...], ...], "holes": [n, ...]}: for each case the areas
of the polygons of ring.difference(region), largest first, and the total area of their interior rings apart from the exterior (holes). Library: Debian python3-shapely 1.8.5
(GEOS 3.11), Polygon.intersection and Polygon.difference.
"""
import json
import sys

from shapely.geometry import MultiPolygon, Polygon

R = 1000.0


def half_plane(a, b, c):
    fx, fy = a * c, b * c  # the line's point nearest the origin
    dx, dy = b, -a  # along the line
    return Polygon([
        (fx - R * dx, fy - R * dy),
        (fx + R * dx, fy + R * dy),
        (fx + R * dx + 2 * R * a, fy + R * dy + 2 * R * b),
        (fx - R * dx + 2 * R * a, fy - R * dy + 2 * R * b),
    ])


def main():
    cases = json.load(sys.stdin)["cases"]
    results = []
    holes = []
    for case in cases:
        xy = case["ring"]
        ring = Polygon(list(zip(xy[0::2], xy[1::2])))
        region = None
        for a, b, c in case["planes"]:
            h = half_plane(a, b, c)
            region = h if region is None else region.intersection(h)
        diff = ring.difference(region)
        if diff.is_empty:
            parts = []
        elif isinstance(diff, Polygon):
            parts = [diff]
        elif isinstance(diff, MultiPolygon):
            parts = list(diff.geoms)
        else:
            parts = [g for g in diff.geoms if isinstance(g, Polygon)]
        results.append(sorted((p.area for p in parts), reverse=True))
        # An interior ring that touches the exterior (GEOS's form of a notch cut along an edge) is no hole.
        holes.append(sum(Polygon(h).area for p in parts for h in p.interiors if h.distance(p.exterior) > 1e-9))
    json.dump({"results": results, "holes": holes}, sys.stdout)


main()
