"""The pandas side of scripts/bench-load.
  load FILE REPS WARMUP [zcat]  -> "median_s=... rows=..." (zcat: read from a zcat pipe)
  describe FILE                 -> "rows N", "mean COLUMN VALUE" lines, then DataFrame.describe()
                                   (count, mean, std, min, quartiles, max per column)
"""
import statistics
import subprocess
import sys
import time

import pandas as pd

if sys.argv[1] == "load":
    path, reps, warm = sys.argv[2], int(sys.argv[3]), int(sys.argv[4])
    zcat = len(sys.argv) > 5
    times = []
    for i in range(warm + reps):
        t0 = time.perf_counter()
        if zcat:
            p = subprocess.Popen(["zcat", path], stdout=subprocess.PIPE)
            d = pd.read_csv(p.stdout)
            p.wait()
        else:
            d = pd.read_csv(sys.argv[2])
        if i >= warm:
            times.append(time.perf_counter() - t0)
    print("median_s=%.4f rows=%d" % (statistics.median(times), len(d)))
else:
    d = pd.read_csv(sys.argv[2])
    print("rows %d" % len(d))
    for c in d.columns:
        print("mean %s %r" % (c, float(d[c].mean())))
    print(d.describe())
