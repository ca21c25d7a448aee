package nearfit.tui.results;

/**
 * Which rows the tuning panel holds out to choose k: each row alone, a UTC day of rows at a time (when the file
 * has a time column), or a group at a time (when a group column is chosen). The bench turns a choice into the
 * core's held-out scheme; the words say where the best and one-SE k come from.
 */
public enum HeldOutChoice {
    LEAVE_ONE_OUT("k by leave-one-out", "leave-one-out"),
    DAYS("k by days held out", "days held out"),
    GROUP("k by group", "by group");

    private final String words;
    private final String shortWords;

    HeldOutChoice(String words, String shortWords) {
        this.words = words;
        this.shortWords = shortWords;
    }

    /** The words shortened for a narrow header, beside the best and one-SE k. */
    public String shortWords() {
        return shortWords;
    }

    /** Where the best and one-SE k come from, for the header and the tuning panel. */
    public String words() {
        return words;
    }

    /**
     * The next choice after this one that applies: days only with a time column, group only with a group
     * column chosen. Leave-one-out always applies, so the cycle always ends somewhere.
     */
    public HeldOutChoice next(boolean hasTime, boolean hasGroup) {
        HeldOutChoice[] all = values();
        for (int step = 1; step <= all.length; step++) {
            HeldOutChoice c = all[(ordinal() + step) % all.length];
            if (c.appliesWith(hasTime, hasGroup)) {
                return c;
            }
        }
        return LEAVE_ONE_OUT;
    }

    /** Whether this choice can run on a file with or without a time column and a chosen group column. */
    public boolean appliesWith(boolean hasTime, boolean hasGroup) {
        return switch (this) {
            case LEAVE_ONE_OUT -> true;
            case DAYS -> hasTime;
            case GROUP -> hasGroup;
        };
    }
}
