"""Reference rank correlations: scipy.stats.spearmanr and scipy.stats.kendalltau (tau-b).

Reads JSON {"cases": [{"x": [...], "y": [...]}, ...]} on stdin and writes
{"scipy": version, "results": [{"spearman": rho, "kendall": tau}, ...]} on stdout.
Run with Debian's /usr/bin/python3 (python3-scipy 1.10.1).
"""
import json
import math
import sys

import scipy
from scipy import stats


def clean(v):
    return None if v is None or math.isnan(v) else float(v)


def main():
    data = json.load(sys.stdin)
    results = []
    for case in data["cases"]:
        rho = stats.spearmanr(case["x"], case["y"]).correlation
        tau = stats.kendalltau(case["x"], case["y"], variant="b").correlation
        results.append({"spearman": clean(rho), "kendall": clean(tau)})
    json.dump({"scipy": scipy.__version__, "results": results}, sys.stdout)


if __name__ == "__main__":
    main()
