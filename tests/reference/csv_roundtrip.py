"""Cross-checks floorcast's CSV reader and writer with Python's csv module (an independent RFC 4180 parser).

stdin: {"read"?: "path of a CSV written by floorcast", "write"?: "path to write", "rows": [[...], ...]}
stdout: {"parsed": rows of strings read from "read" by csv.reader, "python": "3.x"}
"write" receives "rows" from csv.writer with its defaults (QUOTE_MINIMAL, lineterminator "\r\n").
"""
import csv
import json
import sys

req = json.load(sys.stdin)
parsed = []
if req.get("read"):
    with open(req["read"], newline="", encoding="utf-8") as f:
        parsed = [row for row in csv.reader(f)]
if req.get("write"):
    with open(req["write"], "w", newline="", encoding="utf-8") as f:
        w = csv.writer(f)
        for row in req["rows"]:
            w.writerow([repr(v) if isinstance(v, float) else v for v in row])
json.dump({"parsed": parsed, "python": sys.version.split()[0]}, sys.stdout)
