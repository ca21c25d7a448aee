package nearfit.knn;

import java.util.Arrays;

/**
 * The estimator applied to one neighbour list, with the tie rule: D is the k-th smallest key,
 * the s rows below {@link Metric#tieLow}(D) count fully and the e - s rows that tie D (keys from
 * tieLow(D) to {@link Metric#tieHigh}(D), distances within a relative 1e-12 of D's) share the
 * remaining k - s places equally. Every sum runs over the neighbours sorted by (key, response), an order that does
 * not depend on row order or threads, so results are bit-identical under shuffles. Uniform fit:
 * {@code (P[s] + (k - s) (P[e] - P[s]) / (e - s)) / k} with P the prefix sums of y; weighted fits
 * use prefix sums of w*y and w the same way. The median visits the neighbours in response order,
 * sorted once per load, so the all-k tuning pass gets the median at every k without a sort per k.
 * Per-thread scratch, reused; not thread-safe.
 */
final class LocalEstimator {
    private final Metric metric;
    private int count;
    private double[] key = new double[16];
    private double[] val = new double[16];
    private double[] weight = new double[16];
    private double[] pw = new double[17];
    private double[] pwy = new double[17];
    private double[] tmpV = new double[16];
    private double[] tmpW = new double[16];
    private double[] orderVal = new double[16];
    private double[] orderPos = new double[16]; // neighbour index as a double, to sort pairs by (value, index)
    private boolean valueOrdered;
    private double[] prefix = new double[16]; // the first k responses (key order) sorted ascending
    private Weighting preparedFor;
    private int preparedK;

    LocalEstimator(Metric metric) {
        this.metric = metric;
    }

    /** Loads a neighbour list with the values (responses, or class codes as doubles) at its positions. */
    void load(NeighborList list, double[] values) {
        int n = list.count();
        ensure(n);
        double[] keys = list.keys();
        int[] pos = list.positions();
        for (int i = 0; i < n; i++) {
            key[i] = keys[i];
            val[i] = values[pos[i]];
        }
        count = n;
        PairSort.sort(key, val, 0, n);
        preparedFor = null;
        valueOrdered = false;
    }

    private void ensure(int n) {
        if (key.length < n) {
            int len = Math.max(n, key.length * 2);
            key = new double[len];
            val = new double[len];
            weight = new double[len];
            tmpV = new double[len];
            tmpW = new double[len];
            orderVal = new double[len];
            orderPos = new double[len];
            prefix = new double[len];
            pw = new double[len + 1];
            pwy = new double[len + 1];
        }
    }

    int count() {
        return count;
    }

    /** s: the number of loaded neighbours closer than the k-th (below its tie band). */
    int closer(int k) {
        double low = metric.tieLow(key[k - 1]);
        int s = k - 1;
        while (s > 0 && key[s - 1] >= low) {
            s--;
        }
        return s;
    }

    /** e: the number of neighbours counted at k (closer ones and every one that ties the k-th). */
    int counted(int k) {
        double high = metric.tieHigh(key[k - 1]);
        int e = k;
        while (e < count && key[e] <= high) {
            e++;
        }
        return e;
    }

    /** The k-th smallest key. */
    double kthKey(int k) {
        return key[k - 1];
    }

    /** Whether the list holds a neighbour beyond the k-th distance. */
    boolean hasBeyond(int k) {
        return counted(k) < count;
    }

    /** Fills the prefix sums of w and w*y for weighting at k (k matters for tricube only). */
    void prepare(Weighting w, int k) {
        if (w == preparedFor && (w != Weighting.TRICUBE || k == preparedK)) {
            return;
        }
        int e = counted(k);
        int n = w == Weighting.TRICUBE ? e : count;
        weights(w, k, e, n);
        pw[0] = 0;
        pwy[0] = 0;
        for (int i = 0; i < n; i++) {
            pw[i + 1] = pw[i] + weight[i];
            pwy[i + 1] = pwy[i] + weight[i] * val[i];
        }
        preparedFor = w;
        preparedK = k;
    }

    private void weights(Weighting w, int k, int e, int n) {
        if (w == Weighting.INVERSE) {
            if (key[0] == 0) {
                for (int i = 0; i < n; i++) {
                    weight[i] = key[i] == 0 ? 1 : 0; // rows at distance 0 share all the weight
                }
            } else {
                for (int i = 0; i < n; i++) {
                    weight[i] = 1 / metric.distanceOfKey(key[i]);
                }
            }
        } else if (w == Weighting.TRICUBE && e < count
                && metric.distanceOfKey(key[e]) > metric.distanceOfKey(key[e - 1])) {
            double h = metric.distanceOfKey(key[e]); // first neighbour beyond the k-th distance
            for (int i = 0; i < n; i++) {
                double r = metric.distanceOfKey(key[i]) / h;
                double t = 1 - r * r * r;
                weight[i] = t * t * t;
            }
        } else {
            Arrays.fill(weight, 0, n, 1.0); // uniform, and tricube with no row beyond
        }
    }

