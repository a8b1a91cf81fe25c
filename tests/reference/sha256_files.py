"""SHA-256 of files with Python's hashlib (FIPS 180-4), for checking dataset manifests.

stdin: {"paths": ["...", ...]}; stdout: {"sha256": ["hex", ...], "bytes": [n, ...], "python": "3.x"}
"""
import hashlib
import json
import os
import sys

req = json.load(sys.stdin)
out = {"sha256": [], "bytes": [], "python": sys.version.split()[0]}
for p in req["paths"]:
    h = hashlib.sha256()
    with open(p, "rb") as f:
        for chunk in iter(lambda: f.read(1 << 20), b""):
            h.update(chunk)
    out["sha256"].append(h.hexdigest())
    out["bytes"].append(os.path.getsize(p))
json.dump(out, sys.stdout)
