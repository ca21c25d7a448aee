package nearfit.tui;

/**
 * The explorer's keys as help lists them, and the ones the key bar shows; {@link KeyPress} acts on them. The
 * key bar takes the entries that have a bar label, in this order, leaving out whole entries that no longer
 * fit when the window is narrow.
 */
public enum KeyBinding {
    HELP("?", "help: this list of keys (arrows and PgUp/PgDn scroll it)", "? help"),
    QUIT("q", "quit", "q quit"),
    CLOSE("Esc", "close a panel or prompt"),
    DISPLAY("x", "choose the display input", "x/y/i columns"),
    RESPONSE("y", "choose the response"),
    INPUTS("i", "add or remove model inputs"),
    K_UP("+", "k up the ladder 1 2 3 5 7 10 15 20 30 50 70 100 ...", "+/- k"),
    K_DOWN("-", "k down the ladder"),
    K_TYPE("k", "type an exact k"),
    TUNING("t", "tuning panel: Enter adopts the highlighted k, * the lowest-RMSE k, 1 the one-SE k", "t tuning"),
    METRIC("m", "next metric"),
    WEIGHTS("w", "next neighbour weights"),
    SCALING("s", "next input scaling"),
    BAND("b", "next band"),
    ESTIMATE("c", "curve: the neighbours' mean or median (--estimate)"),
    FLAG_MARKS("f", "flag marks on or off", "f marks"),
    FLAG_TABLE("F", "flagged-rows table, largest |z| first (Enter marks the row on the plot)", "F flagged"),
    LOAD_REPORT("L", "load report: rows read, ragged lines, blank and bad cells per column with their lines",
            "L load"),
    RESIDUALS("r", "residuals instead of the response"),
    OVER_TIME("T", "residuals over time"),
    GROUP("g", "choose the group column", "g group"),
    NEXT_GROUP("n", "highlight the next group"),
    PREVIOUS_GROUP("p", "highlight the previous group"),
    ALL_GROUPS("a", "all groups"),
    COMPARE("o", "compare the group with a curve fitted on the other groups"),
    MOVE("arrows", "move the crosshair (up and down in bigger steps)", "arrows crosshair"),
    ZOOM_IN("]", "zoom in around the crosshair"),
    ZOOM_OUT("[", "zoom out"),
    WHOLE("0", "the whole data"),
    HELD("v", "choose which extra input is held fixed"),
    HELD_STEP("< >", "held value down or up a 5 % quantile step"),
    NEAR_HELD("h", "only rows near the held values"),
    CONDITION("/", "row condition: column op value [and ...], ops = != < <= > >=, times as ISO dates",
            "/ condition"),
    REFERENCE("R", "the row condition narrows the reference too, or only what is shown (the default)"),
    EXPORT("e", "export the curve, the flagged rows, the plot as PNG or as text", "e export");

    private final String key;
    private final String meaning;
    private final String bar;

    KeyBinding(String key, String meaning) {
        this(key, meaning, "");
    }

    KeyBinding(String key, String meaning, String bar) {
        this.key = key;
        this.meaning = meaning;
        this.bar = bar;
    }

    /** The entry on the key bar, empty when the key is only in help. */
    public String bar() {
        return bar;
    }

    /** The key bar for a window {@code width} columns wide: whole entries in order, skipping those that no longer fit. */
    public static String keyBar(int width) {
        StringBuilder sb = new StringBuilder();
        for (KeyBinding k : values()) {
            if (k.bar.isEmpty()) {
                continue;
            }
            String part = (sb.length() == 0 ? "" : "  ") + k.bar;
            if (sb.length() + part.length() > width) {
                continue;
            }
            sb.append(part);
        }
        return sb.toString();
    }

    /** The key as the user types it. */
    public String key() {
        return key;
    }

    /** What it does, one line. */
    public String meaning() {
        return meaning;
    }
}
