#!/usr/bin/python3
"""Writes forest_reference.json: scikit-learn's RandomForestRegressor scored on concrete.csv with 5 folds.

concrete.csv is the `concrete` table of the R package modeldata 1.1.0 (Debian r-cran-modeldata, MIT licence;
Yeh 1998, UCI Concrete Compressive Strength), exported with
    Rscript -e 'data(concrete, package="modeldata"); write.csv(concrete, "concrete.csv", row.names=FALSE)'
Row r is held out in fold r mod 5. The target is log1p(compressive_strength); the score is the RMSE of the
log1p values (RMSLE), predictions clamped at 0 as Foldwise's Metric does. The forest mirrors the C# check's
settings: 200 trees, at most 64 leaves, at least 5 rows per leaf, every column at every split, each tree on
70 % of the rows. FastForest samples rows without replacement and scikit-learn with, so the two are expected to
agree within the fold-to-fold noise, not exactly.
Run with Debian's interpreter: /usr/bin/python3 tests/Foldwise.Learners.Tests/reference/make_forest_reference.py
"""
import json
import os

import numpy as np
import pandas as pd
import sklearn
from sklearn.ensemble import RandomForestRegressor

here = os.path.dirname(os.path.abspath(__file__))
frame = pd.read_csv(os.path.join(here, "concrete.csv"))
y = np.log1p(frame.pop("compressive_strength").to_numpy())
x = frame.to_numpy(np.float64)
fold = np.arange(len(y)) % 5

scores = []
for k in range(5):
    train, held = fold != k, fold == k
    model = RandomForestRegressor(n_estimators=200, max_leaf_nodes=64, min_samples_leaf=5, max_features=1.0,
                                  bootstrap=True, max_samples=0.7, random_state=k, n_jobs=1).fit(x[train], y[train])
    predicted = np.maximum(0.0, model.predict(x[held]))
    scores.append(float(np.sqrt(np.mean((y[held] - predicted) ** 2))))

out = {"source": f"scikit-learn {sklearn.__version__} (Debian python3-sklearn) RandomForestRegressor", "fold_scores": scores}
with open(os.path.join(here, "forest_reference.json"), "w") as f:
    json.dump(out, f, indent=1)
print(out)
