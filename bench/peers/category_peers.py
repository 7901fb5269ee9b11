#!/usr/bin/python3
"""Fits scikit-learn's HistGradientBoostingRegressor on the same table and folds as
`bench/Foldwise.Bench.Tables cv` (which writes DIR/folds.csv and DIR/foldwise_oof.csv), at settings matched to its
LightGBM trial (rounds, learning rate 0.05, 31 leaves, 20 rows per leaf, no L2, no early stopping), on log1p(target),
twice: with its native categorical splits, and with one indicator column per level. Prints each OOF RMSLE beside
Foldwise's.

Run with Debian's interpreter:
  /usr/bin/python3 bench/peers/category_peers.py TRAIN.csv ID TARGET DIR [--rounds 500]
"""
import argparse
import os

parser = argparse.ArgumentParser()
parser.add_argument("train")
parser.add_argument("id")
parser.add_argument("target")
parser.add_argument("data")
parser.add_argument("--rounds", type=int, default=500)
args = parser.parse_args()
os.environ.setdefault("OMP_NUM_THREADS", "1")

import numpy as np  # noqa: E402
import pandas as pd  # noqa: E402
from sklearn.ensemble import HistGradientBoostingRegressor  # noqa: E402

table = pd.read_csv(args.train)
folds = pd.read_csv(os.path.join(args.data, "folds.csv"))
ours = pd.read_csv(os.path.join(args.data, "foldwise_oof.csv"))
table[args.id] = table[args.id].astype(str)
folds["id"] = folds["id"].astype(str)
ours["id"] = ours["id"].astype(str)
table = table.merge(folds, left_on=args.id, right_on="id", suffixes=("", "_fold"))
y = np.log1p(table[args.target].to_numpy(dtype=float))
features = table.drop(columns=[args.id, args.target, "fold"] + (["id"] if args.id != "id" else []))
text = [c for c in features.columns if features[c].dtype == object]
native = features.copy()
for c in text:
    native[c] = native[c].astype("category").cat.codes.replace(-1, np.nan)
indicators = pd.get_dummies(features, columns=text, dummy_na=True, dtype=float)


def oof_rmsle(x, categorical):
    oof = np.zeros(len(y))
    for f in sorted(table["fold"].unique()):
        held = (table["fold"] == f).to_numpy()
        model = HistGradientBoostingRegressor(
            learning_rate=0.05, max_iter=args.rounds, max_leaf_nodes=31, min_samples_leaf=20, l2_regularization=0.0,
            early_stopping=False, categorical_features=categorical, random_state=1)
        model.fit(x[~held], y[~held])
        oof[held] = model.predict(x[held])
    return float(np.sqrt(np.mean((oof - y) ** 2)))


mask = [c in text for c in native.columns]
native_score = oof_rmsle(native.to_numpy(dtype=float), mask)
indicator_score = oof_rmsle(indicators.to_numpy(dtype=float), None)
ours = ours.set_index("id").loc[table[args.id]]
ours_score = float(np.sqrt(np.mean((ours["log1p_prediction"].to_numpy() - y) ** 2)))
print(f"rows {len(y)}, category columns {text}, {args.rounds} rounds")
print(f"sklearn HistGradientBoostingRegressor, native categorical: OOF RMSLE {native_score:.5f}")
print(f"sklearn HistGradientBoostingRegressor, indicator columns:  OOF RMSLE {indicator_score:.5f}")
print(f"foldwise (LightGBM, indicators inside each fold):          OOF RMSLE {ours_score:.5f}  "
      f"ratio to native {ours_score / native_score:.4f}")
