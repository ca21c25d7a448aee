package nearfit.plot;

/**
 * The window-width strip under a scatter: one bar per plot column, as tall as the window width
 * (the distance to the k-th neighbour) at that column's centre x, so sparse stretches of the
 * display input stand out. Columns line up with the {@link PlotFrame} it is given; the left
 * margin shows the largest width, which is the full bar height.
 *
 * <p>Bars use the Unicode block elements U+2581–U+2588 (eighths of a cell) with
 * {@link CanvasKind#BRAILLE}, and {@code _ : #} (under half, at least half, full) with ASCII.
 */
public final class WidthStrip {
    private static final int EIGHTHS = 8;

    private WidthStrip() {
    }

    /**
     * @param frame  the frame of the scatter above
     * @param width  grid width in cells, normally the scatter's
     * @param xs     display input at each width, ascending; NaN breaks
     * @param widths window width at each xs, positive; NaN where unknown
     * @param rows   strip height in cells, at least 1
     * @param kind   glyph set
     * @return the strip
     */
    public static CellGrid render(PlotFrame frame, int width, double[] xs, double[] widths, int rows, CanvasKind kind) {
        if (xs.length != widths.length) {
            throw new IllegalArgumentException(xs.length + " x values but " + widths.length + " widths");
        }
        double[] atColumn = new double[frame.cols()];
        double max = 0;
        for (int c = 0; c < atColumn.length; c++) {
            atColumn[c] = interpolate(xs, widths, frame.xAtColumn(frame.col0() + c));
            if (atColumn[c] > max) {
                max = atColumn[c];
            }
        }
        CellGrid.Builder g = CellGrid.builder(width, rows);
        if (max > 0) {
            for (int c = 0; c < atColumn.length; c++) {
                bar(g, frame.col0() + c, rows, atColumn[c] / max, kind);
            }
            String label = NiceTicks.label(max, fractionDigitsFor(max));
            g.text(Math.max(0, frame.col0() - 1 - label.length()), 0, label, Role.TICK_LABEL);
        }
        return g.build();
    }

    private static void bar(CellGrid.Builder g, int col, int rows, double share, CanvasKind kind) {
        if (!(share > 0)) {
            return;
        }
        int eighths = Math.max(1, (int) Math.round(share * rows * EIGHTHS));
        for (int r = rows - 1; r >= 0 && eighths > 0; r--) {
            int part = Math.min(EIGHTHS, eighths);
            g.set(col, r, glyph(part, kind), Role.WIDTH);
            eighths -= part;
        }
    }

    private static int glyph(int eighths, CanvasKind kind) {
        if (kind == CanvasKind.BRAILLE) {
            return 0x2580 + eighths; // U+2581 LOWER ONE EIGHTH BLOCK .. U+2588 FULL BLOCK
        }
        return eighths == EIGHTHS ? '#' : eighths >= EIGHTHS / 2 ? ':' : '_';
    }

    /** Three significant digits for the margin label. */
    private static int fractionDigitsFor(double v) {
        return Math.max(0, 2 - (int) Math.floor(Math.log10(v)));
    }

    /**
     * Linear interpolation of ys over ascending xs at x; NaN outside [xs[0], xs[n-1]] or next to
     * a NaN. Binary search: O(log n).
     */
    static double interpolate(double[] xs, double[] ys, double x) {
        int n = xs.length;
        if (n == 0 || !(x >= xs[0] && x <= xs[n - 1])) {
            return Double.NaN;
        }
        int lo = 0;
        int hi = n - 1;
        while (hi - lo > 1) {
            int mid = (lo + hi) >>> 1;
            if (xs[mid] <= x) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        if (xs[hi] == xs[lo]) {
            return ys[lo];
        }
        double t = (x - xs[lo]) / (xs[hi] - xs[lo]);
        return ys[lo] + t * (ys[hi] - ys[lo]);
    }
}
