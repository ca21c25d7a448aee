package nearfit.plot;

import java.util.Locale;

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

    /** Spells the full-bar width for the margin. */
    @FunctionalInterface
    public interface WidthLabel {
        /**
         * @param width the width at full bar height, positive
         * @param room  characters available, at least 1
         * @return at most {@code room} characters, or "" when the width cannot be spelled in them
         *     (a cut number would be a wrong one)
         */
        String spell(double width, int room);
    }

    /**
     * Numbers: three significant digits, then two, then one, then one in e-notation
     * ({@code 0.0945}, {@code 0.094}, {@code 0.09}, {@code 9e-2}).
     */
    public static final WidthLabel NUMBER = (v, room) -> {
        String sci = String.format(Locale.ROOT, "%.0e", v).replaceFirst("e([+-])0*(\\d)", "e$1$2").replace("e+", "e");
        String[] tries = {NiceTicks.label(v, fractionDigitsFor(v)), String.format(Locale.ROOT, "%.2g", v),
            String.format(Locale.ROOT, "%.1g", v), sci};
        for (String t : tries) {
            if (t.length() <= room) {
                return t;
            }
        }
        return "";
    };

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
        return render(frame, width, xs, widths, rows, kind, NUMBER);
    }

    /**
     * As {@link #render(PlotFrame, int, double[], double[], int, CanvasKind)}, with the margin label
     * spelled by {@code label}; the label always ends one blank cell before the first bar, and is
     * left out when it cannot be spelled in the margin.
     */
    public static CellGrid render(PlotFrame frame, int width, double[] xs, double[] widths, int rows, CanvasKind kind,
                                  WidthLabel label) {
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
            int room = frame.col0() - 1;
            String text = room > 0 ? label.spell(max, room) : "";
            if (!text.isEmpty() && text.length() <= room) {
                g.text(room - text.length(), 0, text, Role.TICK_LABEL);
            }
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
