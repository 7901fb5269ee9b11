#!/usr/bin/python3
"""Reference solutions for the blend solvers, computed with scipy (Debian python3-scipy).

Run:  /usr/bin/python3 make_reference.py   (writes reference_problems.json beside this file)

Twenty seeded problems shaped like out-of-fold predictions of a log-scale target: columns are the
target plus a bias, a shared error and their own noise, with duplicated, affinely collinear
(midpoints, 1.5a - 0.5b), scaled and pure-noise columns mixed in. Values are rounded to 3 decimals
before solving so the stored text is exactly the matrix scipy saw.

  simplex: min ||y - P w||^2, w >= 0, sum w = 1, two ways:
           (a) scipy.optimize.minimize(method="SLSQP") with tight tolerances;
           (b) an exact reduction to NNLS: with D = P - y 1^T, u = argmin_{u>=0} ||D u||^2 + c^2 (1^T u - 1)^2
               has u = t w with value q c^2 / (q + c^2), increasing in q = ||D w||^2, so w = u / sum(u)
               solves the simplex problem; scipy.optimize.nnls (Lawson-Hanson) solves it exactly.
           The reference objective is the lower of the two, computed from the residual. "simplex_exact"
           is true when (b) passes the KKT check (w >= 0, sum 1, every multiplier (E w)_i - w^T E w >= 0).
  nnls:    scipy.optimize.nnls (Lawson-Hanson), objective from the residual.
"""
import json
import os

import numpy as np
import scipy
from scipy.optimize import minimize, nnls

SEED = 20261201
SIZES = [(2, 50), (3, 60), (5, 80), (8, 120), (10, 500), (12, 200), (15, 150), (20, 300), (25, 250),
         (30, 400), (35, 100), (40, 450), (45, 200), (50, 500), (50, 60), (6, 500), (18, 90), (28, 350),
         (50, 300), (33, 180)]


def problem(rng, index, k, n):
    y_true = 3 + rng.gamma(2.0, 0.5, n)
    y = np.round(y_true + 0.3 * rng.normal(size=n), 3)
    shared = rng.normal(size=n)
    cols = []
    for j in range(k):
        bias = rng.normal(0, 0.2)
        load = rng.uniform(0, 0.5)
        noise = rng.uniform(0.2, 1.0)
        cols.append(np.round(y_true + bias + load * shared + noise * rng.normal(size=n), 3))
    kinds = []
    if k >= 3:
        # Degenerate columns overwrite the last few, so every size keeps its shape.
        last = k - 1
        a, b = 0, 1
        if index % 3 in (0, 2):
            cols[last] = cols[a].copy()
            kinds.append("duplicate")
            last -= 1
        if index % 3 in (1, 2) and last > 1:
            cols[last] = 0.5 * (cols[a] + cols[b])
            kinds.append("midpoint")
            last -= 1
            if last > 1:
                cols[last] = 1.5 * cols[a] - 0.5 * cols[b]
                kinds.append("affine")
                last -= 1
        if index % 4 == 3 and last > 1:
            cols[last] = 2.0 * cols[b]
            kinds.append("scaled")
            last -= 1
        if index % 5 == 4 and last > 1:
            cols[last] = np.round(rng.normal(3.5, 1.0, size=n), 3)
            kinds.append("noise")
            last -= 1
    return np.column_stack(cols), y, kinds


def objective(P, y, w):
    r = y - P @ w
    return float(r @ r)


def simplex_reference(P, y):
    k = P.shape[1]
    f = lambda w: objective(P, y, w)
    jac = lambda w: 2.0 * (P.T @ (P @ w - y))
    res = minimize(f, np.full(k, 1.0 / k), jac=jac, method="SLSQP",
                   bounds=[(0.0, 1.0)] * k,
                   constraints=[{"type": "eq", "fun": lambda w: w.sum() - 1.0, "jac": lambda w: np.ones(k)}],
                   options={"ftol": 1e-16, "maxiter": 5000})
    w_slsqp = np.clip(res.x, 0, None)
    w_slsqp /= w_slsqp.sum()
    slsqp = objective(P, y, w_slsqp)

    D = P - y[:, None]
    c = np.sqrt(np.mean((D * D).sum(axis=0)))
    u, _ = nnls(np.vstack([D, np.full((1, k), c)]), np.concatenate([np.zeros(len(y)), [c]]))
    w_exact = u / u.sum()
    g = D.T @ (D @ w_exact)
    lam = float(w_exact @ g)
    scale = np.sqrt((D * D).sum(axis=0)) * np.sqrt(max(lam, 0))
    exact = bool(w_exact.min() >= 0 and abs(w_exact.sum() - 1) < 1e-12 and np.all(g - lam >= -1e-9 * scale))
    reduced = objective(P, y, w_exact)
    best_w, best = (w_exact, reduced) if reduced <= slsqp else (w_slsqp, slsqp)
    return best_w, best, exact, int(res.nit), slsqp, reduced


def main():
    rng = np.random.default_rng(SEED)
    problems = []
    for index, (k, n) in enumerate(SIZES):
        P, y, kinds = problem(rng, index, k, n)
        w_s, obj_s, exact, nit, slsqp, reduced = simplex_reference(P, y)
        w_n, rnorm = nnls(P, y)
        problems.append({
            "name": f"p{index:02d}-k{k}-n{n}" + "".join("-" + x for x in kinds),
            "columns": [P[:, j].tolist() for j in range(k)],
            "target": y.tolist(),
            "simplex_objective": obj_s,
            "simplex_exact": exact,
            "simplex_weights": w_s.tolist(),
            "slsqp_iterations": nit,
            "slsqp_objective": slsqp,
            "nnls_reduction_objective": reduced,
            "nnls_objective": objective(P, y, w_n),
            "nnls_residual_norm": float(rnorm),
            "nnls_weights": w_n.tolist(),
        })
        print(f"{problems[-1]['name']:40s} simplex {obj_s:.12g} exact={exact} slsqp-reduction={slsqp - reduced:+.2e}  nnls {problems[-1]['nnls_objective']:.12g}")
    out = {
        "generator": "make_reference.py",
        "seed": SEED,
        "scipy": scipy.__version__,
        "numpy": np.__version__,
        "problems": problems,
    }
    path = os.path.join(os.path.dirname(os.path.abspath(__file__)), "reference_problems.json")
    with open(path, "w") as fh:
        json.dump(out, fh, separators=(",", ":"))
    print(f"wrote {path} ({os.path.getsize(path)} bytes)")


if __name__ == "__main__":
    main()
