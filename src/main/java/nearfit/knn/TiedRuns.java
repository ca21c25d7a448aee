package nearfit.knn;

/**
 * Totals of the long runs of equal coordinate in a one-input reference, so a query whose counted
 * neighbours are exactly one such run is answered in O(log n) instead of walking every tied row.
 * Logged inputs are rounded by the sensor (wind speed to 0.01 m/s: a 10M-row log holds thousands
 * of rows per value), so a leave-one-out row, or a new reading on the same grid, usually has more
 * than k rows at distance 0, and the tie rule then makes every one of them count equally.
 *
 * <p>When the counted neighbours are one run of m rows (all at the k-th key D, none closer, none
 * else that ties D), every weighting gives them equal weight (uniform trivially; inverse because they
 * share one distance, or share all the weight at distance 0; tricube because h, the first
 * distance beyond, exceeds D), so the fit is the run's mean, the local SD its population SD and
 * the band its definition-7 quantiles: the same values the row-by-row estimator computes, up to
 * rounding (the sums run in another order; shuffles and thread counts still change nothing).
 *
 * <p>Invariants: runs are maximal ranges of equal coordinate with at least {@link #MIN_LENGTH}
 * rows whose responses are ascending (the canonical order guarantees it unless scaling merged two
 * raw values into one coordinate; such a run is left out and takes the row-by-row path).
 * The mean is stored as the run's smallest response plus the mean offset from it, so a run of equal
 * responses has exactly that response as its mean and an SD of exactly 0.
 */
final class TiedRuns {
    /** Runs shorter than this are walked row by row: the totals would not pay for themselves. */
    static final int MIN_LENGTH = 64;

    private final double[] x;
    private final double[] y;
    private final Metric base;
    private final int[] start;
    private final int[] end;
    private final double[] offsetSum;
    private final double[] m2;

    private TiedRuns(double[] x, double[] y, Metric base, int[] start, int[] end, double[] offsetSum, double[] m2) {
        this.x = x;
        this.y = y;
        this.base = base;
        this.start = start;
        this.end = end;
        this.offsetSum = offsetSum;
        this.m2 = m2;
    }

    /**
     * The long runs of a sorted index's coordinates with their responses, or null when there are
     * none.
     *
     * @param x    the ascending coordinates of a {@link SortedIndex}
     * @param y    the response at each position
     * @param base the index's metric
     */
    static TiedRuns of(double[] x, double[] y, Metric base) {
        int n = x.length;
        int runs = 0;
        for (int a = 0, b; a < n; a = b) {
            b = runEnd(x, a);
            runs += b - a >= MIN_LENGTH && ascending(y, a, b) ? 1 : 0;
        }
        if (runs == 0) {
            return null;
        }
        int[] start = new int[runs];
        int[] end = new int[runs];
        double[] offsetSum = new double[runs];
        double[] m2 = new double[runs];
        int r = 0;
        for (int a = 0, b; a < n; a = b) {
            b = runEnd(x, a);
            if (b - a >= MIN_LENGTH && ascending(y, a, b)) {
                start[r] = a;
                end[r] = b;
                double s = 0;
                for (int i = a; i < b; i++) {
                    s += y[i] - y[a];
                }
                offsetSum[r] = s;
                double mean = y[a] + s / (b - a);
                double ss = 0;
                for (int i = a; i < b; i++) {
                    double t = y[i] - mean;
                    ss += t * t;
                }
                m2[r++] = ss;
            }
        }
        return new TiedRuns(x, y, base, start, end, offsetSum, m2);
    }

    private static int runEnd(double[] x, int a) {
        int b = a + 1;
        while (b < x.length && x[b] == x[a]) {
            b++;
        }
        return b;
    }

    private static boolean ascending(double[] y, int a, int b) {
        for (int i = a + 1; i < b; i++) {
            if (y[i] < y[i - 1]) {
                return false;
            }
        }
        return true;
    }

    /** Number of long runs. */
    int count() {
        return start.length;
    }

    private double keyAt(int i, double q) {
        double t = x[i] - q;
        return base == Metric.EUCLIDEAN ? t * t : Math.abs(t);
    }

