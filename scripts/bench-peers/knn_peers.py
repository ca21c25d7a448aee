"""The Python sides of scripts/bench-knn: SIDE is sklearn (KDTree, one thread), scipy (cKDTree,
balanced_tree=False for the fast build, workers=-1 for queries) or pykdtree (KDTree, OpenMP threads
from OMP_NUM_THREADS).

  run SIDE DIR REPS N Q LOO_N KMAX   times the in-process cases on the raw little-endian files
                                     KnnBench writes; prints "case seconds" then the check figures.
  blocked DIR REPS N LOO_N KMAX BLOCK
                                     scikit-learn GroupKFold over blocks of BLOCK consecutive rows of the
                                     first LOO_N rows (one fold a block), the fast way: per fold one KDTree
                                     on the other folds, one query(k=KMAX), cumulative sums; prints its
                                     median and check figures, then the usual way (cross_val_score with
                                     KNeighborsRegressor) timed once at k = 10, to be multiplied by KMAX.
  tune SIDE CSV KMAX                 whole process: pandas.read_csv, z scaling, leave-one-out RMSE for
                                     every k in 1..KMAX; prints rows, best_k, rmse_k10.

Scaling: z with the population SD, as nearfit (a common factor on all columns leaves neighbour order
unchanged anyway). Leave-one-out: one query with k = KMAX + 1, drop the row itself, cumulative sums.
"""
import os
import sys
import time

import numpy as np


def make_side(side):
    """(build(X) -> tree, query(tree, X, k) -> (dist, ind)) for one side."""
    if side == "sklearn":
        from sklearn.neighbors import KDTree
        return KDTree, lambda t, q, k: t.query(q, k=k)
    if side == "scipy":
        from scipy.spatial import cKDTree
        return (lambda x: cKDTree(x, balanced_tree=False),
                lambda t, q, k: t.query(q, k=k, workers=-1))
    if side == "pykdtree":
        from pykdtree.kdtree import KDTree
        return (lambda x: KDTree(x, leafsize=16),
                lambda t, q, k: t.query(q, k=k))
    raise SystemExit("unknown side " + side)


def loo_rmse(build, query, x, y, kmax):
    """Leave-one-out RMSE for k = 1..kmax (the tree build is counted)."""
    _, ind = query(build(x), x, kmax + 1)
    ind = np.asarray(ind, dtype=np.int64)
    rows = np.arange(len(y))
    if (ind[:, 0] == rows).all():
        nb = ind[:, 1:]
    else:  # a duplicate point came before the row itself: drop the row wherever it is, else the last
        is_self = ind == rows[:, None]
        order = np.argsort(is_self, axis=1, kind="stable")
        nb = np.take_along_axis(ind, order, axis=1)[:, :kmax]
    pred = np.cumsum(y[nb], axis=1) / np.arange(1, kmax + 1)
    return np.sqrt(((y[:, None] - pred) ** 2).mean(axis=0))


def zscale(x, ref):
    return (x - ref.mean(axis=0)) / ref.std(axis=0)


def run(side, d, reps, n, nq, nl, kmax):
    build, query = make_side(side)
    x3 = np.fromfile(d + "/x3.bin", dtype="<f8").reshape(n, 3)
    y = np.fromfile(d + "/y.bin", dtype="<f8")
    q3 = np.fromfile(d + "/q3.bin", dtype="<f8").reshape(nq, 3)
    x3s, q3s = zscale(x3, x3), zscale(q3, x3)
    x1s, q1s = x3s[:, :1].copy(), q3s[:, :1].copy()

    def timed(name, f):
        f()
        t = []
        for _ in range(reps):
            t0 = time.perf_counter()
            f()
            t.append(time.perf_counter() - t0)
        print("%s %.4f" % (name, sorted(t)[len(t) // 2]), flush=True)

    timed("fit_1d", lambda: build(x1s))
    timed("fit_3d", lambda: build(x3s))
    timed("index_3d", lambda: build(x3s))
    t1, t3 = build(x1s), build(x3s)
    timed("query_1d", lambda: query(t1, q1s, 10))
    timed("query_3d", lambda: query(t3, q3s, 10))
    xl = zscale(x3[:nl], x3[:nl])  # scaled on the leave-one-out rows, as nearfit does
    yl = y[:nl].copy()
    timed("loo_allk_3d", lambda: loo_rmse(build, query, xl, yl, kmax))
    r = loo_rmse(build, query, xl, yl, kmax)
    print("check_loo_rmse_k10 %.9f" % r[9])
    print("check_best_k %d" % (int(np.argmin(r)) + 1))
    dist, _ = query(t3, q3s, 10)
    print("check_query_3d_kdist %.9f" % np.asarray(dist)[:, 9].mean())


def blocked_rmse(x, y, groups, kmax):
    """GroupKFold, one fold per block: per fold a KDTree on the other rows, one query, cumulative sums."""
    from sklearn.model_selection import GroupKFold
    from sklearn.neighbors import KDTree
    nblocks = len(np.unique(groups))
    se = np.zeros(kmax)
    for train, test in GroupKFold(n_splits=nblocks).split(x, y, groups):
        _, ind = KDTree(x[train]).query(x[test], k=kmax)
        pred = np.cumsum(y[train][ind], axis=1) / np.arange(1, kmax + 1)
        se += ((y[test][:, None] - pred) ** 2).sum(axis=0)
    return np.sqrt(se / len(y))


def blocked(d, reps, n, nl, kmax, block):
    from sklearn.model_selection import GroupKFold, cross_val_score
    from sklearn.neighbors import KNeighborsRegressor
    x3 = np.fromfile(d + "/x3.bin", dtype="<f8").reshape(n, 3)
    y = np.fromfile(d + "/y.bin", dtype="<f8")[:nl].copy()
    x = zscale(x3[:nl], x3[:nl])
    groups = np.arange(nl) // block
    t = []
    for _ in range(reps):
        t0 = time.perf_counter()
        r = blocked_rmse(x, y, groups, kmax)
        t.append(time.perf_counter() - t0)
    print("blocked_allk_3d %.4f" % sorted(t)[len(t) // 2], flush=True)
    print("check_blocked_rmse_k10 %.9f" % r[9])
    print("check_blocked_best_k %d" % (int(np.argmin(r)) + 1))
    t0 = time.perf_counter()
    cross_val_score(KNeighborsRegressor(n_neighbors=10, algorithm="kd_tree"), x, y, groups=groups,
                    cv=GroupKFold(n_splits=len(np.unique(groups))), scoring="neg_mean_squared_error")
    print("usual_one_k %.4f" % (time.perf_counter() - t0), flush=True)


def tune(side, path, kmax):
    import pandas as pd
    build, query = make_side(side)
    v = pd.read_csv(path).to_numpy(dtype=np.float64)
    x, y = np.ascontiguousarray(v[:, :-1]), np.ascontiguousarray(v[:, -1])
    r = loo_rmse(build, query, zscale(x, x), y, kmax)
    print("rows %d\nbest_k %d\nrmse_k10 %.9f" % (len(y), int(np.argmin(r)) + 1, r[9]))


if __name__ == "__main__":
    a = sys.argv
    if a[1] == "blocked":
        blocked(a[2], int(a[3]), int(a[4]), int(a[5]), int(a[6]), int(a[7]))
    elif a[1] == "run":
        run(a[2], a[3], int(a[4]), int(a[5]), int(a[6]), int(a[7]), int(a[8]))
    else:
        tune(a[2], a[3], int(a[4]))
