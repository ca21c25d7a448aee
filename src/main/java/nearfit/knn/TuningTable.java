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
 *                      (Breiman, Friedman, Olshen &amp; Stone 1984; Hastie, Tibshirani &amp; Friedman, ESL 7.10)
 */
public record TuningTable(String method, int evaluatedRows, int referenceRows, double[] rmse, double[] rmseSe,
                          double[] mae, double[] maeSe, double[] press, double[] predictedR2,
                          double[] errorRate, double[] errorRateSe, int bestK, int oneSeK) {

    /** The largest k in the table. */
    public int kmax() {
        return rmse.length;
    }
}
