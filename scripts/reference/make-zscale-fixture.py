#!/usr/bin/python3
"""Writes src/test/resources/knn/zscale.txt: the reference z scale that follows the curve, from scikit-learn,
numpy and scipy.

Run with Debian's /usr/bin/python3 (python3-sklearn, python3-numpy, python3-scipy). Format as
make-knn-fixtures.py (# comments with versions and parameters, then @name rows cols and the numbers, repr
round-trip exact).

Data (synthetic, seeded; not the demo log): 240 reference rows, 2 inputs uniform on [0, 10) (continuous: no
two rows share a distance to a query, so scikit-learn's "exactly k" and nearfit's tie rule select the same
rows), a heteroscedastic curve y = 1000 / (1 + exp(-1.5 (x0 - 5))) + 20 x1 + noise with SD 2 + 60 * (the
logistic's slope at x0), and a flat stretch y = 0 exactly (no noise) where x0 < 2.5. Inputs are pre-scaled
(z with numpy's population SD) and given to nearfit unscaled (scaling none). 8 groups at random.

1. Held-out residuals: LeaveOneGroupOut over the 8 groups, KNeighborsRegressor(n_neighbors=7,
   algorithm='brute', weights='uniform') refitted per group (cross_val_predict); e_i = y_i - prediction.
2. Global scale: median and 1.4826 * MAD of all e_i (numpy.median).
3. Per query (60 new points of the same curve, 12 of them in the flat stretch with small nonzero responses),
   the 7 nearest reference rows (NearestNeighbors, brute): fit = their mean response; m and s = numpy.median
   of their e and 1.4826 * median |e - m| (checked against scipy.stats.median_abs_deviation with
   scale = 1 / 1.4826: nearfit's constant is 1.4826, scipy's 'normal' is 1.482602218505602);
   z = (y - fit - m) / max(s, FLOOR_SHARE * global scale).
4. Leave-one-out flags under the reference scale: per reference row, its 7 nearest other rows: the
   leave-one-out fit and residual, and m, s, z as in 3 over those rows' held-out residuals.
Uniform weights only: numpy has no weighted median of nearfit's weighted quantile rule (its own).
"""
import os
import sys

import numpy as np
import scipy
import sklearn
from scipy.stats import median_abs_deviation
from sklearn.model_selection import LeaveOneGroupOut, cross_val_predict
from sklearn.neighbors import KNeighborsRegressor, NearestNeighbors

OUT = os.path.join(os.path.dirname(os.path.abspath(__file__)), "..", "..", "src", "test", "resources", "knn",
                   "zscale.txt")
N = 240
Q = 60
K = 7
GROUPS = 8
SEED = 20261203
MAD_TO_SD = 1.4826
FLOOR_SHARE = float(sys.argv[1]) if len(sys.argv) > 1 else 0.25  # nearfit's Flags.SPREAD_FLOOR_SHARE


def put(f, name, a):
    a = np.asarray(a, dtype=float)
    if a.ndim == 1:
        a = a.reshape(-1, 1)
    f.write("@%s %d %d\n" % (name, a.shape[0], a.shape[1]))
    for row in a:
        f.write(" ".join(repr(float(v)) for v in row) + "\n")


def curve(rng, X):
    s = 1 / (1 + np.exp(-1.5 * (X[:, 0] - 5)))
    sd = 2 + 60 * 1.5 * s * (1 - s)
    y = 1000 * s + 20 * X[:, 1] + rng.normal(0, 1, len(X)) * sd
    y[X[:, 0] < 2.5] = 0.0
    return y


def spread(e):
    m = np.median(e)
    s = MAD_TO_SD * np.median(np.abs(e - m))
    s_scipy = median_abs_deviation(e, scale=1 / MAD_TO_SD)
    assert abs(s - s_scipy) <= 1e-9 * max(1.0, abs(s)), (s, s_scipy)
    return m, s


def main():
    rng = np.random.default_rng(SEED)
    X = rng.uniform(0, 10, size=(N, 2))
    y = curve(rng, X)
    mean, sd = X.mean(axis=0), X.std(axis=0)
    Xs = (X - mean) / sd
    groups = rng.integers(0, GROUPS, size=N)
    Xq = rng.uniform(0, 10, size=(Q, 2))
    Xq[:12, 0] = rng.uniform(0, 1.5, size=12)
    yq = curve(rng, Xq)
    yq[:12] = rng.choice([0.0, 0.5, 2.0, -1.0, 5.0], size=12)
    Xqs = (Xq - mean) / sd

    pred = cross_val_predict(KNeighborsRegressor(n_neighbors=K, algorithm="brute", weights="uniform"), Xs, y,
                             groups=groups, cv=LeaveOneGroupOut())
    e = y - pred
    gm, gs = spread(e)
    floor = FLOOR_SHARE * gs

    nn = NearestNeighbors(n_neighbors=K + 1, algorithm="brute").fit(Xs)
    _, qi = nn.kneighbors(Xqs, n_neighbors=K)
    scored = []
    for j in range(Q):
        nb = qi[j]
        fit = y[nb].mean()
        m, s = spread(e[nb])
        scored.append([fit, m, s, (yq[j] - fit - m) / max(s, floor)])
    _, ri = nn.kneighbors(Xs, n_neighbors=K + 1)
    flags = []
    for i in range(N):
        nb = [r for r in ri[i] if r != i][:K]
        fit = y[nb].mean()
        m, s = spread(e[nb])
        flags.append([fit, m, s, (y[i] - fit - m) / max(s, floor)])

    with open(OUT, "w") as f:
        f.write("# made by scripts/reference/make-zscale-fixture.py\n")
        f.write("# python %s, numpy %s, scikit-learn %s, scipy %s\n" % (sys.version.split()[0], np.__version__,
                                                                        sklearn.__version__, scipy.__version__))
        f.write("# parameters: n %d, queries %d, k %d, %d groups (LeaveOneGroupOut), seed %d, inputs z-scaled "
                "(population SD), KNeighborsRegressor algorithm=brute weights=uniform, MAD x %s, floor share %s\n"
                % (N, Q, K, GROUPS, SEED, MAD_TO_SD, FLOOR_SHARE))
        put(f, "x", Xs)
        put(f, "y", y)
        put(f, "groups", groups)
        put(f, "heldout_residual", e)
        put(f, "global", [gm, gs, floor])
        put(f, "query_x", Xqs)
        put(f, "query_y", yq)
        put(f, "scored", scored)  # columns: fit, neighbours' median, 1.4826 MAD, z
        put(f, "loo_flags", flags)  # columns: leave-one-out fit, neighbours' median, 1.4826 MAD, z
    print("wrote", OUT, "floor share", FLOOR_SHARE)


if __name__ == "__main__":
    main()