    /** The fit at k; {@link #prepare} must have been called for this weighting (and k for tricube). */
    double fit(int k) {
        int s = closer(k);
        int e = counted(k);
        double num = pwy[s] + (k - s) * (pwy[e] - pwy[s]) / (e - s);
        double den = pw[s] + (k - s) * (pw[e] - pw[s]) / (e - s);
        return num / den;
    }

    /** The weight of neighbour i at k, shares included (0 beyond the counted rows); prepared. */
    double shareWeight(int i, int k, int s, int e) {
        if (i >= e) {
            return 0;
        }
        return i < s ? weight[i] : weight[i] * (k - s) / (e - s);
    }

    /** Weighted population SD around {@code mean} at k. */
    double sd(int k, double mean) {
        int s = closer(k);
        int e = counted(k);
        double ss = 0;
        double sw = 0;
        for (int i = 0; i < e; i++) {
            double w = shareWeight(i, k, s, e);
            double t = val[i] - mean;
            ss += w * t * t;
            sw += w;
        }
        return Math.sqrt(ss / sw);
    }

    /** Weighted quantile of the responses at k (see {@link WeightedQuantiles}). */
    double quantile(int k, double p) {
        int m = collect(k, Double.NaN);
        return WeightedQuantiles.weightedSortedQuantile(tmpV, tmpW, m, p);
    }

    /**
     * Weighted median of the responses at k: the same value as {@code quantile(k, 0.5)}, the counted
     * (value, share weight) pairs in (value, weight) order, but gathered from a response order kept
     * for the whole load, so the pairs arrive sorted but for weights within equal values.
     */
    double median(int k) {
        if (!valueOrdered) {
            for (int i = 0; i < count; i++) {
                orderVal[i] = val[i];
                orderPos[i] = i;
            }
            PairSort.sort(orderVal, orderPos, 0, count);
            valueOrdered = true;
        }
        int s = closer(k);
        int e = counted(k);
        int m = 0;
        for (int j = 0; j < count; j++) {
            int i = (int) orderPos[j];
            double w = shareWeight(i, k, s, e);
            if (w > 0) {
                tmpV[m] = orderVal[j];
                tmpW[m++] = w;
            }
        }
        PairSort.sort(tmpV, tmpW, 0, m);
        return WeightedQuantiles.weightedSortedQuantile(tmpV, tmpW, m, 0.5);
    }

    /**
     * The median at every k from 1 to kmax into {@code out[k - 1]}, each equal to {@link #median(int)}
     * after {@link #prepare} for that k. With uniform weights and no row tied with the k-th beyond it,
     * every share weight is 1 and the median is definition 7's of the first k responses: kept sorted by
     * one insertion per k, so such a k costs O(1) beyond the insertion instead of a walk of the list.
     */
    void medians(Weighting w, int kmax, double[] out) {
        for (int k = 1; k <= kmax; k++) {
            double v = val[k - 1];
            int at = k - 1;
            while (at > 0 && prefix[at - 1] > v) {
                at--;
            }
            System.arraycopy(prefix, at, prefix, at + 1, k - 1 - at);
            prefix[at] = v;
            if (w == Weighting.UNIFORM && counted(k) == k) {
                out[k - 1] = WeightedQuantiles.sortedQuantile(prefix, k, 0.5);
            } else {
                prepare(w, k);
                out[k - 1] = median(k);
            }
        }
    }

    /** Weighted MAD of the responses at k: weighted median of |y - weighted median|. */
    double mad(int k) {
        double med = quantile(k, 0.5);
        int m = collect(k, med);
        return WeightedQuantiles.weightedSortedQuantile(tmpV, tmpW, m, 0.5);
    }

    /** Copies (value or |value - center|, share weight) with positive weight, sorted; returns count. */
    private int collect(int k, double center) {
        int s = closer(k);
        int e = counted(k);
        int m = 0;
        for (int i = 0; i < e; i++) {
            double w = shareWeight(i, k, s, e);
            if (w > 0) {
                tmpV[m] = Double.isNaN(center) ? val[i] : Math.abs(val[i] - center);
                tmpW[m++] = w;
            }
        }
        PairSort.sort(tmpV, tmpW, 0, m);
        return m;
    }

    /**
     * The class vote at k into {@code shares} (length classCount, sums to 1); returns the winner:
     * the largest share, then the class whose nearest counted member is closest (beyond the tie
     * tolerance: nearest members that tie count as equally near), then the lowest code.
     */
    int vote(int k, double[] shares, double[] nearest) {
        int s = closer(k);
        int e = counted(k);
        Arrays.fill(shares, 0);
        Arrays.fill(nearest, Double.POSITIVE_INFINITY);
        double total = 0;
        for (int i = 0; i < e; i++) {
            int c = (int) val[i];
            double w = shareWeight(i, k, s, e);
            shares[c] += w;
            total += w;
            if (key[i] < nearest[c]) {
                nearest[c] = key[i];
            }
        }
        int best = -1;
        for (int c = 0; c < shares.length; c++) {
            shares[c] /= total;
            if (nearest[c] != Double.POSITIVE_INFINITY && (best < 0 || shares[c] > shares[best]
                    || (shares[c] == shares[best] && nearest[c] < metric.tieLow(nearest[best])))) {
                best = c;
            }
        }
        return best;
    }
}
