package nearfit.plot;

/**
 * The tuning chart as text: RMSE against k on a log k axis. The y range comes from the RMSE curve
 * alone ({@link TuningScene#yExtent()}), so the curve stays readable when the standard errors are
 * wider than the differences between k (on equipment logs they often are): one standard error
 * either side is a shaded band in the band's role, clipped at the plot's edges, under the RMSE line
 * (the curve's role, opaque); the one-SE line (the best k's RMSE plus its SE, the threshold of the
 * one-SE rule) is a dashed band edge when it falls inside the range. The best k is marked
 * {@code ●} ({@code *} in ASCII) and the one-SE k {@code ○} ({@code o} in ASCII), both in the
 * {@link Role#MARKER} role and named in the header.
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
        shadeBand(canvas, f, s);
        double line = s.oneSeLine();
        if (Double.isFinite(line)) {
            canvas.line(Layer.BAND_EDGE, f.lineX(kMin), f.lineY(line), f.lineX(kMax), f.lineY(line), true);
        }
        for (int i = 1; i < s.k().length; i++) {
            if (Double.isFinite(s.rmse()[i - 1] + s.rmse()[i])) {
                canvas.line(Layer.CURVE, f.lineX(s.k()[i - 1]), f.lineY(s.rmse()[i - 1]),
                        f.lineX(s.k()[i]), f.lineY(s.rmse()[i]), false);
            }
        }
        if (s.k().length == 1 && Double.isFinite(s.rmse()[0])) {
            canvas.line(Layer.CURVE, f.lineX(kMin), f.lineY(s.rmse()[0]), f.lineX(kMin), f.lineY(s.rmse()[0]), false);
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

    /**
     * Shades RMSE ± SE in every dot column between the first and last k, both interpolated linearly
     * in log k between the table's k values; rows beyond the plot are clamped to its edge.
     */
    private static void shadeBand(Canvas canvas, PlotFrame f, TuningScene s) {
        double[] k = s.k();
        int i = 0;
        for (int dx = 0; dx < f.dotWidth(); dx++) {
            double kv = f.xAtDot(dx);
            if (!(kv >= k[0] && kv <= k[k.length - 1])) {
                continue;
            }
            while (i < k.length - 2 && kv > k[i + 1]) {
                i++;
            }
            int j = Math.min(i + 1, k.length - 1);
            double t = j == i ? 0 : (Math.log(kv) - Math.log(k[i])) / (Math.log(k[j]) - Math.log(k[i]));
            double r = s.rmse()[i] + t * (s.rmse()[j] - s.rmse()[i]);
            double e = s.se()[i] + t * (s.se()[j] - s.se()[i]);
            if (Double.isFinite(r) && Double.isFinite(e)) {
                canvas.shadeColumn(Layer.BAND, dx, dotRowClamped(f, r + e), dotRowClamped(f, r - e));
            }
        }
    }

    /** The dot row of a y in continuous dot units, clamped to one row beyond either edge. */
    private static int dotRowClamped(PlotFrame f, double y) {
        double v = Math.max(-1, Math.min(f.dotHeight(), f.lineY(y)));
        return (int) Math.ceil(v - 0.5);
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
