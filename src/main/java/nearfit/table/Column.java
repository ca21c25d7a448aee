package nearfit.table;

/**
 * One column of a {@link Table}: a name, a type and one value per row (possibly missing).
 *
 * <p>Row indexes run from 0 to {@code size() - 1}; a row's source line is {@link Table#lineOf(int)}.
 */
public sealed interface Column permits NumericColumn, CategoryColumn, TextColumn {
    /** The column's name, unique within its table. */
    String name();

    /** The kind of values held. */
    ColumnType type();

    /** The number of rows, equal to the table's row count. */
    int size();

    /** Whether the value at {@code row} is missing (empty, NA or unparseable). */
    boolean isMissing(int row);

    /** The number of missing values, bad cells included. */
    long missingCount();

    /** The number of cells that were present but did not parse as this column's type. */
    long badCount();
}
