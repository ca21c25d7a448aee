package nearfit.knn;

/** What divides a leave-one-out residual to make its z-score. */
public enum FlagScale implements ChoiceWord {
    /**
     * Modified z-score (Iglewicz &amp; Hoaglin 1993): {@code (e - median(e)) / (1.4826 MAD(e))}
     * over all evaluated rows.
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
