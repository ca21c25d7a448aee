package nearfit.knn;

import nearfit.table.NearfitException;

/**
 * Leave-one-out flags: every reference row's fit with itself left out, its residual e and a
 * z-score. {@link FlagScale#GLOBAL_MAD} (the reference scale) is a modified z-score (Iglewicz &amp; Hoaglin
 * 1993: median and 1.4826·MAD, their 0.6745 is 1/1.4826) taken where the row lies: e centred on the median
 * of its neighbours' held-out residuals and divided by their 1.4826·MAD, at least a floor ({@link #curveZ});
 * the local scales divide e by the neighbours' weighted SD or 1.4826 times their weighted MAD. A zero scale
 * gives z = 0 for a zero residual and an infinite z otherwise (flagged), never NaN.
 *
 * <p>{@link #zScore}, {@link #curveZ} and {@link #isFlagged} are the one rule for z and flags: leave-one-out
 * here and new rows in {@link Scoring} both call them.
 */
public final class Flags {
    private Flags() {
    }

    /**
     * Flags with the model's k, weighting, threshold and flag scale, in parallel. Under the reference scale
     * ({@link FlagScale#GLOBAL_MAD}) the neighbours' residuals are the reference's own leave-one-out residuals
     * (one more pass); {@link #leaveOneOut(KnnModel, double[], Progress)} takes a held-out scheme's instead.
     */
    public static FlagResult leaveOneOut(KnnModel model, Progress progress) {
        return leaveOneOut(model, null, progress);
    }

    /**
     * Flags with the model's k, weighting, threshold and flag scale, in parallel. Under the reference scale
     * ({@link FlagScale#GLOBAL_MAD}) a row's z is {@link #curveZ}: its leave-one-out residual, centred and scaled
     * by the median and 1.4826·MAD of {@code heldOut} over its neighbours (the rows and weights its fit used,
     * itself left out), the divisor at least {@link #spreadFloor} of the reference-wide 1.4826·MAD of
     * {@code heldOut}: the rule {@link Scoring} applies to new rows with {@link ZBasis.NeighbourResiduals}.
     *
     * @param heldOut each reference row's held-out residual (canonical order), as a model file stores them
     *                ({@code Tuning.heldOutResiduals}); null: the leave-one-out residuals, computed first
     */
    public static FlagResult leaveOneOut(KnnModel model, double[] heldOut, Progress progress) {
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
        FlagScale scale = s.flagScale();
        boolean curve = scale == FlagScale.GLOBAL_MAD;
        double[] neighbourValues = null;
        if (curve) {
            neighbourValues = heldOut != null ? heldOut : Tuning.heldOutResiduals(model,
                    HeldOutBlocks.of(new HeldOutScheme.LeaveOneOut(), n, null, null), progress);
            if (neighbourValues.length != n) {
                throw new IllegalArgumentException(neighbourValues.length + " held-out residuals for " + n + " rows");
            }
        }
        int d = data.dimensions();
        double[] y = data.response();
        double[] fit = new double[n];
        double[] res = new double[n];
        double[] local = curve ? null : new double[n];
        double[] centre = curve ? new double[n] : null;
        double[] spread = curve ? new double[n] : null;
        double[] values = neighbourValues;
        int[] order = Tuning.spatialOrder(model.coords(), d, Tuning.allRows(n));
        Workers.run(n, s.threads(), model::searcher, (sr, c, from, to) -> {
            double[] q = new double[d];
            for (int r = from; r < to; r++) {
                int i = order[r];
                System.arraycopy(model.coords(), i * d, q, 0, d);
                fit[i] = sr.fitLeavingOut(q, k, i, scale);
                res[i] = y[i] - fit[i];
                if (curve) {
                    sr.neighbourSpread(q, k, i, values, centre, spread, i);
                } else {
                    local[i] = sr.localScale();
                }
            }
        }, progress);
        double median = medianOf(res, n);
        double mad = madOf(res, median, n);
        double floor = curve ? spreadFloor(madOf(values, medianOf(values, n), n)) : 0;
        double[] z = new double[n];
        boolean[] flagged = new boolean[n];
        int count = 0;
        for (int i = 0; i < n; i++) {
            z[i] = curve ? curveZ(res[i], centre[i], spread[i], floor) : zScore(res[i], local[i]);
            flagged[i] = isFlagged(z[i], s.flagThreshold());
            count += flagged[i] ? 1 : 0;
        }
        return new FlagResult(data.rowIds(), fit, res, z, flagged, count, median, mad, scale, s.flagThreshold());
    }

    /** The median of the first n values (definition 7), on a copy. */
    static double medianOf(double[] v, int n) {
        return WeightedQuantiles.median(java.util.Arrays.copyOf(v, n), n);
    }

    /** 1.4826 times the median absolute deviation of the first n values from {@code median}. */
    static double madOf(double[] v, double median, int n) {
        double[] dev = new double[n];
        for (int i = 0; i < n; i++) {
            dev[i] = Math.abs(v[i] - median);
        }
        return InputTransform.MAD_TO_SD * WeightedQuantiles.median(dev, n);
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

    /**
     * The share of the reference-wide residual scale below which a neighbourhood's residual spread is not
     * taken ({@link #spreadFloor}): where the k neighbours' held-out residuals are (nearly) identical, at zero or
     * rated power, their MAD is (nearly) 0 and would make any small residual extreme. Our own choice, checked on
     * the demo log (README, the z scales on the demo); no published source.
     */
    public static final double SPREAD_FLOOR_SHARE = 0.25;

    /** The smallest divisor of {@link #curveZ}: {@link #SPREAD_FLOOR_SHARE} times the reference-wide scale. */
    public static double spreadFloor(double referenceScale) {
        return SPREAD_FLOOR_SHARE * referenceScale;
    }

    /**
     * The one rule of the reference z scale that follows the curve, for new rows ({@link Scoring},
     * {@link ZBasis.NeighbourResiduals}) and leave-one-out flags alike: {@code (e - centre) / max(spread, floor)},
     * with centre and spread the median and 1.4826·MAD of the neighbours' held-out residuals, through
     * {@link #zScore} (a zero divisor gives 0 or an infinity, never NaN; NaN stays NaN).
     */
    public static double curveZ(double e, double centre, double spread, double floor) {
        return zScore(e - centre, Math.max(spread, floor));
    }

    /** Whether a row with this z is flagged: |z| above the threshold (NaN never is). */
    public static boolean isFlagged(double z, double threshold) {
        return Math.abs(z) > threshold;
    }
}
