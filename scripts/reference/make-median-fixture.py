#!/usr/bin/python3
"""Writes src/test/resources/knn/median-1d.txt and median-2d.txt: the k nearest neighbours' median
of the response, computed in numpy, for nearfit's --estimate median.

Run with Debian's /usr/bin/python3 (python3-numpy). Each fixture records numpy's version and the
parameters; the format is make-knn-fixtures.py's (read by the tests' Fixture class). Inputs are
z-scaled (mean, population SD), distances Euclidean, continuous data (no tied distances), and a
tenth of the rows sit at half the response (a curtailment-like cluster) so mean and median differ.
  med_uniform_kK   numpy.median of the k neighbours' responses (Hyndman & Fan definition 7 at 0.5,
                   numpy.percentile's default 'linear' method, checked equal below)
  med_inverse_kK   weights w = 1/d; responses sorted ascending with their weights, cumulative sums
                   C_i, total W; plotting positions p_i = (C_i - (w_i + w_1)/2) / (W - (w_1 + w_n)/2);
                   numpy.interp(0.5, p, sorted responses). The rule is nearfit's own generalisation of
                   definition 7 (equal weights give (i-1)/(n-1)); this is an independent implementation.
  loo_median_kK    leave-one-out: numpy.median of the k nearest other rows' responses, per row
  loo_rmse_median  leave-one-out RMSE of that median for k = 1..KMAX (uniform weights)
"""
import os
import sys
import numpy as np

OUT = os.path.join(os.path.dirname(os.path.abspath(__file__)), "..", "..", "src", "test", "resources", "knn")
KS = [7, 8]  # an odd and an even k: the median is a middle value, then the mean of the middle two
KMAX = 12


class Writer:
    def __init__(self, path, params):
        self.f = open(path, "w")
        self.f.write("# made by scripts/reference/make-median-fixture.py\n")
        self.f.write("# python %s, numpy %s\n" % (sys.version.split()[0], np.__version__))
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


def weighted_median(values, weights):
    order = np.argsort(values, kind="stable")
    v = values[order]
    w = weights[order]
    c = np.cumsum(w)
    p = (c - (w + w[0]) / 2) / (c[-1] - (w[0] + w[-1]) / 2)
    return float(np.interp(0.5, p, v))


def case(dims, n, nq, seed):
    rng = np.random.default_rng(seed)
    X = rng.uniform(0, 10, size=(n, dims))
    y = np.sin(X[:, 0]) + 0.1 * X.sum(axis=1) + rng.normal(0, 0.2, size=n) + 2.0
    low = rng.random(n) < 0.1
    y[low] *= 0.5
    Q = rng.uniform(0, 10, size=(nq, dims))
    mu, sd = X.mean(axis=0), X.std(axis=0)
    Xs, Qs = (X - mu) / sd, (Q - mu) / sd
    w = Writer(os.path.join(OUT, "median-%dd.txt" % dims),
               "seed=%d n=%d queries=%d dims=%d k=%s kmax=%d; z scaling (population SD), Euclidean; "
               "x ~ U(0,10), y = 2 + sin(x0) + 0.1*sum(x) + N(0,0.2), halved in a seeded tenth of rows"
               % (seed, n, nq, dims, KS, KMAX))
    w.put("k", KS)
    w.put("kmax", [KMAX])
    w.put("X", X)
    w.put("y", y)
    w.put("Q", Q)
    dq = np.sqrt(((Qs[:, None, :] - Xs[None, :, :]) ** 2).sum(axis=2))
    for k in KS:
        uni, inv = [], []
        for i in range(nq):
            nb = np.argsort(dq[i], kind="stable")[:k]
            assert dq[i][nb[-1]] < np.sort(dq[i])[k], "tied k-th distance"
            m = np.median(y[nb])
            assert m == np.percentile(y[nb], 50, method="linear")
            uni.append(m)
            inv.append(weighted_median(y[nb], 1 / dq[i][nb]))
        w.put("med_uniform_k%d" % k, uni)
        w.put("med_inverse_k%d" % k, inv)
    dr = np.sqrt(((Xs[:, None, :] - Xs[None, :, :]) ** 2).sum(axis=2))
    np.fill_diagonal(dr, np.inf)
    order = np.argsort(dr, axis=1, kind="stable")
    for k in KS:
        w.put("loo_median_k%d" % k, [np.median(y[order[i, :k]]) for i in range(n)])
    rmse = []
    for k in range(1, KMAX + 1):
        e = y - np.array([np.median(y[order[i, :k]]) for i in range(n)])
        rmse.append(np.sqrt(np.mean(e * e)))
    w.put("loo_rmse_median", rmse)
    w.close()


if __name__ == "__main__":
    os.makedirs(OUT, exist_ok=True)
    case(1, 200, 40, 141)
    case(2, 200, 40, 142)
    print("wrote", os.path.normpath(os.path.join(OUT, "median-1d.txt")), "and median-2d.txt")
