package nearfit.tui.keys;

/** What a picker or a prompt is asking for. */
public enum Ask {
    NOTHING("", false),
    DISPLAY_INPUT("display input", true),
    RESPONSE("response", true),
    INPUTS("model inputs (Space adds or removes)", true),
    GROUP("group column", true),
    HELD_INPUT("input to hold", true),
    K("k", false),
    CONDITION("row condition", false),
    FILE("file name", false);

    private final String title;
    private final boolean picker;

    Ask(String title, boolean picker) {
        this.title = title;
        this.picker = picker;
    }

    /** The words shown at the top of the picker or before the prompt. */
    public String title() {
        return title;
    }

    /** Whether the answer is chosen from a list of columns rather than typed. */
    public boolean picker() {
        return picker;
    }
}
