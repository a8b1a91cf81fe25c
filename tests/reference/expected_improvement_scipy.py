"""Reference expected improvement and probability of feasibility by numerical integration.

EI(mu, sigma, best) = E[max(0, best - Y)], Y ~ N(mu, sigma^2), integrated with scipy.integrate.quad
against scipy.stats.norm.pdf (the definition, not the closed form of Jones, Schonlau & Welch 1998).
PoF(mu, sigma) = P(Y <= 0) = scipy.stats.norm.cdf(0, mu, sigma).
Reads JSON on stdin: {"cases": [[mu, sigma, best], ...]}; writes {"scipy": version, "ei": [...], "pof": [...]}.
Libraries: Debian python3-scipy 1.10.1, python3-numpy 1.24.2.
"""
import json
import sys

import scipy
from scipy import integrate, stats


def ei(mu, sigma, best):
    f = lambda y: (best - y) * stats.norm.pdf(y, mu, sigma)
    lo = min(best, mu) - 40 * sigma
    val, _ = integrate.quad(f, lo, best, epsabs=1e-14, epsrel=1e-12, limit=400, points=[mu] if lo < mu < best else None)
    return val


def main():
    req = json.load(sys.stdin)
    cases = req["cases"]
    json.dump(
        {
            "scipy": scipy.__version__,
            "ei": [ei(m, s, b) for m, s, b in cases],
            "pof": [float(stats.norm.cdf(0.0, m, s)) for m, s, _ in cases],
        },
        sys.stdout,
    )


if __name__ == "__main__":
    main()