    /**
     * The long run that holds exactly the counted neighbours of q for k (position {@code exclude}
     * left out, none when negative), or -1 when the neighbours are not one long run (the caller
     * then walks them row by row).
     */
    int runFor(double q, int k, int exclude) {
        if (Double.isNaN(q)) {
            return -1;
        }
        int n = x.length;
        int p = SortedIndex.lowerBound(x, q);
        int l = p - 1 == exclude ? p - 2 : p - 1;
        int r = p == exclude ? p + 1 : p;
        double kl = l >= 0 ? keyAt(l, q) : Double.POSITIVE_INFINITY;
        double kr = r < n ? keyAt(r, q) : Double.POSITIVE_INFINITY;
        if (Math.max(kl, kr) <= base.tieHigh(Math.min(kl, kr))) {
            return -1; // rows on both sides that tie (or no rows at all)
        }
        int run = runHolding(kl < kr ? l : r);
        if (run < 0 || size(run, exclude) < k) {
            return -1;
        }
        double d = Math.min(kl, kr);
        // the next row beyond the run on its own side must lie beyond the tie bound (rounding can make
        // distinct coordinates equally far, or nearly so, from q)
        int beyond = kl < kr ? start[run] - 1 : end[run];
        if (beyond == exclude) {
            beyond += kl < kr ? -1 : 1;
        }
        if (beyond >= 0 && beyond < n && keyAt(beyond, q) <= base.tieHigh(d)) {
            return -1;
        }
        return run;
    }

    /** The long run holding position p, or -1. */
    private int runHolding(int p) {
        int lo = 0;
        int hi = start.length - 1;
        while (lo <= hi) {
            int mid = (lo + hi) >>> 1;
            if (start[mid] > p) {
                hi = mid - 1;
            } else if (end[mid] <= p) {
                lo = mid + 1;
            } else {
                return mid;
            }
        }
        return -1;
    }

    private boolean holds(int run, int p) {
        return p >= start[run] && p < end[run];
    }

    /** Rows of the run counted with position {@code exclude} left out. */
    int size(int run, int exclude) {
        return end[run] - start[run] - (holds(run, exclude) ? 1 : 0);
    }

    /** The key of the run's rows from q. */
    double key(int run, double q) {
        return keyAt(start[run], q);
    }

    /** The run's mean response, position {@code exclude} left out. */
    double mean(int run, int exclude) {
        double y0 = y[start[run]];
        double s = offsetSum[run];
        if (holds(run, exclude)) {
            s -= y[exclude] - y0;
        }
        return y0 + s / size(run, exclude);
    }

    /** The run's population SD about its mean, position {@code exclude} left out. */
    double sd(int run, int exclude) {
        int m = size(run, exclude);
        if (value(run, exclude, 0) == value(run, exclude, m - 1)) {
            return 0; // every counted response equal
        }
        double ss = m2[run];
        if (holds(run, exclude)) {
            // removing one value from a sum of squared deviations (Welford's update run backwards)
            int a = start[run];
            int full = end[run] - a;
            double mean = y[a] + offsetSum[run] / full;
            ss -= (y[exclude] - mean) * (y[exclude] - mean(run, exclude));
        }
        return Math.sqrt(Math.max(0, ss) / m);
    }

    /** Hyndman &amp; Fan definition 7 quantile of the run's responses, position {@code exclude} left out. */
    double quantile(int run, int exclude, double prob) {
        int m = size(run, exclude);
        double h = (m - 1) * prob;
        int lo = (int) Math.floor(h);
        if (lo >= m - 1) {
            return value(run, exclude, m - 1);
        }
        double lower = value(run, exclude, lo);
        return lower + (h - lo) * (value(run, exclude, lo + 1) - lower);
    }

    /** The j-th smallest counted response of the run (0-based), position {@code exclude} left out. */
    private double value(int run, int exclude, int j) {
        int p = start[run] + j;
        if (holds(run, exclude) && p >= exclude) {
            p++;
        }
        return y[p];
    }
}
