#!/usr/bin/python3
"""Geodesic areas of longitude/latitude polygons on the WGS 84 ellipsoid, with pyproj.

Reads {"polygons": [[[lon, lat], ...], ...]} (closed or open rings) as JSON on stdin and writes
{"areas": [m2, ...]} on stdout. pyproj.Geod.polygon_area_perimeter implements Karney's algorithm
(C. F. F. Karney, "Algorithms for geodesics", J. Geodesy 87 (2013) 43-55). Library version: Debian
python3-pyproj 3.4.1 (PROJ 9.1).
"""
import json
import sys

from pyproj import Geod


def main():
    geod = Geod(ellps="WGS84")
    data = json.load(sys.stdin)
    areas = []
    for ring in data["polygons"]:
        lons = [p[0] for p in ring]
        lats = [p[1] for p in ring]
        area, _ = geod.polygon_area_perimeter(lons, lats)
        areas.append(abs(area))
    json.dump({"areas": areas}, sys.stdout)


if __name__ == "__main__":
    main()
