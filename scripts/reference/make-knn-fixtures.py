#!/usr/bin/python3
"""Writes the k-NN reference fixtures under src/test/resources/knn/ from scikit-learn and numpy.

Run with Debian's /usr/bin/python3 (python3-sklearn, python3-numpy, python3-scipy). Each fixture
records the library versions and the parameters. Format, read by the tests' Fixture class:
  # comment lines (versions, parameters)
  @name rows cols      then rows lines of cols whitespace-separated numbers (repr, round-trip exact)
"""
import os
import sys
import numpy as np
import scipy
import sklearn
from scipy.spatial.distance import cdist
from sklearn.datasets import load_diabetes
from sklearn.neighbors import KDTree, KNeighborsRegressor
from sklearn.preprocessing import StandardScaler

OUT = os.path.join(os.path.dirname(os.path.abspath(__file__)), "..", "..", "src", "test", "resources", "knn")


class Writer:
    def __init__(self, path, params):
        self.f = open(path, "w")
        self.f.write("# made by scripts/reference/make-knn-fixtures.py\n")
        self.f.write("# python %s, numpy %s, scikit-learn %s, scipy %s\n" % (
            sys.version.split()[0], np.__version__, sklearn.__version__, scipy.__version__))
        self.f.write("# parameters: %s\n" % params)

    def put(self, name, a):
        a = np.asarray(a, dtype=float)
        if a.ndim == 1:
            a = a.reshape(-1, 1)
        self.f.write("@%s %d %d\n" % (name, a.shape[0], a.shape[1]))
        for row in a:
            self.f.write(" ".join(repr(float(v)) for v in row) + "\n")

    def close(self):
        self.f.close()


def loo_uniform(Xs, y, k):
    """Leave-one-out fit: k+1 neighbours including self, drop the row's own index."""
    tree = KDTree(Xs)
    dist, ind = tree.query(Xs, k=k + 2)
    out = np.empty(len(y))
    for i in range(len(y)):
        others = [j for j in ind[i] if j != i][:k]
        out[i] = y[others].mean()
    # rows whose k-th and (k+1)-th other neighbours tie are ambiguous: mark them
    tie = np.zeros(len(y))
    for i in range(len(y)):
        dd = [d for d, j in zip(dist[i], ind[i]) if j != i]
        tie[i] = 1.0 if abs(dd[k - 1] - dd[k]) <= 1e-12 * max(1.0, dd[k]) else 0.0
    return out, tie


def synthetic(dims, n, nq, k, seed):
    rng = np.random.default_rng(seed)
    X = rng.uniform(0, 10, size=(n, dims))
    y = np.sin(X[:, 0]) + 0.1 * X.sum(axis=1) + rng.normal(0, 0.2, size=n)
    Q = rng.uniform(0, 10, size=(nq, dims))
    name = "synthetic-%dd.txt" % dims
    w = Writer(os.path.join(OUT, name), "seed=%d n=%d queries=%d k=%d dims=%d; StandardScaler (population SD); "
               "x ~ U(0,10), y = sin(x0) + 0.1*sum(x) + N(0,0.2)" % (seed, n, nq, k, dims))
    write_case(w, X, y, Q, k, dims)
    w.close()


def write_case(w, X, y, Q, k, dims):
    sc = StandardScaler().fit(X)
    Xs, Qs = sc.transform(X), sc.transform(Q)
    w.put("k", [k])
    w.put("X", X)
    w.put("y", y)
    w.put("Q", Q)
    for weights in ("uniform", "distance"):
        m = KNeighborsRegressor(n_neighbors=k, weights=weights, algorithm="brute").fit(Xs, y)
        w.put("predict_" + weights, m.predict(Qs))
    for metric in ("euclidean", "manhattan", "chebyshev"):
        dist, ind = KDTree(Xs, metric=metric).query(Qs, k=k)
        w.put("dist_" + metric, dist)
        w.put("ind_" + metric, ind)
    loo, tie = loo_uniform(Xs, y, k)
    w.put("loo_uniform", loo)
    w.put("loo_tie", tie)
    if dims > 1:
        cov = np.cov(Xs, rowvar=False, bias=True)
        dm = cdist(Qs, Xs, metric="mahalanobis", VI=np.linalg.inv(cov))
        order = np.argsort(dm, axis=1, kind="stable")[:, :k]
        w.put("ind_mahalanobis", order)
        w.put("dist_mahalanobis", np.take_along_axis(dm, order, axis=1))


def diabetes(k):
    data = load_diabetes()
    cols = ["bmi", "bp", "s5"]  # continuous columns (sex is binary)
    idx = [list(data.feature_names).index(c) for c in cols]
    X = data.data[:, idx]
    y = data.target
    rng = np.random.default_rng(11)
    Q = X[rng.choice(len(y), 40, replace=False)] + rng.normal(0, 0.002, size=(40, 3))
    w = Writer(os.path.join(OUT, "diabetes.txt"), "sklearn.datasets.load_diabetes, inputs %s, response target, "
               "k=%d, queries = 40 rows (seed 11) + N(0,0.002); StandardScaler" % (",".join(cols), k))
    write_case(w, X, y, Q, k, 3)
    w.close()


def percentiles():
    rng = np.random.default_rng(5)
    probs = [0.0, 0.05, 0.1, 0.25, 0.5, 0.75, 0.9, 0.95, 1.0]
    w = Writer(os.path.join(OUT, "percentile.txt"), "numpy.percentile default (linear, Hyndman & Fan def. 7); "
               "samples of sizes 1..25 from N(0,1) rounded to 2 decimals (ties), seed 5; probabilities %s" % probs)
    w.put("p", probs)
    for n in range(1, 26):
        v = np.round(rng.normal(0, 1, size=n), 2)
        w.put("sample%d" % n, v)
        w.put("q%d" % n, np.percentile(v, [100 * p for p in probs]))
    w.close()


if __name__ == "__main__":
    os.makedirs(OUT, exist_ok=True)
    synthetic(1, 300, 60, 5, 101)
    synthetic(3, 400, 60, 7, 103)
    synthetic(5, 400, 60, 7, 105)
    diabetes(10)
    percentiles()
