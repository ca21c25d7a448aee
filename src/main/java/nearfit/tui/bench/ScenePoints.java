package nearfit.tui.bench;

import java.util.Arrays;
import java.util.List;

import nearfit.plot.Scene;
import nearfit.table.CategoryColumn;
import nearfit.table.Column;
import nearfit.table.RowSet;
import nearfit.table.Table;
import nearfit.tui.keys.PlotMode;
import nearfit.tui.results.ComparedResiduals;
import nearfit.tui.results.CurveResult;
import nearfit.tui.results.FlaggedRow;

/**
 * Turns the explorer's {@link PlotScene} into the plot package's {@link Scene}: the points of the used rows
 * (or their leave-one-out residuals), the curve, the band, the flag marks and the crosshair. The point
 * arrays of the latest scene are kept, so moving the crosshair or changing k does not copy columns again.
 * Residuals come from the scene (the latest flags and, with a group compared, the curve's compared
 * residuals), never from a cache: what is drawn is what the results hold.
 */
final class ScenePoints {
    /** Half-width of the "near the held values" window, as a quantile step (5 % either side). */
    static final double NEAR = 0.05;

    private final Table table;
    private final WorkbenchCache references;
    private PointsKey pointsKey;
    private Points points;
    /** Row id to its index in {@link #points}, made when first asked for; {@code null} until then. */
    private it.unimi.dsi.fastutil.ints.Int2IntOpenHashMap pointIndex;

    /**
     * Row ids and their coordinates and codes on the plot, with the finite extent of y (NaN when none).
     * Arrays never change once built.
     */
    /** What the points depend on; the flags and compared residuals by identity. */
    private record PointsKey(String condition, String shownCondition, String response, List<String> inputs,
            String displayInput, PlotMode mode, String groupColumn, boolean nearHeldOnly,
            java.util.Map<String, Double> held, nearfit.knn.FlagResult flags, ComparedResiduals compared) {
    }

    private record Points(int[] rows, double[] x, double[] y, int[] codes, double yLow, double yHigh) {
        Points(int[] rows, double[] x, double[] y, int[] codes) {
            this(rows, x, y, codes, lowest(y), highest(y));
        }
    }

    private static double lowest(double[] v) {
        double m = Double.POSITIVE_INFINITY;
        for (double d : v) {
            m = d < m ? d : m;
        }
        return m == Double.POSITIVE_INFINITY ? Double.NaN : m;
    }

    private static double highest(double[] v) {
        double m = Double.NEGATIVE_INFINITY;
        for (double d : v) {
            m = d > m ? d : m;
        }
        return m == Double.NEGATIVE_INFINITY ? Double.NaN : m;
    }

    ScenePoints(Table table, WorkbenchCache references) {
        this.table = table;
        this.references = references;
    }

    synchronized Scene scene(PlotScene s) {
        Points p = points(s);
        boolean residuals = s.mode() != PlotMode.RESPONSE;
        String xName = s.mode() == PlotMode.RESIDUALS_OVER_TIME ? timeName() : s.request().displayInput();
        String yName = residuals ? "residual of " + s.model().response() : s.model().response();
        if (residuals && s.request().compare() && s.request().group() >= 0) {
            yName += " (highlighted group: against the others' curve)";
        }
        // Column names come from the file: control characters are made visible before they reach the screen.
        Scene.Builder b = Scene.builder(p.x(), p.y()).labels("", nearfit.table.VisibleText.of(xName),
                nearfit.table.VisibleText.of(yName));
        if (s.mode() == PlotMode.RESIDUALS_OVER_TIME) {
            b.timeAxis();
        } else {
            if (table.column(s.request().displayInput()).type() == nearfit.table.ColumnType.TIME) {
                // A time display input gets calendar ticks, as the residuals over time do.
                b.timeAxis();
            }
            b.xRange(s.request().from(), s.request().to());
        }
        if (!Double.isNaN(p.yLow())) {
            // The y axis follows the points only, padded a little, so that a new curve or band (a k change)
            // keeps the axes and the plot package's binned points stay valid; the fit is a weighted mean of
            // responses, so it stays inside this range (a +-2 SD band may be clipped at the edges).
            double pad = 0.02 * Math.max(p.yHigh() - p.yLow(), Math.abs(p.yLow()) * 1e-9 + 1e-12);
            b.yRange(p.yLow() - pad, p.yHigh() + pad);
        }
        boolean category = table.column(s.model().response()) instanceof CategoryColumn;
        if (category && !residuals) {
            b.classes(p.codes());
        } else if (s.request().groupColumn() != null && s.request().group() >= 0) {
            b.highlight(p.codes(), s.request().group());
        }
        CurveResult c = s.curve();
        if (c != null && !residuals) {
            b.curve(c.x(), c.fit());
            if (!allNaN(c.bandLow())) {
                b.band(c.x(), c.bandLow(), c.bandHigh(), Scene.BandStyle.LINES);
            }
        }
        if (s.flagMarks() && s.flags() != null && !s.flags().rows().isEmpty()) {
            marks(b, s, residuals);
        }
        if (s.mode() != PlotMode.RESIDUALS_OVER_TIME && !Double.isNaN(s.crosshairX())) {
            b.crosshair(s.crosshairX());
        }
        if (s.markedRow() >= 0) {
            mark(b, s, p);
        }
        return b.build();
    }

