package nearfit.plot;

import java.util.function.IntFunction;

/**
 * Where a chart's plot area sits in its grid and how positions map to data: the explorer uses it
 * to turn a crosshair column into a data x, and the width strip to align with the plot.
 *
 * <p>Invariant: the plot area is cells [col0, col0 + cols) × [row0, row0 + rows) of the grid;
 * each cell holds dotsX × dotsY dots; x grows rightwards, y upwards (row0 is the top).
 *
 * @param col0  first plot column in the grid
 * @param row0  first (top) plot row in the grid
 * @param cols  plot width in cells
 * @param rows  plot height in cells
 * @param dotsX dots per cell across
 * @param dotsY dots per cell down
 * @param x     the horizontal axis
 * @param y     the vertical axis
 */
public record PlotFrame(int col0, int row0, int cols, int rows, int dotsX, int dotsY, Axis x, Axis y) {

    /**
     * Lays out a chart of width × height cells: an optional header row, the plot area with y
     * tick labels and the y axis line on its left, the x axis line, a row of x tick labels, and
     * an optional row for the x name.
     *
     * @param yAxis makes the y axis given the plot's height in cells
     * @param xAxis makes the x axis given the plot's width in cells
     * @throws IllegalArgumentException when the size leaves no room for a plot
     */
    static PlotFrame layout(int width, int height, boolean header, boolean xName, CanvasKind kind,
                            IntFunction<Axis> yAxis, IntFunction<Axis> xAxis) {
        int row0 = header ? 1 : 0;
        int rows = height - row0 - 2 - (xName ? 1 : 0);
        if (rows < 2) {
            throw new IllegalArgumentException("a chart " + height + " rows high has no room for a plot");
        }
        Axis y = yAxis.apply(rows);
        int col0 = y.widestLabel() + 1;
        int cols = width - col0;
        if (cols < 4) {
            throw new IllegalArgumentException("a chart " + width + " columns wide has no room for a plot");
        }
        int dx = kind == CanvasKind.BRAILLE ? 2 : 1;
        int dy = kind == CanvasKind.BRAILLE ? 4 : 1;
        return new PlotFrame(col0, row0, cols, rows, dx, dy, xAxis.apply(cols), y);
    }

    /** @return plot width in dots */
    public int dotWidth() {
        return cols * dotsX;
    }

    /** @return plot height in dots */
    public int dotHeight() {
        return rows * dotsY;
    }

    /** @return the data x at the centre of a grid column, or NaN outside the plot area */
    public double xAtColumn(int gridCol) {
        int c = gridCol - col0;
        return c < 0 || c >= cols ? Double.NaN : x.valueAt((c + 0.5) / cols);
    }

    /** @return the data x at the centre of a dot column (0 = leftmost of the plot), NaN outside */
    public double xAtDot(int dot) {
        return dot < 0 || dot >= dotWidth() ? Double.NaN : x.valueAt((dot + 0.5) / dotWidth());
    }

    /** @return the grid column showing a data x, or -1 outside the plot area */
    public int columnOf(double value) {
        int d = dotColumn(value);
        return d < 0 ? -1 : col0 + d / dotsX;
    }

    /** @return the grid row showing a data y, or -1 outside the plot area */
    public int rowOf(double value) {
        int d = dotRow(value);
        return d < 0 ? -1 : row0 + d / dotsY;
    }

    /** @return the dot column (0 = leftmost) of a data x, or -1 outside; max maps to the last */
    public int dotColumn(double value) {
        double u = x.fraction(value) * dotWidth();
        return u >= 0 && u <= dotWidth() ? Math.min((int) u, dotWidth() - 1) : -1;
    }

    /** @return the dot row (0 = top) of a data y, or -1 outside; min maps to the bottom row */
    public int dotRow(double value) {
        double v = y.fraction(value) * dotHeight();
        return v >= 0 && v <= dotHeight() ? dotHeight() - 1 - Math.min((int) v, dotHeight() - 1) : -1;
    }

    /** @return a data x in continuous dot coordinates for line drawing (dot i spans i ± 0.5) */
    double lineX(double value) {
        return x.fraction(value) * dotWidth() - 0.5;
    }

    /** @return a data y in continuous dot coordinates for line drawing (0 = top dot) */
    double lineY(double value) {
        return dotHeight() - y.fraction(value) * dotHeight() - 0.5;
    }
}
