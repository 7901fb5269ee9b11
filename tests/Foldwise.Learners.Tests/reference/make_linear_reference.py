#!/usr/bin/python3
"""Writes linear_reference.json: a small invented regression table, one fold, and scikit-learn's answers on it.

Run with Debian's interpreter (python3-sklearn, python3-scipy, python3-numpy):
    /usr/bin/python3 tests/Foldwise.Learners.Tests/reference/make_linear_reference.py
The inputs are prepared from the fold's training rows only, independently of the C# code: log1p of every
non-negative column whose skewness (scipy.stats.skew, biased) is above 1, then division by the population
standard deviation (sklearn StandardScaler(with_mean=False)); a constant column is scaled to zero.
ML.NET's SDCA regression minimises (1/n)·Σ(ŷ−y)² + (l2/2)·‖w‖² (its SquaredLoss is (ŷ−y)², not half of it), so
scikit-learn's Ridge (‖y−Xw‖² + α‖w‖², unpenalised intercept) takes α = n·l2/2.
"""
import json
import os

import numpy as np
import scipy.stats
import sklearn
from sklearn.linear_model import Ridge
from sklearn.preprocessing import StandardScaler

rng = np.random.default_rng(20261205)
n, n_test, p = 400, 150, 10


def table(rows):
    x = np.zeros((rows, p))
    x[:, 0] = rng.poisson(0.4, rows) * rng.integers(1, 50, rows)   # sparse skewed counts
    x[:, 1] = rng.lognormal(0.0, 1.0, rows)                        # skewed, all positive
    x[:, 2] = rng.normal(0.0, 2.0, rows)                           # symmetric, negative values
    x[:, 3] = rng.uniform(0.0, 10.0, rows)                         # non-negative, not skewed
    x[:, 4] = (rng.random(rows) < 0.2) * 1.0                       # sparse flag
    x[:, 5] = 0.0                                                  # empty column
    x[:, 6] = rng.normal(5.0, 1.0, rows)
    x[:, 7] = rng.exponential(3.0, rows) * (rng.random(rows) < 0.5)
    x[:, 8] = -rng.exponential(1.0, rows)                          # skewed but negative: never logged
    x[:, 9] = rng.integers(0, 4, rows)
    return x


train, test = table(n), table(n_test)
y = (1.0 + 0.4 * np.log1p(train[:, 0]) + 0.8 * np.log1p(train[:, 1]) - 0.3 * train[:, 2] + 0.1 * train[:, 3]
     + 0.5 * train[:, 4] + 0.05 * train[:, 6] + 0.2 * np.log1p(train[:, 7]) + rng.normal(0, 0.3, n))
held_out = np.arange(n) % 4 == 0
fit_rows = ~held_out

raw = train[fit_rows]
logged = [bool(raw[:, c].min() >= 0 and raw[:, c].std() > 0 and scipy.stats.skew(raw[:, c]) > 1) for c in range(p)]


def logs(x):
    out = x.copy()
    for c in range(p):
        if logged[c]:
            out[:, c] = np.log1p(out[:, c])
    return out


scaler = StandardScaler(with_mean=False).fit(logs(raw))
factors = [0.0 if s <= 1e-12 else 1.0 / s for s in np.sqrt(scaler.var_)]
prepare = lambda x: logs(x) * np.array(factors)  # noqa: E731
x_fit, x_held, x_test = prepare(raw), prepare(train[held_out]), prepare(test)
y_fit = y[fit_rows]
n_fit = int(fit_rows.sum())

cases = []
for l2 in [0.001, 0.05, 0.5, 5.0]:
    model = Ridge(alpha=n_fit * l2 / 2, fit_intercept=True, solver="cholesky").fit(x_fit, y_fit)
    cases.append({"l2": l2, "validation": model.predict(x_held).tolist(), "test": model.predict(x_test).tolist()})

out = {
    "source": f"scikit-learn {sklearn.__version__} (Debian python3-sklearn), scipy {scipy.__version__}; seed 20261205",
    "train": train.tolist(), "target": y.tolist(), "test": test.tolist(),
    "held_out": held_out.tolist(), "logged": logged, "factors": factors, "cases": cases,
}
with open(os.path.join(os.path.dirname(os.path.abspath(__file__)), "linear_reference.json"), "w") as f:
    json.dump(out, f)
print("logged", logged)
print("factors", np.round(factors, 4).tolist())
