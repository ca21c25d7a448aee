package nearfit.tui.bench;

import nearfit.knn.TuningTable;
import nearfit.tui.results.TuningFigures;

/**
 * The column of a knn {@link TuningTable} that chooses k, as the tuning panel shows it: the RMSE for a number
 * response, the error rate for a category (the table leaves the other column NaN). Rows are k = 1 to kmax.
 */
public final class TuningCriterion {
    private TuningCriterion() {
    }

    static boolean isCategory(TuningTable t) {
        return t.kmax() > 0 && !Double.isNaN(t.errorRate()[0]);
    }

    /** The figures the explorer shows of a tuning table. */
    public static TuningFigures figures(TuningTable t) {
        boolean category = isCategory(t);
        return new TuningFigures(category ? t.errorRate() : t.rmse(), category ? t.errorRateSe() : t.rmseSe(),
                t.bestK(), t.oneSeK(), t.evaluatedRows(), t.referenceRows());
    }
}
