"""Reference design metrics and Sobol' points for tests/sampler/design-reference.test.ts.

Reads JSON on stdin:
  {"cd": [points...], "distance": [{"points": [[...]], "p": float}...], "sobol": [{"n": int, "d": int}...],
   "scrambledCd": [{"n": int, "d": int, "seeds": int}...]}
Writes JSON on stdout:
  {"cd": [float...], "distance": [{"min": float, "phi": float}...], "sobol": [[[...]]...],
   "scrambledCd": [{"mean": float, "se": float}...], "versions": {...}}
- cd: scipy.stats.qmc.discrepancy(x, method="CD") (Hickernell 1998; scipy returns the squared value).
- distance: min and Morris-Mitchell phi_p = (sum d_ij^-p)^(1/p) from scipy.spatial.distance.pdist (Euclidean).
- sobol: scipy.stats.qmc.Sobol(d, scramble=False).random(n).
- scrambledCd: mean and standard error over seeds 0..seeds-1 of the CD of Sobol(d, seed=s).random(n)
  (scipy's LMS + digital shift scrambling).
Reference libraries: Debian python3-scipy 1.10.1, python3-numpy 1.24.2.
"""
import json
import sys
import warnings

import numpy as np
import scipy
from scipy.spatial.distance import pdist
from scipy.stats import qmc

args = json.load(sys.stdin)
out = {"cd": [], "distance": [], "sobol": [], "scrambledCd": [], "versions": {"scipy": scipy.__version__, "numpy": np.__version__}}
for points in args.get("cd", []):
    out["cd"].append(float(qmc.discrepancy(np.asarray(points, dtype=float), method="CD")))
for item in args.get("distance", []):
    d = pdist(np.asarray(item["points"], dtype=float))
    p = float(item["p"])
    out["distance"].append({"min": float(d.min()), "phi": float(np.sum(d ** -p) ** (1.0 / p))})
with warnings.catch_warnings():
    warnings.simplefilter("ignore")  # scipy warns when n is not a power of 2
    for item in args.get("sobol", []):
        out["sobol"].append(qmc.Sobol(item["d"], scramble=False).random(item["n"]).tolist())
for item in args.get("scrambledCd", []):
    v = np.array([qmc.discrepancy(qmc.Sobol(item["d"], seed=s).random(item["n"]), method="CD") for s in range(item["seeds"])])
    out["scrambledCd"].append({"mean": float(v.mean()), "se": float(v.std(ddof=1) / np.sqrt(len(v)))})
json.dump(out, sys.stdout)
