#!/usr/bin/python3
"""Writes src/test/resources/knn/heldout.txt: held-out RMSE for every k from scikit-learn, and blocked SEs from numpy.

Run with Debian's /usr/bin/python3 (python3-sklearn, python3-numpy). Format as make-knn-fixtures.py
(# comments with versions and parameters, then @name rows cols and the numbers, repr round-trip exact).

Data: 240 rows, 2 inputs uniform on [0, 10) (continuous: no two rows share a distance to a query, so
scikit-learn's "exactly k" and nearfit's tie rule select the same rows), y = sin(x0) + 0.3 x1 + noise.
Inputs are pre-scaled (z with numpy's population SD) and given to nearfit unscaled (scaling none).
Schemes, each refitted for every k (KNeighborsRegressor, algorithm='brute', weights uniform and distance):
  logo6    LeaveOneGroupOut over 6 unequal groups
  logo40   LeaveOneGroupOut over 40 groups of 6 rows (more than 32 blocks: nearfit's filtered search)
  gkf4     GroupKFold(n_splits=4) over the 6 groups
  kf5      KFold(n_splits=5, shuffle=True, random_state=0)
The split of each scheme is written as one block id per row (@blocks_*), since nearfit's folds are seeded
its own way. RMSE over all rows of the held-out predictions (cross_val_predict).
Blocked SE (logo40, uniform weights): the per-block means of e^2 and |e| over the 40 equal blocks, their
sample SD (ddof 1) over sqrt(40); SE(RMSE) = SE(MSE) / (2 RMSE) (delta method).
"""
import os
import sys

import numpy as np
import sklearn
from sklearn.model_selection import GroupKFold, KFold, LeaveOneGroupOut, cross_val_predict
from sklearn.neighbors import KNeighborsRegressor

OUT = os.path.join(os.path.dirname(os.path.abspath(__file__)), "..", "..", "src", "test", "resources", "knn",
                   "heldout.txt")
N = 240
KMAX = 15
SEED = 20261202


def put(f, name, a):
    a = np.asarray(a, dtype=float)
    if a.ndim == 1:
        a = a.reshape(-1, 1)
    f.write("@%s %d %d\n" % (name, a.shape[0], a.shape[1]))
    for row in a:
        f.write(" ".join(repr(float(v)) for v in row) + "\n")


def main():
    rng = np.random.default_rng(SEED)
    X = rng.uniform(0, 10, size=(N, 2))
    y = np.sin(X[:, 0]) + 0.3 * X[:, 1] + rng.normal(0, 0.2, N)
    Xs = (X - X.mean(axis=0)) / X.std(axis=0)
    groups6 = rng.choice(6, size=N, p=[0.1, 0.15, 0.15, 0.2, 0.2, 0.2])
    groups40 = rng.permutation(np.repeat(np.arange(40), 6))

    schemes = {
        "logo6": (LeaveOneGroupOut(), groups6),
        "logo40": (LeaveOneGroupOut(), groups40),
        "gkf4": (GroupKFold(n_splits=4), groups6),
        "kf5": (KFold(n_splits=5, shuffle=True, random_state=0), None),
    }
    with open(OUT, "w") as f:
        f.write("# made by scripts/reference/make-heldout-fixture.py\n")
        f.write("# python %s, numpy %s, scikit-learn %s\n" % (sys.version.split()[0], np.__version__,
                                                              sklearn.__version__))
        f.write("# parameters: n %d, 2 inputs uniform [0,10), seed %d, inputs z-scaled (population SD), "
                "KNeighborsRegressor algorithm=brute, k 1..%d, refitted per k and fold\n" % (N, SEED, KMAX))
        put(f, "x", Xs)
        put(f, "y", y)
        for name, (cv, groups) in schemes.items():
            block = np.empty(N)
            for b, (_, test) in enumerate(cv.split(Xs, y, groups)):
                block[test] = b
            put(f, "blocks_" + name, block)
            for weights in ("uniform", "distance"):
                rmse = []
                for k in range(1, KMAX + 1):
                    model = KNeighborsRegressor(n_neighbors=k, weights=weights, algorithm="brute")
                    pred = cross_val_predict(model, Xs, y, groups=groups, cv=cv)
                    rmse.append(np.sqrt(np.mean((y - pred) ** 2)))
                    if name == "logo40" and weights == "uniform":
                        e = y - pred
                        if k == 1:
                            se = []
                        bmse = np.array([np.mean(e[groups40 == b] ** 2) for b in range(40)])
                        bmae = np.array([np.mean(np.abs(e[groups40 == b])) for b in range(40)])
                        se_mse = bmse.std(ddof=1) / np.sqrt(40)
                        se.append([np.sqrt(bmse.mean()), se_mse / (2 * np.sqrt(bmse.mean())), bmae.mean(),
                                   bmae.std(ddof=1) / np.sqrt(40)])
                put(f, "rmse_%s_%s" % (name, weights), rmse)
        put(f, "blocked_se_logo40_uniform", se)  # columns: rmse, se_rmse, mae, se_mae per k
    print("wrote", OUT)


if __name__ == "__main__":
    main()
