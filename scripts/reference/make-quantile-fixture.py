#!/usr/bin/python3
"""Writes src/test/resources/table/quantiles-numpy.txt: seeded samples with numpy's summary statistics.

Run with Debian's /usr/bin/python3 (python3-numpy). The fixture's first line records numpy's version and
the parameters. Quantiles: numpy.percentile, method 'linear' (Hyndman & Fan 1996 definition 7).
SD: numpy.std with ddof=1 (the sample SD nearfit reports). Mean: numpy.mean.
"""
import os
import numpy as np

SEED = 20261201
PERCENTS = [1, 25, 50, 75, 99]
out = os.path.join(os.path.dirname(__file__), "..", "..", "src", "test", "resources", "table",
                   "quantiles-numpy.txt")
rng = np.random.default_rng(SEED)
cases = [
    ("one", np.array([3.25])),
    ("two", np.array([-1.0, 4.0])),
    ("five", rng.normal(10.0, 3.0, 5)),
    ("ties", rng.integers(0, 6, 1000).astype(float)),          # many tied values
    ("normal-1000", rng.normal(50.0, 12.0, 1000)),
    ("skewed-1000", rng.exponential(2.0, 1000) * 1e3),
    ("rounded-1000", np.round(rng.uniform(-5, 25, 1000), 1)),  # ties from rounding, as loggers write
]
with open(out, "w") as f:
    f.write("# numpy %s; seed %d (numpy.random.default_rng); percentiles %s method=linear; "
            "std ddof=1; columns: min p01 p25 median p75 p99 max mean sd\n"
            % (np.__version__, SEED, PERCENTS))
    for name, x in cases:
        q = np.percentile(x, PERCENTS, method="linear")
        sd = np.std(x, ddof=1) if len(x) > 1 else float("nan")
        stats = [x.min(), *q, x.max(), np.mean(x), sd]
        f.write("case %s %d\n" % (name, len(x)))
        f.write("values " + " ".join(repr(float(v)) for v in x) + "\n")
        f.write("stats " + " ".join(repr(float(v)) for v in stats) + "\n")
print("wrote", os.path.normpath(out))
