package nearfit.tui;

/** The explorer's keys as help lists them; {@link KeyPress} acts on them. */
public enum KeyBinding {
    HELP("?", "help: this list of keys"),
    QUIT("q", "quit"),
    CLOSE("Esc", "close a panel or prompt"),
    DISPLAY("x", "choose the display input"),
    RESPONSE("y", "choose the response"),
    INPUTS("i", "add or remove model inputs"),
    K_UP("+", "k up the ladder 1 2 3 5 7 10 15 20 30 50 70 100 ..."),
    K_DOWN("-", "k down the ladder"),
    K_TYPE("k", "type an exact k"),
    TUNING("t", "tuning panel: Enter adopts the highlighted k, * the lowest-RMSE k, 1 the one-SE k"),
    METRIC("m", "next metric"),
    WEIGHTS("w", "next neighbour weights"),
    SCALING("s", "next input scaling"),
    BAND("b", "next band"),
    ESTIMATE("c", "curve: the neighbours' mean or median"),
    FLAG_MARKS("f", "flag marks on or off"),
    FLAG_TABLE("F", "flagged-rows table (Enter jumps to the row)"),
    LOAD_REPORT("L", "load report: rows read, ragged lines, blank and bad cells per column with their lines"),
    RESIDUALS("r", "residuals instead of the response"),
    OVER_TIME("T", "residuals over time"),
    GROUP("g", "choose the group column"),
    NEXT_GROUP("n", "highlight the next group"),
    PREVIOUS_GROUP("p", "highlight the previous group"),
    ALL_GROUPS("a", "all groups"),
    COMPARE("o", "compare the group with a curve fitted on the other groups"),
    MOVE("arrows", "move the crosshair (up and down in bigger steps)"),
    ZOOM_IN("]", "zoom in around the crosshair"),
    ZOOM_OUT("[", "zoom out"),
    WHOLE("0", "the whole data"),
    HELD("v", "choose which extra input is held fixed"),
    HELD_STEP("< >", "held value down or up a 5 % quantile step"),
    NEAR_HELD("h", "only rows near the held values"),
    CONDITION("/", "row condition: column op value [and ...], ops = != < <= > >=, times as ISO dates"),
    EXPORT("e", "export the curve, the flagged rows, the plot as PNG or as text");

    private final String key;
    private final String meaning;

    KeyBinding(String key, String meaning) {
        this.key = key;
        this.meaning = meaning;
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
