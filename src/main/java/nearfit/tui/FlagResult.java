package nearfit.tui;

import java.util.List;

/**
 * Leave-one-out residuals of the reference at the current settings and the rows they flag.
 *
 * @param rows         the reference rows examined; 0 when flags do not apply (a category response)
 * @param flaggedCount how many rows are flagged
 * @param looRmse      the leave-one-out RMSE over those rows, NaN when the core does not give it
 * @param threshold    the |z| above which a row is flagged
 * @param flagged      the flagged rows, largest |z| first
 */
public record FlagResult(int rows, int flaggedCount, double looRmse, double threshold, List<FlaggedRow> flagged) {
    /** Copies the list so that the record stays immutable. */
    public FlagResult {
        flagged = List.copyOf(flagged);
    }

    /** The flagged share of the examined rows, 0 when there are none. */
    public double share() {
        return rows == 0 ? 0 : (double) flaggedCount / rows;
    }
}
