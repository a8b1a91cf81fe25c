"""Peer surrogates and sampler for floorcast's benchmark: scikit-learn's GP and MLP, scipy's LHS.

A JSON-lines server: each stdin line is one request, each stdout line its reply.
  {"op": "versions"}                                  -> {"sklearn": v, "scipy": v, "numpy": v}
  {"op": "lhs", "n": n, "d": d, "seed": s}             -> {"rows": [[...], ...]}  scipy.stats.qmc.LatinHypercube
  {"op": "fit", "kind": "gp"|"mlp", "x": X, "y": Y,
   "lower": [...], "upper": [...], "seed": s,
   "restarts": r, "maxIter": m}                       -> {"id": k, "seconds": t}   (GP optimizer restarts, MLP epochs)
  {"op": "predict", "id": k, "x": X}                  -> {"mean": [[...], ...]}
  {"op": "release", "id": k}                          -> {"ok": true}
Errors reply {"error": message}. Inputs are scaled to the unit cube by the declared bounds and
targets standardised, as floorcast's own surrogates do. One GP per target (Matern 5/2 with one
lengthscale per input plus a white-noise term, hyperparameters by marginal likelihood with
restarts); one MLP for all targets (two hidden layers of 64 ReLU units, Adam).
Run with Debian's /usr/bin/python3 (python3-sklearn 1.2.1, python3-scipy 1.10.1, numpy 1.24.2).
"""
import json
import os
import sys
import time
import warnings

import numpy as np
import scipy
import sklearn
from scipy.stats import qmc
from sklearn.exceptions import ConvergenceWarning
from sklearn.gaussian_process import GaussianProcessRegressor
from sklearn.gaussian_process.kernels import ConstantKernel, Matern, WhiteKernel
from sklearn.neural_network import MLPRegressor

warnings.filterwarnings("ignore", category=ConvergenceWarning)
warnings.filterwarnings("ignore", category=UserWarning)

MODELS = {}
NEXT = [0]


class Scaled:
    def __init__(self, lower, upper, y):
        self.lower = np.asarray(lower, dtype=float)
        span = np.asarray(upper, dtype=float) - self.lower
        self.span = np.where(span > 0, span, 1.0)
        self.mean = y.mean(axis=0)
        sd = y.std(axis=0)
        self.sd = np.where(sd > 0, sd, 1.0)

    def x(self, x):
        return (np.asarray(x, dtype=float) - self.lower) / self.span


def fit(req):
    x = np.asarray(req["x"], dtype=float)
    y = np.asarray(req["y"], dtype=float)
    s = Scaled(req["lower"], req["upper"], y)
    z = (y - s.mean) / s.sd
    seed = int(req["seed"])
    d = x.shape[1]
    t0 = time.perf_counter()
    if req["kind"] == "gp":
        models = []
        for j in range(z.shape[1]):
            kernel = ConstantKernel(1.0, (1e-3, 1e3)) * Matern(
                length_scale=np.ones(d), length_scale_bounds=(1e-2, 1e2), nu=2.5
            ) + WhiteKernel(1e-4, (1e-8, 1.0))
            gp = GaussianProcessRegressor(kernel=kernel, n_restarts_optimizer=int(req.get("restarts", 2)), random_state=seed)
            gp.fit(s.x(x), z[:, j])
            models.append(gp)
        model = ("gp", models, s)
    else:
        mlp = MLPRegressor(hidden_layer_sizes=(64, 64), max_iter=int(req.get("maxIter", 2000)),
                           learning_rate_init=0.003, random_state=seed, tol=1e-6, n_iter_no_change=50)
        mlp.fit(s.x(x), z)
        model = ("mlp", mlp, s)
    seconds = time.perf_counter() - t0
    NEXT[0] += 1
    MODELS[NEXT[0]] = model
    return {"id": NEXT[0], "seconds": seconds}


def predict(req):
    kind, m, s = MODELS[int(req["id"])]
    x = s.x(req["x"])
    if kind == "gp":
        z = np.column_stack([g.predict(x) for g in m])
    else:
        z = m.predict(x).reshape(len(x), -1)
    return {"mean": (z * s.sd + s.mean).tolist()}


def handle(req):
    op = req.get("op")
    if op == "versions":
        return {"sklearn": sklearn.__version__, "scipy": scipy.__version__, "numpy": np.__version__}
    if op == "lhs":
        rows = qmc.LatinHypercube(d=int(req["d"]), seed=int(req["seed"])).random(int(req["n"]))
        return {"rows": rows.tolist()}
    if op == "fit":
        return fit(req)
    if op == "predict":
        return predict(req)
    if op == "release":
        MODELS.pop(int(req["id"]), None)
        return {"ok": True}
    return {"error": "unknown op %r" % op}


def main():
    # Replies go to the original stdout; anything a library prints (Fortran L-BFGS notes write to
    # file descriptor 1) is sent to stderr instead, so it cannot corrupt the protocol.
    reply_fd = os.dup(1)
    os.dup2(2, 1)
    out = os.fdopen(reply_fd, "w")
    for line in sys.stdin:
        if not line.strip():
            continue
        try:
            reply = handle(json.loads(line))
        except Exception as e:  # reply with the error; the caller decides
            reply = {"error": "%s: %s" % (type(e).__name__, e)}
        out.write(json.dumps(reply) + "\n")
        out.flush()


if __name__ == "__main__":
    main()
