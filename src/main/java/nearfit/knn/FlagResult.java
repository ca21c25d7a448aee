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
}
