package nearfit.table;

/** What every column holds besides its values: its name and its missing and bad counts. */
abstract class NamedColumn {
    private final String name;
    private final long missing;
    private final long bad;

    NamedColumn(String name, long missing, long bad) {
        this.name = name;
        this.missing = missing;
        this.bad = bad;
    }

    /** The column's name, unique within its table. */
    public final String name() {
        return name;
    }

    /** The number of missing values, bad cells included. */
    public final long missingCount() {
        return missing;
    }

    /** The number of cells that were present but did not parse as the column's type. */
    public final long badCount() {
        return bad;
    }
}
