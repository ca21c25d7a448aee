package nearfit.knn;

/**
 * Leave-one-out flags for every reference row, in canonical order (row ids name the table rows).
 *
 * @param rowIds       the table row id of each reference row
 * @param looFit       the fit at the row with the row itself left out
 * @param residual     response minus leave-one-out fit
 * @param z            the z-score of the residual under {@code scale}
 * @param flagged      whether |z| exceeds the threshold
 * @param flaggedCount how many rows are flagged
 * @param median       median of the residuals
 * @param mad          1.4826 times the MAD of the residuals
 * @param scale        what divided the residuals
 * @param threshold    the |z| cut-off
 */
public record FlagResult(int[] rowIds, double[] looFit, double[] residual, double[] z, boolean[] flagged,
                         int flaggedCount, double median, double mad, FlagScale scale, double threshold) {

    /**
     * @return the leave-one-out RMSE, sqrt(mean(residual^2)) over the rows whose residual is finite; NaN when
     *     none is. A pass over the rows on each call, so callers keep the value.
     */
    public double looRmse() {
        double sum = 0;
        long n = 0;
        for (double e : residual) {
            if (Double.isFinite(e)) {
                sum += e * e;
                n++;
            }
        }
        return n == 0 ? Double.NaN : Math.sqrt(sum / n);
    }
}
