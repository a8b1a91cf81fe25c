"""Reference MLP regressor: scikit-learn's MLPRegressor (Debian python3-sklearn 1.2.1).

stdin JSON: {"xTrain": [[...]], "yTrain": [[...]], "xTest": [[...]], "yTest": [[...]],
             "hidden": [32, 32], "activation": "relu", "alpha": 1e-5, "learningRate": 0.003,
             "batchSize": 32, "maxIter": 300, "patience": 30, "validationFraction": 0.15, "seed": 0}
Inputs are min-max scaled to [-1, 1] and targets standardised on the training rows, as floorcast's
MLP does, so both networks see the same problem. Early stopping on a validation split.
stdout JSON: {"predictions": [[...]], "rmse": [...], "fitSeconds": wall s, "fitCpuSeconds": CPU s, "nIter": k,
             "sklearn": version}
"""
import json
import sys
import time
import warnings

import numpy as np
import sklearn
from sklearn.neural_network import MLPRegressor
from sklearn.preprocessing import MinMaxScaler, StandardScaler

warnings.filterwarnings("ignore")  # convergence chatter on stderr; the result is what is compared
req = json.load(sys.stdin)
x_train = np.asarray(req["xTrain"], dtype=float)
y_train = np.asarray(req["yTrain"], dtype=float)
x_test = np.asarray(req["xTest"], dtype=float)
y_test = np.asarray(req["yTest"], dtype=float) if req.get("yTest") is not None else None

xs = MinMaxScaler(feature_range=(-1, 1)).fit(x_train)
ys = StandardScaler().fit(y_train)
model = MLPRegressor(
    hidden_layer_sizes=tuple(req.get("hidden", [32, 32])),
    activation=req.get("activation", "relu"),
    solver="adam",
    alpha=req.get("alpha", 1e-5),
    batch_size=min(req.get("batchSize", 32), len(x_train)),
    learning_rate_init=req.get("learningRate", 0.003),
    max_iter=req.get("maxIter", 300),
    early_stopping=True,
    validation_fraction=req.get("validationFraction", 0.15),
    n_iter_no_change=req.get("patience", 30),
    tol=1e-6,
    random_state=req.get("seed", 0),
)
t0 = time.perf_counter()
c0 = time.process_time()
model.fit(xs.transform(x_train), ys.transform(y_train) if y_train.shape[1] > 1 else ys.transform(y_train).ravel())
fit_seconds = time.perf_counter() - t0
fit_cpu_seconds = time.process_time() - c0
pred = model.predict(xs.transform(x_test)).reshape(len(x_test), -1)
pred = ys.inverse_transform(pred)
out = {"predictions": pred.tolist(), "fitSeconds": fit_seconds, "fitCpuSeconds": fit_cpu_seconds, "nIter": int(model.n_iter_), "sklearn": sklearn.__version__}
if y_test is not None:
    out["rmse"] = np.sqrt(np.mean((pred - y_test) ** 2, axis=0)).tolist()
json.dump(out, sys.stdout)
