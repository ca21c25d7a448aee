package nearfit.knn;

/** What divides a leave-one-out residual to make its z-score. */
public enum FlagScale {
    /**
     * Modified z-score (Iglewicz &amp; Hoaglin 1993): {@code (e - median(e)) / (1.4826 MAD(e))}
     * over all evaluated rows.
     */
    GLOBAL_MAD,
    /** {@code e / s}, with s the weighted SD of the row's neighbours' responses. */
    LOCAL_SD,
    /** {@code e / (1.4826 m)}, with m the weighted MAD of the row's neighbours' responses. */
    LOCAL_MAD
}
