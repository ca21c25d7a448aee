package nearfit.table;

/**
 * A cell that did not parse as its column's type, or a row of the wrong length, kept as an example.
 *
 * @param line   the 1-based source line where the row starts
 * @param column the column name, or {@code null} for a ragged row
 * @param text   the cell's text (at most 80 characters) or a description of the row
 */
public record BadCell(long line, String column, String text) {
}
