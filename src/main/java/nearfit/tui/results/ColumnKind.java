package nearfit.tui.results;

/** What a column holds, as far as the explorer needs to know: which pickers may offer it. */
public enum ColumnKind {
    /** Decimal numbers: an input or a response. */
    NUMBER,
    /** Date-times: an input (as epoch milliseconds) or the axis of residuals over time. */
    TIME,
    /** Labels: a category response or a group. */
    CATEGORY,
    /** Free text: shown in the column picker only. */
    TEXT;

    /** Whether the column can be an input or a number response. */
    public boolean numeric() {
        return this == NUMBER || this == TIME;
    }
}
