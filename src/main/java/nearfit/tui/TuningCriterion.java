package nearfit.tui;

import nearfit.knn.TuningTable;

/**
 * The column of a knn {@link TuningTable} that chooses k, as the tuning panel shows it: the RMSE for a number
 * response, the error rate for a category (the table leaves the other column NaN). Rows are k = 1 to kmax.
 */
final class TuningCriterion {
    private TuningCriterion() {
    }

    static boolean isCategory(TuningTable t) {
        return t.kmax() > 0 && !Double.isNaN(t.errorRate()[0]);
    }

    /** The criterion by k - 1. */
    static double[] values(TuningTable t) {
        return isCategory(t) ? t.errorRate() : t.rmse();
    }

    /** Its standard error by k - 1. */
    static double[] se(TuningTable t) {
        return isCategory(t) ? t.errorRateSe() : t.rmseSe();
    }

    /** The criterion at {@code k}, NaN when the table does not reach it. */
    static double at(TuningTable t, int k) {
        return k >= 1 && k <= t.kmax() ? values(t)[k - 1] : Double.NaN;
    }

    /** The panel line of {@code k} (1-based k on line k - 1), 0 when the table does not reach it. */
    static int line(TuningTable t, int k) {
        return k >= 1 && k <= t.kmax() ? k - 1 : 0;
    }
}
