package nearfit.plot;

/**
 * The tuning chart as text: leave-one-out RMSE against k on a log k axis, the RMSE line as the
 * curve, one-SE error bars in the band's role, the best k marked {@code ●} ({@code *} in ASCII)
 * and the one-SE k {@code ○} ({@code o} in ASCII), both in the {@link Role#MARKER} role and
 * named in the header.
 */
public final class TuningChart {
    private TuningChart() {
    }

    /**
     * @return the chart
     * @throws IllegalArgumentException when the size leaves no room for a plot
     */
    public static CellGrid compose(TuningScene s, int width, int height, CanvasKind kind) {
        double kMin = s.k()[0];
        double kMax = s.k()[s.k().length - 1];
        double[] ye = s.yExtent();
        PlotFrame f = PlotFrame.layout(width, height, true, true, kind,
                rows -> Axis.fit(AxisKind.LINEAR, ye[0], ye[1], 0.5 / rows, Math.max(2, rows / 3)),
                cols -> Axis.fit(AxisKind.LOG, kMin, kMax, 0.5 / cols, 0));
        Canvas canvas = kind.newCanvas(f.cols(), f.rows());
        for (int i = 0; i < s.k().length; i++) {
            double se = s.se()[i];
            if (Double.isFinite(se) && Double.isFinite(s.rmse()[i])) {
                double x = f.lineX(s.k()[i]);
                canvas.line(Layer.BAND_EDGE, x, f.lineY(s.rmse()[i] - se), x, f.lineY(s.rmse()[i] + se), false);
            }
            if (i > 0 && Double.isFinite(s.rmse()[i - 1] + s.rmse()[i])) {
                canvas.line(Layer.CURVE, f.lineX(s.k()[i - 1]), f.lineY(s.rmse()[i - 1]),
                        f.lineX(s.k()[i]), f.lineY(s.rmse()[i]), false);
            }
        }
        CellGrid.Builder g = CellGrid.builder(width, height);
        canvas.writeTo(g, f.col0(), f.row0());
        // The header gives way by whole words, never cutting a number: the axis name shortens, then goes.
        String legend = legend(s, kind);
        String title = s.title().isEmpty() ? legend : s.title() + "  " + legend;
        String yName = "leave-one-out RMSE";
        for (String y : new String[] {"leave-one-out RMSE", "RMSE", ""}) {
            yName = y;
            if (y.length() + (y.isEmpty() ? 0 : 2) + title.length() <= width) {
                break;
            }
        }
        AxesPainter.paint(g, f, kind, yName, title, "k");
        mark(g, f, s.oneSeK(), s.rmseAt(s.oneSeK()), kind == CanvasKind.BRAILLE ? '○' : 'o');
        mark(g, f, s.bestK(), s.rmseAt(s.bestK()), kind == CanvasKind.BRAILLE ? '●' : '*');
        return g.build();
    }

    private static String legend(TuningScene s, CanvasKind kind) {
        boolean u = kind == CanvasKind.BRAILLE;
        return (u ? "● " : "* ") + "best k " + NiceTicks.label(s.bestK(), 0) + "  "
                + (u ? "○ " : "o ") + "one-SE k " + NiceTicks.label(s.oneSeK(), 0);
    }

    private static void mark(CellGrid.Builder g, PlotFrame f, double k, double rmse, char glyph) {
        int col = f.columnOf(k);
        int row = f.rowOf(rmse);
        if (col >= 0 && row >= 0) {
            g.set(col, row, glyph, Role.MARKER);
        }
    }
}
