#!/usr/bin/python3
"""Fits xgboost (hist) and sklearn's HistGradientBoostingRegressor on the same folds as
bench/Foldwise.Bench.FoldFit (written with --write DIR), with settings matched to its LightGBM
trial, and prints per-fold seconds and the OOF RMSLE.

Run with Debian's interpreter: /usr/bin/python3 bench/peers/fold_fit_peers.py DIR [--rounds 200] [--threads 2]
Per-fold time covers building the fold's matrices, fitting, and predicting the held-out rows and
the whole test table, as the C# fold does; the test matrix is built once, as the C# test view is.
"""
import argparse
import os
import sys
import time

parser = argparse.ArgumentParser()
parser.add_argument("data")
parser.add_argument("--rounds", type=int, default=200)
parser.add_argument("--threads", type=int, default=2)
parser.add_argument("--only", choices=["xgboost", "sklearn"], default=None)
args = parser.parse_args()
# OpenMP reads these at import time, so set them before numpy/sklearn/xgboost load.
os.environ["OMP_NUM_THREADS"] = str(args.threads)
os.environ.setdefault("OMP_WAIT_POLICY", "passive")

import numpy as np  # noqa: E402
import pandas as pd  # noqa: E402
import scipy.sparse as sp  # noqa: E402


def read_sparse(path, id_column, target_column=None, chunk=5000):
    """Reads a wide, mostly-zero CSV in chunks into CSR float32 (a dense float64 test table would be 1.8 GB)."""
    parts, target, names = [], [], None
    for frame in pd.read_csv(path, chunksize=chunk, dtype={id_column: str}):
        if target_column is not None:
            target.append(frame.pop(target_column).to_numpy(np.float64))
        frame = frame.drop(columns=[id_column])
        names = list(frame.columns)
        parts.append(sp.csr_matrix(frame.to_numpy(np.float32)))
    matrix = sp.vstack(parts).tocsr()
    return matrix, (np.concatenate(target) if target else None), names


def rmsle(log_actual, log_predicted):
    # Same rule as Foldwise's Metric.Score under RMSLE: predictions clamped at 0 on the log scale.
    return float(np.sqrt(np.mean((log_actual - np.maximum(0.0, log_predicted)) ** 2)))


def run(name, fit_predict, train, log_target, folds, test):
    oof = np.zeros(train.shape[0])
    test_mean = np.zeros(test.shape[0])
    fold_seconds, fold_scores = [], []
    k = int(folds.max()) + 1
    start = time.perf_counter()
    for f in range(k):
        lap = time.perf_counter()
        held = np.flatnonzero(folds == f)
        kept = np.flatnonzero(folds != f)
        validation, test_prediction = fit_predict(train[kept], log_target[kept], train[held], test, seed=7 + 1000 * f)
        oof[held] = validation
        test_mean += test_prediction / k
        fold_seconds.append(time.perf_counter() - lap)
        fold_scores.append(rmsle(log_target[held], validation))
    wall = time.perf_counter() - start
    print(f"{name}: wall {wall:.1f} s; per-fold seconds {' '.join(f'{s:.1f}' for s in fold_seconds)}")
    print(f"  fold RMSLE {' '.join(f'{s:.4f}' for s in fold_scores)}; OOF RMSLE {rmsle(log_target, oof):.4f}")
    sys.stdout.flush()
    return wall, rmsle(log_target, oof)


def xgboost_fold(rounds, threads):
    import xgboost as xgb

    params = {
        "objective": "reg:squarederror",
        "tree_method": "hist",
        "grow_policy": "lossguide",
        "max_leaves": 31,
        "max_depth": 0,
        "eta": 0.05,
        "min_child_weight": 20,  # squared error has hessian 1 per row, so this is 20 rows per leaf
        "colsample_bytree": 0.5,
        "subsample": 0.8,
        "lambda": 1.0,
        "max_bin": 255,
        "nthread": threads,
        "verbosity": 0,
    }
    cache = {}

    def fit_predict(x, y, x_held, test, seed):
        if "test" not in cache:
            cache["test"] = xgb.DMatrix(test, nthread=threads)
        booster = xgb.train({**params, "seed": seed}, xgb.DMatrix(x, label=y, nthread=threads), num_boost_round=rounds)
        return booster.predict(xgb.DMatrix(x_held, nthread=threads)), booster.predict(cache["test"])

    return fit_predict, f"xgboost {xgb.__version__} hist"


def sklearn_fold(rounds):
    import sklearn
    from sklearn.ensemble import HistGradientBoostingRegressor

    def predict_dense(model, matrix, chunk=5000):
        return np.concatenate([model.predict(matrix[i:i + chunk].toarray()) for i in range(0, matrix.shape[0], chunk)])

    def fit_predict(x, y, x_held, test, seed):
        # sklearn 1.2 has no per-tree feature or row subsampling here; the other settings match.
        model = HistGradientBoostingRegressor(
            max_iter=rounds, learning_rate=0.05, max_leaf_nodes=31, min_samples_leaf=20,
            l2_regularization=1.0, max_bins=255, early_stopping=False, random_state=seed)
        model.fit(x.toarray(), y)
        return predict_dense(model, x_held), predict_dense(model, test)

    return fit_predict, f"sklearn {sklearn.__version__} HistGradientBoostingRegressor"


clock = time.perf_counter()
train, target, _ = read_sparse(os.path.join(args.data, "train.csv"), "shipper_id", "q1_spend")
test, _, _ = read_sparse(os.path.join(args.data, "test.csv"), "shipper_id")
folds = pd.read_csv(os.path.join(args.data, "folds.csv"))["fold"].to_numpy()
print(f"read train {train.shape} test {test.shape} in {time.perf_counter() - clock:.1f} s; {args.rounds} rounds, {args.threads} threads")
log_target = np.log1p(target)
if args.only in (None, "xgboost"):
    fit, name = xgboost_fold(args.rounds, args.threads)
    run(name, fit, train, log_target, folds, test)
if args.only in (None, "sklearn"):
    fit, name = sklearn_fold(args.rounds)
    run(name, fit, train, log_target, folds, test)
