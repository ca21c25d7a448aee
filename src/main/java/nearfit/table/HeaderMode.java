package nearfit.table;

/** Whether the first row of a file names the columns. */
public enum HeaderMode {
    /** Decide from the data: a first row of labels above numbers or times is a header. */
    AUTO,
    /** The first row is a header. */
    PRESENT,
    /** There is no header; columns are named col1, col2, ... */
    ABSENT
}
