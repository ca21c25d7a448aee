package nearfit.knn;

/**
 * A block of new rows scored against a model by {@link Scoring#score}; index i is the block's i-th row.
 * The arrays are owned by this value; callers must not change them.
 *
 * @param estimates fit, band, local SD, window width and neighbour count at each row
 * @param residual  response minus fit; NaN where the response, an input or the fit is missing
 * @param z         the residual's z under the chosen {@link ZBasis} ({@link Flags#zScore}); NaN where the
 *                  residual is
 * @param flagged   whether |z| is above the threshold ({@link Flags#isFlagged}); never for a NaN z
 */
public record ScoredBlock(Estimates estimates, double[] residual, double[] z, boolean[] flagged) {
    /** Rows in the block. */
    public int size() {
        return residual.length;
    }

    /** The fit at each row (the neighbours' weighted mean or median). */
    public double[] fit() {
        return estimates.fit();
    }

    /** The band's lower edge at each row (NaN without a band). */
    public double[] bandLow() {
        return estimates.bandLow();
    }

    /** The band's upper edge at each row (NaN without a band). */
    public double[] bandHigh() {
        return estimates.bandHigh();
    }
}