    /** The marked row where its point is drawn: the same x and y as the points use. */
    private void mark(Scene.Builder b, PlotScene s, Points p) {
        int row = s.markedRow();
        if (row >= table.rowCount()) {
            return;
        }
        int at = indexOf(p, row);
        if (at >= 0) {
            b.marked(p.x()[at], p.y()[at]);
        }
    }

    /** The index of a row among the points, -1 when it is not drawn. */
    private int indexOf(Points p, int row) {
        if (pointIndex == null) {
            pointIndex = new it.unimi.dsi.fastutil.ints.Int2IntOpenHashMap(p.rows().length);
            pointIndex.defaultReturnValue(-1);
            for (int i = 0; i < p.rows().length; i++) {
                pointIndex.put(p.rows()[i], i);
            }
        }
        return pointIndex.get(row);
    }

    private void marks(Scene.Builder b, PlotScene s, boolean residuals) {
        List<FlaggedRow> f = s.flags().rows();
        int display = s.model().inputs().indexOf(s.request().displayInput());
        double[] fx = new double[f.size()];
        double[] fy = new double[f.size()];
        Column time = s.mode() == PlotMode.RESIDUALS_OVER_TIME ? table.column(timeName()) : null;
        boolean compared = residuals && s.request().compare() && s.request().group() >= 0;
        Points p = points;
        for (int i = 0; i < fx.length; i++) {
            FlaggedRow r = f.get(i);
            fx[i] = time != null ? ((nearfit.table.TimeColumn) time).asDouble(r.row()) : r.inputs().get(display);
            fy[i] = residuals ? r.residual() : r.response();
            if (compared) {
                // A highlighted row's residual is drawn against the others' curve; its flag goes with it.
                int at = indexOf(p, r.row());
                fy[i] = at < 0 ? fy[i] : p.y()[at];
            }
        }
        b.flags(fx, fy);
    }

    private String timeName() {
        for (Column c : table.columns()) {
            if (c.type() == nearfit.table.ColumnType.TIME) {
                return c.name();
            }
        }
        throw new IllegalStateException("no time column");
    }

    private Points points(PlotScene s) {
        nearfit.knn.FlagResult flags = s.mode() == PlotMode.RESPONSE || s.flags() == null ? null : s.flags().result();
        boolean residuals = s.mode() != PlotMode.RESPONSE;
        ComparedResiduals compared = residuals && s.request().compare() && s.request().group() >= 0
                && s.curve() != null ? s.curve().compared() : null;
        PointsKey key = new PointsKey(s.model().condition(), s.shownCondition(), s.model().response(),
                s.model().inputs(), s.request().displayInput(), s.mode(), s.request().groupColumn(), s.nearHeldOnly(),
                s.nearHeldOnly() ? s.request().held() : null, flags, compared);
        if (!key.equals(pointsKey)) {
            points = s.mode() == PlotMode.RESPONSE ? responsePoints(s) : residualPoints(s, flags, compared);
            pointsKey = key;
            pointIndex = null;
        }
        return points;
    }

    private Points responsePoints(PlotScene s) {
        RowSet used = references.rows(s.shownCondition());
        int[] rows = s.nearHeldOnly() ? nearHeld(s, used) : used.toArray();
        RowSet r = RowSet.of(rows);
        double[] x = table.numeric(s.request().displayInput()).copyValues(r);
        Column response = table.column(s.model().response());
        double[] y;
        int[] codes;
        if (response instanceof CategoryColumn c) {
            // A category response is drawn as 1 for the highlighted class and 0 for the others, under the
            // class's vote share; the colour tells the class.
            codes = codes(c, rows);
            y = new double[rows.length];
            for (int i = 0; i < rows.length; i++) {
                y[i] = codes[i] == s.request().responseClass() ? 1 : codes[i] < 0 ? Double.NaN : 0;
            }
        } else {
            y = table.numeric(s.model().response()).copyValues(r);
            codes = groupCodes(s, rows);
        }
        return new Points(rows, x, y, codes);
    }

