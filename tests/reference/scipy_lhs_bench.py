"""Times scipy.stats.qmc.LatinHypercube(d, optimization="random-cd", seed) for the design-quality benchmark.

Reads JSON {"n": int, "d": int, "seed": int} on stdin; writes JSON {"points": [[...]], "seconds": float, "cpuSeconds": float,
"cd": float, "scipy": version} on stdout. Reference library: Debian python3-scipy 1.10.1.
"""
import json
import sys
import time

import scipy
from scipy.stats import qmc

args = json.load(sys.stdin)
t0 = time.perf_counter()
c0 = time.process_time()
sampler = qmc.LatinHypercube(d=args["d"], optimization="random-cd", seed=args["seed"])
points = sampler.random(n=args["n"])
seconds = time.perf_counter() - t0
cpu = time.process_time() - c0
json.dump(
    {
        "points": points.tolist(),
        "seconds": seconds,
        "cpuSeconds": cpu,
        "cd": float(qmc.discrepancy(points, method="CD")),
        "scipy": scipy.__version__,
    },
    sys.stdout,
)
