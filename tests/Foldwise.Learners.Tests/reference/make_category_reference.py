#!/usr/bin/python3
"""Writes category_reference.json: scikit-learn's HistGradientBoostingRegressor on diamonds-2000.csv, 5 folds,
once with its own categorical splits on cut / color / clarity and once with those columns one-hot encoded.

diamonds-2000.csv: 2,000 rows of ggplot2's `diamonds` (Debian r-cran-ggplot2, MIT licence; see diamonds-2000.md).
Row r is held out in fold r mod 5. The target is log1p(price); the score is the RMSE of the log1p values (RMSLE),
predictions clamped at 0 as Foldwise's Metric does. Settings mirror the C# check: 200 boosting rounds, learning
rate 0.1, at most 31 leaves, at least 20 rows per leaf, no L2 penalty, no early stopping, every row and column.
Run with Debian's interpreter: /usr/bin/python3 tests/Foldwise.Learners.Tests/reference/make_category_reference.py
"""
import json
import os

import numpy as np
import pandas as pd
import sklearn
from sklearn.ensemble import HistGradientBoostingRegressor

here = os.path.dirname(os.path.abspath(__file__))
frame = pd.read_csv(os.path.join(here, "diamonds-2000.csv")).drop(columns=["id"])
y = np.log1p(frame.pop("price").to_numpy(np.float64))
categories = ["cut", "color", "clarity"]
fold = np.arange(len(y)) % 5


def scores(x, categorical):
    out = []
    for k in range(5):
        train, held = fold != k, fold == k
        model = HistGradientBoostingRegressor(
            learning_rate=0.1, max_iter=200, max_leaf_nodes=31, min_samples_leaf=20, l2_regularization=0.0,
            early_stopping=False, categorical_features=categorical, random_state=0).fit(x[train], y[train])
        predicted = np.maximum(0.0, model.predict(x[held]))
        out.append(float(np.sqrt(np.mean((y[held] - predicted) ** 2))))
    return out


native = frame.copy()
for c in categories:
    native[c] = native[c].astype("category").cat.codes
mask = [c in categories for c in native.columns]
one_hot = pd.get_dummies(frame, columns=categories, dtype=np.float64)

out = {
    "source": f"scikit-learn {sklearn.__version__} (Debian python3-sklearn) HistGradientBoostingRegressor",
    "native_categorical_fold_scores": scores(native.to_numpy(np.float64), mask),
    "one_hot_fold_scores": scores(one_hot.to_numpy(np.float64), None),
}
with open(os.path.join(here, "category_reference.json"), "w") as f:
    json.dump(out, f, indent=1)
print(out)
