package nearfit.table;

/**
 * A column of free text. Its values are kept out of memory (they stay in the file, found through
 * {@link Table#lineOf(int)}); only the counts are held, which is all summaries need.
 */
public final class TextColumn implements Column {
    private final String name;
    private final int size;
    private final long missing;

    TextColumn(String name, int size, long missing) {
        this.name = name;
        this.size = size;
        this.missing = missing;
    }

    @Override
    public String name() {
        return name;
    }

    @Override
    public ColumnType type() {
        return ColumnType.TEXT;
    }

    @Override
    public int size() {
        return size;
    }

    /** Unknown for text, whose values are not kept: always {@code false}; see {@link #missingCount()}. */
    @Override
    public boolean isMissing(int row) {
        return false;
    }

    @Override
    public long missingCount() {
        return missing;
    }

    @Override
    public long badCount() {
        return 0;
    }
}
