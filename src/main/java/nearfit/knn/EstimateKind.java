package nearfit.knn;

/**
 * Which statistic of the neighbours' responses the fit is. Both use the tie rule's shares times
 * the {@link Weighting}'s weights. A category response ignores it: a class is chosen by weighted
 * vote either way. The local SD (and so the {@link Band#SD2} half-width and the local z scale) is
 * the neighbours' spread about their weighted mean under either choice; the SD2 band is centred on
 * the fit.
 */
public enum EstimateKind implements ChoiceWord {
    /** The weighted mean of the neighbours' responses. */
    MEAN,
    /**
     * The weighted median: the weighted quantile at p = 0.5 by the band's rule ({@link Band}: plotting
     * positions {@code p_i = (C_i - (w_i + w_1)/2) / (W - (w_1 + w_n)/2)}), so with equal weights the
     * Hyndman &amp; Fan definition 7 median, the middle value or the mean of the middle two. Rows that
     * drag the mean off the bulk of their neighbours (curtailment, icing) move it far less.
     */
    MEDIAN
}
