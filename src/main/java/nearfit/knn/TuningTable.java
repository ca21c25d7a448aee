package nearfit.knn;

/**
 * Cross-validation results for every k from 1 to kmax; arrays are indexed by {@code k - 1}.
 * Numeric responses fill the error columns and leave {@code errorRate} NaN; category responses
 * fill {@code errorRate} and {@code errorRateSe} and leave the rest NaN.
 *
 * <p>SE(MSE) = sd(e^2)/sqrt(n); SE(RMSE) = SE(MSE)/(2 RMSE) (delta method); SE(MAE) = sd(|e|)/sqrt(n);
 * SE(error rate) = sd(miss)/sqrt(n); sample SDs (n - 1). PRESS is the sum of squared residuals over
 * the evaluated rows and predicted R^2 = 1 - PRESS/TSS, TSS about the evaluated rows' mean.
 *
 * @param method        "leave-one-out", "sampled leave-one-out" or "k-fold"
 * @param evaluatedRows rows whose residuals enter the table (m when sampled)
 * @param referenceRows rows searched as neighbours
 * @param bestK         the k with the lowest RMSE (error rate for a category); the smallest such k
 * @param oneSeK        the largest k whose RMSE (error rate) is within one SE of the minimum
 *                      (Breiman, Friedman, Olshen &amp; Stone 1984; Hastie, Tibshirani &amp; Friedman, ESL 7.10);
 *                      with SEs over blocks, the largest k whose MSE (error rate) exceeds the best's by at most
 *                      one SE of the paired difference over the same blocks
 * @param scheme        how rows were held out
 * @param blocks        blocks holding evaluated rows (groups, spans of time, folds; the rows under leave-one-out)
 * @param seOverBlocks  whether the SEs are taken over blocks (grouped and blocked schemes): with S_b the
 *                      block's sum of a per-row quantity, n_b its evaluated rows, N their total, B the blocks
 *                      and m = sum S_b / N, SE(m) = sqrt(B/(B-1) sum_b (S_b - n_b m)^2) / N, which is the SD of
 *                      the per-block means over sqrt(B) when blocks are equal in size (the cluster-robust SE
 *                      of a mean); otherwise over rows as above
 */
public record TuningTable(String method, int evaluatedRows, int referenceRows, double[] rmse, double[] rmseSe,
                          double[] mae, double[] maeSe, double[] press, double[] predictedR2,
                          double[] errorRate, double[] errorRateSe, int bestK, int oneSeK,
                          HeldOutScheme scheme, int blocks, boolean seOverBlocks) {

    /** A leave-one-out table (each evaluated row a block, SEs over rows). */
    public TuningTable(String method, int evaluatedRows, int referenceRows, double[] rmse, double[] rmseSe,
                       double[] mae, double[] maeSe, double[] press, double[] predictedR2,
                       double[] errorRate, double[] errorRateSe, int bestK, int oneSeK) {
        this(method, evaluatedRows, referenceRows, rmse, rmseSe, mae, maeSe, press, predictedR2, errorRate,
                errorRateSe, bestK, oneSeK, new HeldOutScheme.LeaveOneOut(), evaluatedRows, false);
    }

    /** The basis of the standard errors, as output names it: {@code blocks} or {@code rows}. */
    public String seBasis() {
        return seOverBlocks ? "blocks" : "rows";
    }

    /** The largest k in the table. */
    public int kmax() {
        return rmse.length;
    }
}
