"""Reference Gaussian-process regression with scikit-learn's GaussianProcessRegressor.

Debian python3-sklearn 1.2.1 / python3-numpy 1.24.2. Reads JSON on stdin, writes JSON on stdout.

Input: {"mode": "fixed" | "fit", "kernel": "se" | "matern32" | "matern52", "x": rows (already in the unit
cube), "y": values (raw; normalize_y=True standardises with the population std as floorcast does),
"xTest": rows, and for "fixed" "hyper": {"lengthscales", "signalVariance", "noiseVariance"} (optimizer=None);
for "fit" "start", "bounds" {"lengthscale", "signalVariance", "noiseVariance"} (pairs), "restarts", "seed"}.
Kernel: ConstantKernel(signal variance) * (RBF | Matern(nu)) [+ WhiteKernel(noise)].
A {"batch": [requests]} input gives a list of outputs.
Output: mean, sd (with noise: WhiteKernel in the kernel), sdLatent (noise as `alpha` instead), lml
(log_marginal_likelihood_value_, on the standardised targets), fitted hyperparameters and fit seconds.
"""
import json
import sys
import time

import numpy as np
from sklearn.gaussian_process import GaussianProcessRegressor
from sklearn.gaussian_process.kernels import RBF, ConstantKernel, Matern, WhiteKernel


def base(kind, ls, ls_bounds):
    if kind == "se":
        return RBF(length_scale=ls, length_scale_bounds=ls_bounds)
    nu = {"matern32": 1.5, "matern52": 2.5}[kind]
    return Matern(length_scale=ls, length_scale_bounds=ls_bounds, nu=nu)


def run(req):
    x = np.asarray(req["x"], dtype=float)
    y = np.asarray(req["y"], dtype=float)
    xt = np.asarray(req["xTest"], dtype=float)
    out = {}
    if req["mode"] == "fixed":
        h = req["hyper"]
        ls = np.asarray(h["lengthscales"], dtype=float)
        k_lat = ConstantKernel(h["signalVariance"], "fixed") * base(req["kernel"], ls, "fixed")
        gp_lat = GaussianProcessRegressor(k_lat, alpha=h["noiseVariance"], optimizer=None, normalize_y=True)
        gp_lat.fit(x, y)
        mean, sd_lat = gp_lat.predict(xt, return_std=True)
        k_noise = k_lat + WhiteKernel(h["noiseVariance"], "fixed")
        gp_noise = GaussianProcessRegressor(k_noise, alpha=0.0, optimizer=None, normalize_y=True)
        gp_noise.fit(x, y)
        mean2, sd = gp_noise.predict(xt, return_std=True)
        out = {
            "mean": mean.tolist(),
            "meanWithWhite": mean2.tolist(),
            "sd": sd.tolist(),
            "sdLatent": sd_lat.tolist(),
            "lml": float(gp_lat.log_marginal_likelihood_value_),
            "lmlWithWhite": float(gp_noise.log_marginal_likelihood_value_),
        }
    else:
        b = req["bounds"]
        s = req["start"]
        ard = req.get("ard", True)
        ls0 = np.full(x.shape[1], s["lengthscale"]) if ard else s["lengthscale"]
        kernel = ConstantKernel(s["signalVariance"], tuple(b["signalVariance"])) * base(
            req["kernel"], ls0, tuple(b["lengthscale"])
        ) + WhiteKernel(s["noiseVariance"], tuple(b["noiseVariance"]))
        gp = GaussianProcessRegressor(
            kernel,
            alpha=0.0,
            normalize_y=True,
            n_restarts_optimizer=req["restarts"] - 1,
            random_state=req["seed"],
        )
        t0 = time.perf_counter()
        gp.fit(x, y)
        seconds = time.perf_counter() - t0
        mean = gp.predict(xt) if len(xt) else np.zeros(0)
        out = {
            "lml": float(gp.log_marginal_likelihood_value_),
            "kernel": str(gp.kernel_),
            "mean": mean.tolist(),
            "fitSeconds": seconds,
        }
    return out


def main():
    req = json.load(sys.stdin)
    if "batch" in req:
        json.dump([run(r) for r in req["batch"]], sys.stdout)
    else:
        json.dump(run(req), sys.stdout)


if __name__ == "__main__":
    main()
