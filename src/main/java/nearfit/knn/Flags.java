package nearfit.knn;

import nearfit.table.NearfitException;

/**
 * Leave-one-out flags: every reference row's fit with itself left out, its residual e and a
 * z-score. {@link FlagScale#GLOBAL_MAD} is the modified z-score of Iglewicz &amp; Hoaglin (1993),
 * {@code (e - median(e)) / (1.4826 MAD(e))} (their 0.6745 is 1/1.4826); the local scales divide e
 * by the neighbours' weighted SD or 1.4826 times their weighted MAD. A zero scale gives z = 0 for a
 * zero residual and an infinite z otherwise (flagged), never NaN.
 *
 * <p>{@link #zScore} and {@link #isFlagged} are the one rule for z and flags: leave-one-out here and
 * new rows in {@link Scoring} both call them.
 */
public final class Flags {
    private Flags() {
    }

    /** Flags with the model's k, weighting, threshold and flag scale, in parallel. */
    public static FlagResult leaveOneOut(KnnModel model, Progress progress) {
        ReferenceData data = model.data();
        if (data.isCategory()) {
            throw new NearfitException("flags need a numeric response; " + data.responseName() + " is a category");
        }
        int n = data.size();
        KnnSettings s = model.settings();
        int k = s.k();
        if (k > n - 1) {
            throw new NearfitException("k = " + k + " leaves too few rows for leave-one-out: choose k <= " + (n - 1));
        }
        int d = data.dimensions();
        double[] y = data.response();
        double[] fit = new double[n];
        double[] res = new double[n];
        FlagScale scale = s.flagScale();
        double[] local = scale == FlagScale.GLOBAL_MAD ? null : new double[n];
        int[] order = Tuning.spatialOrder(model.coords(), d, Tuning.allRows(n));
        Workers.run(n, s.threads(), model::searcher, (sr, c, from, to) -> {
            double[] q = new double[d];
            for (int r = from; r < to; r++) {
                int i = order[r];
                System.arraycopy(model.coords(), i * d, q, 0, d);
                fit[i] = sr.fitLeavingOut(q, k, i, scale);
                res[i] = y[i] - fit[i];
                if (local != null) {
                    local[i] = sr.localScale();
                }
            }
        }, progress);
        double[] z = res.clone(); // scratch for the two medians, then the z-scores
        double median = WeightedQuantiles.median(z, n);
        for (int i = 0; i < n; i++) {
            z[i] = Math.abs(res[i] - median);
        }
        double mad = InputTransform.MAD_TO_SD * WeightedQuantiles.median(z, n);
        boolean[] flagged = new boolean[n];
        int count = 0;
        for (int i = 0; i < n; i++) {
            z[i] = scale == FlagScale.GLOBAL_MAD ? zScore(res[i] - median, mad) : zScore(res[i], local[i]);
            flagged[i] = isFlagged(z[i], s.flagThreshold());
            count += flagged[i] ? 1 : 0;
        }
        return new FlagResult(data.rowIds(), fit, res, z, flagged, count, median, mad, scale, s.flagThreshold());
    }

    /**
     * z of a (centred) residual {@code e} on {@code scale}: {@code e / scale} for a positive scale; for a
     * zero (or missing) scale, 0 when e is 0 and an infinity of e's sign otherwise, never NaN. A missing
     * residual (NaN: no response or no fit) gives NaN, which {@link #isFlagged} never flags.
     */
    public static double zScore(double e, double scale) {
        if (Double.isNaN(e)) {
            return Double.NaN;
        }
        if (scale > 0) {
            return e / scale;
        }
        return e == 0 ? 0 : Math.copySign(Double.POSITIVE_INFINITY, e);
    }

    /** Whether a row with this z is flagged: |z| above the threshold (NaN never is). */
    public static boolean isFlagged(double z, double threshold) {
        return Math.abs(z) > threshold;
    }
}
