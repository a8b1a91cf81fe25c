"""Reference values of erf, erfc, the standard normal distribution and the Gaussian CRPS.

Reads JSON on stdin: {"x": [...], "p": [...], "crps": [[y, mu, sigma], ...]}
Writes JSON: {"erf": [...], "erfc": [...], "ndtr": [...], "ndtri": [...], "crps_quad": [...]}
CRPS by numerical integration of ∫ (F(t) − 1{t ≥ y})² dt with scipy.integrate.quad, split at y.
Libraries: Debian python3-scipy 1.10.1, python3-numpy 1.24.2.
"""
import json
import sys

import numpy as np
from scipy import integrate, special


def crps_quad(y, mu, sigma):
    f = lambda t: special.ndtr((t - mu) / sigma)
    below, _ = integrate.quad(lambda t: f(t) ** 2, -np.inf, y, epsabs=1e-14, epsrel=1e-12, limit=200)
    above, _ = integrate.quad(lambda t: (1 - f(t)) ** 2, y, np.inf, epsabs=1e-14, epsrel=1e-12, limit=200)
    return below + above


def main():
    req = json.load(sys.stdin)
    x = np.asarray(req.get("x", []), dtype=float)
    p = np.asarray(req.get("p", []), dtype=float)
    json.dump(
        {
            "erf": special.erf(x).tolist(),
            "erfc": special.erfc(x).tolist(),
            "ndtr": special.ndtr(x).tolist(),
            "ndtri": special.ndtri(p).tolist(),
            "crps_quad": [crps_quad(*c) for c in req.get("crps", [])],
        },
        sys.stdout,
    )


main()
