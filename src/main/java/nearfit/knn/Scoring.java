package nearfit.knn;

import nearfit.table.NearfitException;

/**
 * The one scoring call for new rows: a fitted model and a block of rows in, per row the fit, band, residual,
 * z and flag out. {@code predict}, {@code check} and the explorer all score through it, so no face computes
 * z, a spread or a quantile; it takes and returns only primitive arrays and knn values, so any job that holds
 * a block of rows (a partition of a larger data set, say) can call it as it is.
 *
 * <p>z follows the rule of {@link Flags}, shared with leave-one-out: {@link Flags#zScore} divides the
 * (centred) residual by the scale the {@link ZBasis} gives, a zero scale giving z = 0 for a zero residual and
 * an infinity of the residual's sign otherwise (never NaN), and a missing response or input giving NaN;
 * {@link Flags#isFlagged} flags |z| above the threshold. Each row's result depends only on that row, so the
 * block size never changes a result.
 *
 * <pre>{@code
 * KnnModel model = KnnModel.fit(reference, settings);
 * double[][] inputs = {windMs, airDensity};        // one array per model input, NaN when missing
 * ScoredBlock s = Scoring.score(model, inputs, powerKw, new ZBasis.LocalSpread(), 3.5, Progress.NONE);
 * for (int i = 0; i < s.size(); i++) {
 *     if (s.flagged()[i]) {
 *         System.out.println(i + ": fit " + s.fit()[i] + ", resid " + s.residual()[i] + ", z " + s.z()[i]);
 *     }
 * }
 * // on the reference's held-out residuals where each row lies (Tuning.heldOutResiduals, median, 1.4826 MAD):
 * // new ZBasis.NeighbourResiduals(heldOut, median, scale)
 * }</pre>
 */
public final class Scoring {
    private Scoring() {
    }

    /**
     * Scores a block of new rows on the model's threads.
     *
     * @param model     a fitted model of a number response
     * @param inputs    one array per model input, in the model's input order, all of one length; NaN missing
     * @param response  the response at each row (NaN missing), or {@code null} when the rows have none: then
     *                  every residual and z is NaN and no row is flagged
     * @param basis     what divides the residual
     * @param threshold the |z| above which a row is flagged, greater than 0
     * @param progress  progress and cancellation, per chunk of 1024 rows
     * @return one result per row, in the block's order
     * @throws NearfitException for a category response or arrays of different lengths
     */
    public static ScoredBlock score(KnnModel model, double[][] inputs, double[] response, ZBasis basis,
                                    double threshold, Progress progress) {
        if (model.data().isCategory()) {
            throw new NearfitException("scoring needs a numeric response; " + model.data().responseName()
                    + " is a category (vote instead)");
        }
        int n = inputs.length == 0 ? 0 : inputs[0].length;
        if (response != null && response.length != n) {
            throw new NearfitException("scoring: " + response.length + " responses for " + n + " rows");
        }
        if (!(threshold > 0)) {
            throw new NearfitException("scoring: the threshold must be greater than 0, not " + threshold);
        }
        double[] centre = null;
        double[] spread = null;
        Estimates est;
        if (basis instanceof ZBasis.NeighbourResiduals r && response != null) {
            centre = new double[n];
            spread = new double[n];
            est = model.estimateAll(inputs, r.residuals(), centre, spread, progress);
        } else {
            est = model.estimateAll(inputs, progress);
        }
        double[] fit = est.fit();
        double[] residual = new double[n];
        double[] z = new double[n];
        boolean[] flagged = new boolean[n];
        if (response == null) {
            java.util.Arrays.fill(residual, Double.NaN);
            java.util.Arrays.fill(z, Double.NaN);
            return new ScoredBlock(est, residual, z, flagged);
        }
        if (basis instanceof ZBasis.NeighbourResiduals r) {
            double floor = r.floor();
            for (int i = 0; i < n; i++) {
                residual[i] = response[i] - fit[i];
                z[i] = Flags.curveZ(residual[i], centre[i], spread[i], floor);
                flagged[i] = Flags.isFlagged(z[i], threshold);
            }
        } else if (basis instanceof ZBasis.ReferenceResiduals r) {
            double median = r.median();
            double scale = r.scale();
            for (int i = 0; i < n; i++) {
                residual[i] = response[i] - fit[i];
                z[i] = Flags.zScore(residual[i] - median, scale);
                flagged[i] = Flags.isFlagged(z[i], threshold);
            }
        } else {
            double[] sd = est.localSd();
            for (int i = 0; i < n; i++) {
                residual[i] = response[i] - fit[i];
                z[i] = Flags.zScore(residual[i], sd[i]);
                flagged[i] = Flags.isFlagged(z[i], threshold);
            }
        }
        return new ScoredBlock(est, residual, z, flagged);
    }
}
