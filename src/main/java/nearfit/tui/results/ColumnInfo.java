package nearfit.tui.results;

/**
 * A column as the explorer lists it.
 *
 * @param name    the column's name in the file
 * @param kind    what it holds
 * @param missing how many of its cells are missing or bad
 */
public record ColumnInfo(String name, ColumnKind kind, long missing) {
}
