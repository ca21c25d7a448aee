package nearfit.table;

/**
 * A column of free text. Its values are kept out of memory (they stay in the file, found through
 * {@link Table#lineOf(int)}); only the counts are held, which is all summaries need.
 */
public final class TextColumn extends NamedColumn implements Column {
    private final int size;

    TextColumn(String name, int size, long missing) {
        super(name, missing, 0);
        this.size = size;
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
}
