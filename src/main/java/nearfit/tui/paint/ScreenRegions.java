package nearfit.tui.paint;

/**
 * Where each part of the screen goes for a terminal size: two header rows, the plot, one window-width row,
 * the status row and the key row. Below {@link #MIN_WIDTH} by {@link #MIN_HEIGHT} only a message is drawn.
 *
 * @param width  terminal columns
 * @param height terminal rows
 */
public record ScreenRegions(int width, int height) {
    /** Fewest columns for the full screen; narrower shows a message. */
    public static final int MIN_WIDTH = 60;
    /** Fewest rows for the full screen. */
    public static final int MIN_HEIGHT = 18;
    /** Header rows above the plot. */
    public static final int HEADER_ROWS = 2;

    /** Whether the terminal is big enough for the full screen. */
    public boolean fits() {
        return width >= MIN_WIDTH && height >= MIN_HEIGHT;
    }

    /** The first plot row. */
    public int plotTop() {
        return HEADER_ROWS;
    }

    /** Plot rows. */
    public int plotHeight() {
        return height - HEADER_ROWS - 3;
    }

    /** The window-width strip's row. */
    public int stripRow() {
        return height - 3;
    }

    /** The status row. */
    public int statusRow() {
        return height - 2;
    }

    /** The key row. */
    public int keyRow() {
        return height - 1;
    }

    /** Width of the tuning panel's table, in columns; the chart takes the rest of the panel. */
    public static final int TUNING_TABLE_WIDTH = 30;

    /** Columns of the tuning panel's chart: the panel's inside less the table and a gap. */
    public int tuningChartWidth() {
        return width - 4 - 2 - TUNING_TABLE_WIDTH - 1;
    }

    /** Rows of the tuning panel's chart: the panel's inside. */
    public int tuningChartHeight() {
        return plotHeight() - 2;
    }

    /**
     * Points on the curve: one per terminal column. The plot joins them with lines, and halving the points
     * of the braille grid's two dots per column halves the curve's cost after a key press.
     */
    public int curveSteps() {
        return Math.max(2, width);
    }
}
