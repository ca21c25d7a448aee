package nearfit.knn;

import java.util.Arrays;

/**
 * Where a model's reference reaches, so that scoring can say when a new row lies beyond it: a k-NN
 * curve is flat outside the reference's inputs (every far query gets the same edge neighbours), so a
 * fit there is an extrapolation, not a comparison with like rows.
 *
 * <p>Two rules, both on the reference rows the model holds:
 * <ul>
 *   <li><b>outside the range</b> of input j: the value is below the smallest or above the largest
 *       reference value of input j (input units; times in epoch ms);</li>
 *   <li><b>far from every reference row</b>: the row's window width (the distance to its k-th neighbour,
 *       as the model's estimates report it) is more than {@link #FAR_FACTOR} times the
 *       {@link #WIDTH_QUANTILE} quantile of the reference rows' own leave-one-out window widths. Inside
 *       the input ranges of several inputs a row can still sit in a corner the reference never visited;
 *       this catches it. The factor keeps the rule for gross gaps: a new row as well placed as the
 *       reference's most isolated one percent is not far. Our own rule (common practice for
 *       applicability domains: a distance to the training data compared with the training data's own).</li>
 * </ul>
 * The reference widths are computed when asked, from the model in effect (its metric, scaling and k), on
 * at most {@link #SAMPLE_ROWS} reference rows taken at an even stride in canonical order (sorted by the
 * inputs, so the stride covers the input space); the rest of a big reference adds little to a 99th
 * percentile. When that quantile is 0 (k exact duplicates beside nearly every reference row) the largest
 * sampled width stands in for it. With k at least the number of reference rows minus one, no width leaves a row out and the
 * far rule is off ({@link #farRuleOn()} false).
 */
public final class ReferenceReach {
    /** The quantile of the reference's own leave-one-out window widths the far rule starts from. */
    public static final double WIDTH_QUANTILE = 0.99;
    /** How many times that quantile a window width must exceed to call a row far. */
    public static final double FAR_FACTOR = 3.0;
    /** The most reference rows whose window widths are computed. */
    public static final int SAMPLE_ROWS = 20_000;

    private final double[] min;
    private final double[] max;
    private final double referenceWidth;
    private final int sampledRows;

    private ReferenceReach(double[] min, double[] max, double referenceWidth, int sampledRows) {
        this.min = min;
        this.max = max;
        this.referenceWidth = referenceWidth;
        this.sampledRows = sampledRows;
    }

    /** The reach of {@code model}'s reference rows, with its settings; a numeric or category response. */
    public static ReferenceReach of(KnnModel model) {
        ReferenceData data = model.data();
        int d = data.dimensions();
        int n = data.size();
        double[] min = new double[d];
        double[] max = new double[d];
        for (int j = 0; j < d; j++) {
            double[] x = data.input(j);
            double lo = Double.POSITIVE_INFINITY;
            double hi = Double.NEGATIVE_INFINITY;
            for (int i = 0; i < n; i++) {
                lo = Math.min(lo, x[i]);
                hi = Math.max(hi, x[i]);
            }
            min[j] = lo;
            max[j] = hi;
        }
        int k = model.settings().k();
        if (k > n - 1) {
            return new ReferenceReach(min, max, Double.NaN, 0);
        }
        int m = Math.min(n, SAMPLE_ROWS);
        double[] widths = new double[m];
        Workers.run(m, model.settings().threads(), model::searcher, (sr, c, from, to) -> {
            double[] q = new double[d];
            for (int s = from; s < to; s++) {
                int i = (int) ((long) s * n / m);
                System.arraycopy(model.coords(), i * d, q, 0, d);
                widths[s] = widthLeavingOut(model, sr, q, k, i);
            }
        }, Progress.NONE);
        Arrays.sort(widths);
        double q = WeightedQuantiles.sortedQuantile(widths, m, WIDTH_QUANTILE);
        // Heavily tied data (readings rounded to a few steps) can put k equal rows beside almost every row; a
        // quantile of 0 would call every row between two steps far, so the largest width stands in for it.
        return new ReferenceReach(min, max, q > 0 ? q : widths[m - 1], m);
    }

    /** The window width at scaled point q with reference position i left out. */
    private static double widthLeavingOut(KnnModel model, Searcher sr, double[] q, int k, int i) {
        TiedRuns runs = model.tiedRuns();
        int run = runs == null ? -1 : runs.runFor(q[0], k, i);
        if (run >= 0) {
            return model.windowWidthOfKey(runs.key(run, q[0]));
        }
        sr.find(q, k, i, false);
        return model.windowWidthOfKey(sr.list().key(k - 1));
    }

    /** Inputs covered. */
    public int inputs() {
        return min.length;
    }

    /** The smallest reference value of input j (input units). */
    public double min(int j) {
        return min[j];
    }

    /** The largest reference value of input j (input units). */
    public double max(int j) {
        return max[j];
    }

    /** Whether value v of input j is below the reference's range; false for a missing value (NaN). */
    public boolean below(int j, double v) {
        return v < min[j];
    }

    /** Whether value v of input j is above the reference's range; false for a missing value (NaN). */
    public boolean above(int j, double v) {
        return v > max[j];
    }

    /** Whether the far rule applies (the reference widths could be computed). */
    public boolean farRuleOn() {
        return !Double.isNaN(referenceWidth);
    }

    /** The {@link #WIDTH_QUANTILE} quantile of the reference's leave-one-out window widths; NaN when off. */
    public double referenceWidth() {
        return referenceWidth;
    }

    /** The window width above which a row is far; NaN when the rule is off. */
    public double farWidth() {
        return FAR_FACTOR * referenceWidth;
    }

    /** Reference rows whose widths were computed; 0 when the rule is off. */
    public int sampledRows() {
        return sampledRows;
    }

    /** {@link #rulesMet} bit: some input of the row lies below or above the reference's range of it. */
    public static final int OUTSIDE_RANGE = 1;
    /** {@link #rulesMet} bit: the row is far from every reference row ({@link #far}). */
    public static final int FAR = 2;

    /**
     * The one per-row rule every face applies (check's counts and worst rows, the written rows' {@code beyond}
     * column, the fleet jobs): which of the two rules row i of a block meets, as {@link #OUTSIDE_RANGE} and
     * {@link #FAR} bits, 0 for a row within the reference. When {@code below} and {@code above} are not null,
     * each input outside its range adds one to {@code below[j]} or {@code above[j]}; a missing input (NaN)
     * meets neither range rule.
     *
     * @param x           one array per model input (input units), as the block holds them
     * @param i           the row's position in the block
     * @param windowWidth the row's window width, as the model's estimates report it
     */
    public int rulesMet(double[][] x, int i, double windowWidth, long[] below, long[] above) {
        int met = 0;
        for (int j = 0; j < x.length; j++) {
            double v = x[j][i];
            if (v < min[j]) {
                met = OUTSIDE_RANGE;
                if (below != null) {
                    below[j]++;
                }
            } else if (v > max[j]) {
                met = OUTSIDE_RANGE;
                if (above != null) {
                    above[j]++;
                }
            }
        }
        return far(windowWidth) ? met | FAR : met;
    }

    /** Whether a row with this window width is far from every reference row; false when the rule is off. */
    public boolean far(double windowWidth) {
        return windowWidth > FAR_FACTOR * referenceWidth;
    }
}
