package nearfit.tui.keys;

/** What the plot's axes show. */
public enum PlotMode {
    /** The response against the display input, with the curve. */
    RESPONSE,
    /** Leave-one-out residuals against the display input ({@code r}). */
    RESIDUALS,
    /** Leave-one-out residuals against the time column ({@code T}). */
    RESIDUALS_OVER_TIME
}
