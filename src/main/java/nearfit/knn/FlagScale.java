package nearfit.knn;

/** What divides a leave-one-out residual to make its z-score. */
public enum FlagScale implements ChoiceWord {
    /**
     * The reference's residual scale where the row lies: {@code (e - m) / max(s, floor)}, m and s the median
     * and 1.4826·MAD of the neighbours' held-out residuals ({@link Flags#curveZ}; modified z-score of
     * Iglewicz &amp; Hoaglin 1993, taken locally). A model file without per-row residuals gives one scale
     * for the whole reference ({@link ZBasis.ReferenceResiduals}).
     */
    GLOBAL_MAD("reference"),
    /** {@code e / s}, with s the weighted SD of the row's neighbours' responses. */
    LOCAL_SD("local"),
    /**
     * {@code e / (1.4826 m)}, with m the weighted MAD of the row's neighbours' responses. Not offered
     * by the command line nor stored in a model file ({@link #offered}).
     */
    LOCAL_MAD("local-mad");

    /**
     * The scales the command line's {@code --z-scale} offers and a model file may store, in the order
     * the help lists them: {@code local}, {@code reference}.
     */
    public static FlagScale[] offered() {
        return new FlagScale[] {LOCAL_SD, GLOBAL_MAD};
    }

    private final String word;

    FlagScale(String word) {
        this.word = word;
    }

    /** Not the name's: {@code reference} and {@code local} say what the scale comes from. */
    @Override
    public String word() {
        return word;
    }
}
