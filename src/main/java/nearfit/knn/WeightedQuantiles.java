package nearfit.knn;

/**
 * Sample quantiles. Equal weights: Hyndman &amp; Fan (1996) definition 7 (numpy.percentile's
 * default). Unequal weights: the values sorted ascending with weights w_i and cumulative sums C_i
 * sit at plotting positions {@code p_i = (C_i - (w_i + w_1)/2) / (W - (w_1 + w_n)/2)} and the
 * quantile interpolates linearly between them; with equal weights p_i = (i-1)/(n-1), which is
 * definition 7, and the rule is symmetric under reversing the order. This weighted rule is the
 * project's own generalisation (no published source claimed).
 */
final class WeightedQuantiles {
    private WeightedQuantiles() {
    }

    /** Definition 7 on the first n values of an ascending array; p in [0, 1]. */
    static double sortedQuantile(double[] s, int n, double p) {
        if (n == 1) {
            return s[0];
        }
        double h = (n - 1) * p;
        int lo = (int) Math.floor(h);
        if (lo >= n - 1) {
            return s[n - 1];
        }
        double frac = h - lo;
        return s[lo] + frac * (s[lo + 1] - s[lo]);
    }

    /**
     * The median (definition 7 at p = 0.5) of the first n values, reordering them: a selection in
     * expected linear time instead of a sort (Hoare's FIND, median-of-three pivots), since flags on
     * ten million rows take two medians.
     */
    static double median(double[] a, int n) {
        if (n == 0) {
            return Double.NaN;
        }
        int lo = (n - 1) / 2;
        double low = select(a, 0, n - 1, lo);
        if (n % 2 == 1) {
            return low;
        }
        double high = a[lo + 1]; // after the selection every value right of lo is >= low
        for (int i = lo + 2; i < n; i++) {
            high = Math.min(high, a[i]);
        }
        return low + 0.5 * (high - low);
    }

    /** Rearranges a[from..to] so that a[k] holds the value a sort would put there; returns it. */
    static double select(double[] a, int from, int to, int k) {
        while (from < to) {
            int mid = (from + to) >>> 1;
            double pivot = medianOfThree(a[from], a[mid], a[to]);
            int i = from;
            int j = to;
            while (i <= j) {
                while (a[i] < pivot) {
                    i++;
                }
                while (a[j] > pivot) {
                    j--;
                }
                if (i <= j) {
                    double t = a[i];
                    a[i++] = a[j];
                    a[j--] = t;
                }
            }
            if (k <= j) {
                to = j;
            } else if (k >= i) {
                from = i;
            } else {
                return a[k];
            }
        }
        return a[k];
    }

    private static double medianOfThree(double x, double y, double z) {
        return Math.max(Math.min(x, y), Math.min(Math.max(x, y), z));
    }

    /**
     * Weighted quantile of the first n (value, weight) pairs, sorted ascending by value, all
     * weights positive.
     */
    static double weightedSortedQuantile(double[] v, double[] w, int n, double p) {
        boolean equal = true;
        for (int i = 1; i < n && equal; i++) {
            equal = w[i] == w[0];
        }
        if (equal) {
            return sortedQuantile(v, n, p);
        }
        double total = 0;
        for (int i = 0; i < n; i++) {
            total += w[i];
        }
        double denom = total - (w[0] + w[n - 1]) / 2;
        double c = 0;
        double prevP = 0;
        double prevV = v[0];
        for (int i = 0; i < n; i++) {
            c += w[i];
            double pi = i == n - 1 ? 1.0 : (c - (w[i] + w[0]) / 2) / denom;
            if (pi >= p) {
                if (i == 0 || pi == prevP) {
                    return v[i];
                }
                double t = (p - prevP) / (pi - prevP);
                return prevV + t * (v[i] - prevV);
            }
            prevP = pi;
            prevV = v[i];
        }
        return v[n - 1];
    }
}
