"""Peer for the optimizer benchmark: scipy.optimize.differential_evolution on published test functions.

Reads JSON on stdin: {"runs": [{"function": name, "seed": int, "target": float, "maxfev": int}, ...]}.
Each run minimises the named function (Virtual Library of Simulation Experiments definitions) with
differential_evolution(seed=seed, polish=False, tol=0, maxiter large), stops once maxfev evaluations are
spent, and reports the 1-based index of the first evaluation whose value is ≤ target (null if never),
the evaluations used and the best value.
Writes JSON: {"scipy": version, "results": [{"hit": int|null, "nfev": int, "best": float}, ...]}.
Libraries: Debian python3-scipy 1.10.1, python3-numpy 1.24.2.
"""
import json
import math
import sys

import numpy as np
import scipy
from scipy.optimize import differential_evolution


def branin(x):
    b, c, t = 5.1 / (4 * math.pi**2), 5 / math.pi, 1 / (8 * math.pi)
    return (x[1] - b * x[0] ** 2 + c * x[0] - 6) ** 2 + 10 * (1 - t) * math.cos(x[0]) + 10


def camel(x):
    a, b = x
    return (4 - 2.1 * a**2 + a**4 / 3) * a**2 + a * b + (-4 + 4 * b**2) * b**2


def goldstein_price(x):
    a, b = x
    p = 1 + (a + b + 1) ** 2 * (19 - 14 * a + 3 * a**2 - 14 * b + 6 * a * b + 3 * b**2)
    q = 30 + (2 * a - 3 * b) ** 2 * (18 - 32 * a + 12 * a**2 + 48 * b - 36 * a * b + 27 * b**2)
    return p * q


H3_A = np.array([[3.0, 10, 30], [0.1, 10, 35], [3.0, 10, 30], [0.1, 10, 35]])
H3_P = 1e-4 * np.array([[3689, 1170, 2673], [4699, 4387, 7470], [1091, 8732, 5547], [381, 5743, 8828]])
H3_ALPHA = np.array([1.0, 1.2, 3.0, 3.2])


def hartmann3(x):
    x = np.asarray(x)
    return float(-np.sum(H3_ALPHA * np.exp(-np.sum(H3_A * (x - H3_P) ** 2, axis=1))))


FUNCTIONS = {
    "branin": (branin, [(-5, 10), (0, 15)]),
    "six-hump-camel": (camel, [(-3, 3), (-2, 2)]),
    "goldstein-price": (goldstein_price, [(-2, 2), (-2, 2)]),
    "hartmann3": (hartmann3, [(0, 1)] * 3),
}


class Budget(Exception):
    pass


def run(spec):
    f, bounds = FUNCTIONS[spec["function"]]
    state = {"n": 0, "hit": None, "best": math.inf}

    def wrapped(x):
        if state["n"] >= spec["maxfev"]:
            raise Budget()
        state["n"] += 1
        v = f(x)
        state["best"] = min(state["best"], v)
        if state["hit"] is None and v <= spec["target"]:
            state["hit"] = state["n"]
        return v

    try:
        differential_evolution(wrapped, bounds, seed=spec["seed"], polish=False, tol=0, maxiter=100000)
    except Budget:
        pass
    return {"hit": state["hit"], "nfev": state["n"], "best": state["best"]}


def main():
    req = json.load(sys.stdin)
    json.dump({"scipy": scipy.__version__, "results": [run(s) for s in req["runs"]]}, sys.stdout)


if __name__ == "__main__":
    main()
