package nearfit.plot;

/** How an axis maps data to position and labels its ticks. */
public enum AxisKind {
    /** Linear, nice-number ticks ({@link NiceTicks}). */
    LINEAR,
    /** Base-10 logarithmic, ticks 1 2 5 10 20 50 ... ({@link LogTicks}); values must be positive. */
    LOG,
    /** Linear in epoch milliseconds, UTC calendar ticks in ISO 8601 ({@link TimeTicks}). */
    TIME
}
