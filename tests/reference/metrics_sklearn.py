"""Reference regression metrics and cross-validated predictions for floorcast's trust tests.

Reads JSON on stdin: {"cases": [{"y": [...], "p": [...]}], "cv": {"x": [[...]], "y": [...], "fold": [...]}}
Writes JSON: {"cases": [{mse, rmse, mae, max_error, r2, bias, median_rel, p95_rel}], "cv": {"pred": [...], "q2": ...}}
Libraries: Debian python3-sklearn 1.2.1, python3-numpy 1.24.2.
"""
import json
import sys

import numpy as np
from sklearn.linear_model import LinearRegression
from sklearn.metrics import max_error, mean_absolute_error, mean_squared_error, r2_score
from sklearn.model_selection import PredefinedSplit, cross_val_predict


def nan_to_none(v):
    v = float(v)
    return None if np.isnan(v) else v


def metrics(y, p):
    y = np.asarray(y, dtype=float)
    p = np.asarray(p, dtype=float)
    nz = y != 0
    rel = np.abs(y[nz] - p[nz]) / np.abs(y[nz])
    return {
        "mse": mean_squared_error(y, p),
        "rmse": mean_squared_error(y, p, squared=False),
        "mae": mean_absolute_error(y, p),
        "max_error": max_error(y, p),
        # force_finite=False: NaN/−inf for a constant target instead of sklearn's 1.0/0.0 substitutes.
        "r2": nan_to_none(r2_score(y, p, force_finite=False)) if len(y) > 1 else None,
        "r2_forced": r2_score(y, p) if len(y) > 1 else None,
        "bias": float(np.mean(p - y)),
        "median_rel": float(np.median(rel)) if rel.size else None,
        "p95_rel": float(np.percentile(rel, 95)) if rel.size else None,
    }


def main():
    req = json.load(sys.stdin)
    out = {"cases": [metrics(c["y"], c["p"]) for c in req.get("cases", [])]}
    if "cv" in req:
        cv = req["cv"]
        x = np.asarray(cv["x"], dtype=float)
        y = np.asarray(cv["y"], dtype=float)
        pred = cross_val_predict(LinearRegression(), x, y, cv=PredefinedSplit(np.asarray(cv["fold"])))
        out["cv"] = {"pred": pred.tolist(), "q2": r2_score(y, pred)}
    if "percentiles" in req:
        out["percentiles"] = [float(np.percentile(np.asarray(v, dtype=float), q * 100)) for v, q in req["percentiles"]]
    json.dump(out, sys.stdout)


main()
