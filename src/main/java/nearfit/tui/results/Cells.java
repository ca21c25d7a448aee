package nearfit.tui.results;

/**
 * A rectangle of drawn cells, each one code point of display width one and an {@link Ink}.
 * Columns run from 0 at the left, rows from 0 at the top.
 */
public interface Cells {
    /** Columns. */
    int width();

    /** Rows. */
    int height();

    /** The code point at a cell; a space for an empty one. */
    int codePoint(int col, int row);

    /** What the cell shows. */
    Ink ink(int col, int row);
}