    /**
     * The leave-one-out residual of every shown reference row of the latest flags. With a group compared
     * ({@code compared} not {@code null}), the highlighted group's rows get their residual against the curve
     * fitted on the other groups instead, as the plot of the response shows it; the other rows keep theirs.
     */
    private Points residualPoints(PlotScene s, nearfit.knn.FlagResult f, ComparedResiduals compared) {
        if (f == null) {
            return new Points(new int[0], new double[0], new double[0], new int[0]);
        }
        int[] ids = f.rowIds();
        double[] y = f.residual();
        if (compared != null) {
            y = placed(ids, y.clone(), compared);
        }
        // The flags' row ids are in the knn package's canonical order, not ascending, so no RowSet.
        RowSet shown = s.shownCondition().equals(s.model().condition()) ? null : references.rows(s.shownCondition());
        int n = 0;
        int[] keep = new int[ids.length];
        for (int i = 0; i < ids.length; i++) {
            if (shown == null || shown.contains(ids[i])) {
                keep[n++] = i;
            }
        }
        double[] xAll;
        if (s.mode() == PlotMode.RESIDUALS_OVER_TIME) {
            nearfit.table.NumericColumn time = table.numeric(timeName());
            xAll = null;
            double[] x = new double[n];
            int[] rows = new int[n];
            double[] ys = new double[n];
            for (int i = 0; i < n; i++) {
                rows[i] = ids[keep[i]];
                x[i] = time.asDouble(rows[i]);
                ys[i] = y[keep[i]];
            }
            return new Points(rows, x, ys, groupCodes(s, rows));
        }
        // Read by row id, so the flags of the settings before (still shown while new ones are computed) line up.
        nearfit.table.NumericColumn display = table.numeric(s.request().displayInput());
        xAll = new double[ids.length];
        for (int i = 0; i < ids.length; i++) {
            xAll[i] = display.asDouble(ids[i]);
        }
        if (n == ids.length) {
            return new Points(ids, xAll, y, groupCodes(s, ids));
        }
        double[] x = new double[n];
        int[] rows = new int[n];
        double[] ys = new double[n];
        for (int i = 0; i < n; i++) {
            rows[i] = ids[keep[i]];
            x[i] = xAll[keep[i]];
            ys[i] = y[keep[i]];
        }
        return new Points(rows, x, ys, groupCodes(s, rows));
    }

    /** The residuals with the compared rows' residuals put in their places. */
    private static double[] placed(int[] ids, double[] y, ComparedResiduals compared) {
        it.unimi.dsi.fastutil.ints.Int2IntOpenHashMap at = new it.unimi.dsi.fastutil.ints.Int2IntOpenHashMap(ids.length);
        at.defaultReturnValue(-1);
        for (int i = 0; i < ids.length; i++) {
            at.put(ids[i], i);
        }
        for (int j = 0; j < compared.rows().length; j++) {
            int i = at.get(compared.rows()[j]);
            if (i >= 0) {
                y[i] = compared.residuals()[j];
            }
        }
        return y;
    }

    private int[] groupCodes(PlotScene s, int[] rows) {
        String g = s.request().groupColumn();
        return g == null ? null : codes((CategoryColumn) table.column(g), rows);
    }

    private static int[] codes(CategoryColumn c, int[] rows) {
        int[] out = new int[rows.length];
        for (int i = 0; i < rows.length; i++) {
            out[i] = c.code(rows[i]);
        }
        return out;
    }

    /** The rows whose every held input lies within {@link #NEAR} quantile steps of its held value. */
    private int[] nearHeld(PlotScene s, RowSet used) {
        int[] kept = new int[used.size()];
        int n = 0;
        List<String> held = s.request().held().keySet().stream().sorted().toList();
        double[] lo = new double[held.size()];
        double[] hi = new double[held.size()];
        nearfit.table.NumericColumn[] cols = new nearfit.table.NumericColumn[held.size()];
        for (int j = 0; j < held.size(); j++) {
            String name = held.get(j);
            double q = s.heldQuantile().getOrDefault(name, 0.5);
            lo[j] = references.quantile(name, s.shownCondition(), Math.max(0, q - NEAR));
            hi[j] = references.quantile(name, s.shownCondition(), Math.min(1, q + NEAR));
            cols[j] = table.numeric(name);
        }
        for (int i = 0; i < used.size(); i++) {
            int r = used.row(i);
            boolean near = true;
            for (int j = 0; j < cols.length && near; j++) {
                double v = cols[j].asDouble(r);
                near = v >= lo[j] && v <= hi[j];
            }
            if (near) {
                kept[n++] = r;
            }
        }
        return Arrays.copyOf(kept, n);
    }

    private static boolean allNaN(double[] v) {
        for (double d : v) {
            if (!Double.isNaN(d)) {
                return false;
            }
        }
        return true;
    }
}
