package nearfit.tui.results;

/**
 * The highlighted group's reference rows with their residuals against the curve fitted on the other groups,
 * as the core's scoring call gives them; the curve job computes them when a group is compared, so the plot of
 * residuals only places them. The arrays are parallel and never changed after construction.
 *
 * @param rows      row ids in the table
 * @param residuals response minus the others' fit, by row
 */
public record ComparedResiduals(int[] rows, double[] residuals) {
    /** Checks that the arrays are parallel. */
    public ComparedResiduals {
        if (rows.length != residuals.length) {
            throw new IllegalArgumentException("compared rows and residuals of unequal length");
        }
    }
}
