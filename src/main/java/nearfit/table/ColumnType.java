package nearfit.table;

/** The kind of values a column holds, inferred by the loader and confirmed over the whole file. */
public enum ColumnType {
    /** Decimal numbers, stored as {@code double}; NaN marks a missing value. */
    NUMBER("number"),
    /** ISO 8601 dates and date-times, stored as {@code long} epoch milliseconds (UTC when no offset). */
    TIME("time"),
    /** Few distinct labels, stored as {@code int} codes into a dictionary; -1 marks a missing value. */
    CATEGORY("category"),
    /** Free text; only counts are kept, the values stay in the file. */
    TEXT("text");

    private final String label;

    ColumnType(String label) {
        this.label = label;
    }

    /** The lower-case name used in output and JSON: number, time, category or text. */
    public String label() {
        return label;
    }
}
