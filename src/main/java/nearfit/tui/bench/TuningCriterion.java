package nearfit.tui.bench;

import nearfit.knn.HeldOutScheme;
import nearfit.knn.TuningTable;
import nearfit.tui.results.HeldOutChoice;
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
                t.bestK(), t.oneSeK(), t.evaluatedRows(), t.referenceRows(), choiceOf(t.scheme()));
    }

    /** The explorer's choice a core scheme came from: the table says what ran, whatever was asked for. */
    static HeldOutChoice choiceOf(HeldOutScheme scheme) {
        if (scheme instanceof HeldOutScheme.ByBlock) {
            return HeldOutChoice.DAYS;
        }
        return scheme instanceof HeldOutScheme.ByGroup ? HeldOutChoice.GROUP : HeldOutChoice.LEAVE_ONE_OUT;
    }

    /** The core scheme of a choice: days are UTC calendar days. */
    static HeldOutScheme schemeOf(HeldOutChoice choice) {
        return switch (choice) {
            case LEAVE_ONE_OUT -> new HeldOutScheme.LeaveOneOut();
            case DAYS -> new HeldOutScheme.ByBlock(java.time.Duration.ofDays(1));
            case GROUP -> new HeldOutScheme.ByGroup();
        };
    }
}
