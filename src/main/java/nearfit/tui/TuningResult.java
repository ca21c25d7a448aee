package nearfit.tui;

/**
 * Leave-one-out tuning over a ladder of k. Arrays have one entry per candidate, k ascending; never changed
 * after construction.
 *
 * @param k     the candidate k
 * @param rmse  the leave-one-out root mean squared error at each k (error rate for a category response)
 * @param se    its standard error
 * @param bestK the k of lowest RMSE
 * @param oneSeK the largest k whose RMSE is within one standard error of the lowest (the one-SE rule)
 */
public record TuningResult(int[] k, double[] rmse, double[] se, int bestK, int oneSeK) {
    /** Checks the arrays line up. */
    public TuningResult {
        if (rmse.length != k.length || se.length != k.length) {
            throw new IllegalArgumentException("tuning arrays of unequal length");
        }
    }

    /** The index of candidate {@code kValue}, or -1. */
    public int indexOf(int kValue) {
        for (int i = 0; i < k.length; i++) {
            if (k[i] == kValue) {
                return i;
            }
        }
        return -1;
    }
}
