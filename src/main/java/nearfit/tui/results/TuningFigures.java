package nearfit.tui.results;

/**
 * The tuning panel's figures, taken from the core's tuning table by the tuning job: the criterion that
 * chooses k (the RMSE for a number response, the error rate for a category) and its standard error, by
 * k - 1 for k = 1 to {@link #kmax}. The arrays are never changed after construction.
 *
 * @param values        the criterion by k - 1
 * @param se            its standard error by k - 1
 * @param bestK         the k with the lowest criterion
 * @param oneSeK        the largest k within one standard error of the lowest
 * @param evaluatedRows rows whose leave-one-out error was evaluated (a sample above a size)
 * @param referenceRows reference rows
 * @param scheme        which rows were held out: where the best and one-SE k come from
 */
public record TuningFigures(double[] values, double[] se, int bestK, int oneSeK, int evaluatedRows,
        int referenceRows, HeldOutChoice scheme) {
    /** Checks that both columns cover the same k. */
    public TuningFigures {
        if (values.length != se.length) {
            throw new IllegalArgumentException("tuning columns of unequal length");
        }
    }

    /** The largest k tuned. */
    public int kmax() {
        return values.length;
    }

    /** Whether the errors were evaluated on a sample of the reference rows. */
    public boolean sampled() {
        return evaluatedRows < referenceRows;
    }

    /** The criterion at {@code k}, NaN when the table does not reach it. */
    public double at(int k) {
        return k >= 1 && k <= kmax() ? values[k - 1] : Double.NaN;
    }

    /** The panel line of {@code k} (1-based k on line k - 1), 0 when the table does not reach it. */
    public int line(int k) {
        return k >= 1 && k <= kmax() ? k - 1 : 0;
    }
}
