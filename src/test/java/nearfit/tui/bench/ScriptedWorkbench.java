package nearfit.tui.bench;

import java.io.IOException;
import java.io.OutputStream;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicInteger;

import nearfit.knn.FlagResult;
import nearfit.knn.FlagScale;
import nearfit.knn.TuningTable;
import nearfit.table.LoadNotes;
import nearfit.table.LoadReport;
import nearfit.table.NearfitException;
import nearfit.tui.keys.FitKey;
import nearfit.tui.results.Cells;
import nearfit.tui.results.ColumnInfo;
import nearfit.tui.results.ColumnKind;
import nearfit.tui.results.CurveRequest;
import nearfit.tui.results.CurveResult;
import nearfit.tui.results.FlaggedRow;
import nearfit.tui.results.FlaggedRows;
import nearfit.tui.results.Ink;
import nearfit.tui.results.PlotCells;
import nearfit.tui.results.TuningFigures;

/**
 * A test double of the core: fixed columns and answers that encode the settings they were asked for, so a
 * screen test can see which request a frame shows (the fit is 100 + k, the window width is k / 1000).
 * It computes nothing statistical; the real core is tested in its own packages.
 */
public class ScriptedWorkbench implements Workbench {
    public final AtomicInteger curveCalls = new AtomicInteger();
    public final AtomicInteger tuneCalls = new AtomicInteger();
    /** When set, a curve for this k waits for {@link #release} before answering. */
    public volatile int holdCurveForK = -1;
    public final CountDownLatch release = new CountDownLatch(1);

    @Override
    public String source() {
        return "site-test.csv";
    }

    @Override
    public long totalRows() {
        return 1000;
    }

    @Override
    public LoadNotes loadNotes() {
        return new LoadNotes(new LoadReport("site-test.csv", 1000, 40_000, ',', true, false, 0, 0, List.of(), 0,
                List.of(), 0), List.of());
    }

    @Override
    public List<ColumnInfo> columns() {
        return List.of(new ColumnInfo("time", ColumnKind.TIME, 0), new ColumnInfo("turbine", ColumnKind.CATEGORY, 0),
                new ColumnInfo("wind_ms", ColumnKind.NUMBER, 0), new ColumnInfo("air_temp_c", ColumnKind.NUMBER, 0),
                new ColumnInfo("power_kw", ColumnKind.NUMBER, 0));
    }

    @Override
    public String timeColumn() {
        return "time";
    }

    @Override
    public int rowsUsed(String condition) {
        if (condition.isEmpty()) {
            return 1000;
        }
        if (condition.contains("nonsense")) {
            throw new NearfitException("row condition: \"nonsense\" is not column op value");
        }
        return 400;
    }

    @Override
    public double quantile(String column, String condition, double q) {
        return column.equals("wind_ms") ? 25 * q : 10 + 20 * q;
    }

    @Override
    public List<String> labels(String column) {
        return List.of("T01", "T02", "T03");
    }

    @Override
    public CurveResult curve(FitKey model, CurveRequest request, JobControl control) {
        curveCalls.incrementAndGet();
        if (model.settings().k() == holdCurveForK) {
            try {
                release.await(10, TimeUnit.SECONDS);
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
            }
        }
        int n = request.steps();
        double[] x = new double[n];
        double[] fit = new double[n];
        double[] lo = new double[n];
        double[] hi = new double[n];
        double[] w = new double[n];
        int[] nb = new int[n];
        for (int i = 0; i < n; i++) {
            x[i] = request.at(i);
            fit[i] = 100 + model.settings().k();
            lo[i] = fit[i] - 10;
            hi[i] = fit[i] + 10;
            w[i] = model.settings().k() / 1000.0;
            nb[i] = model.settings().k();
        }
        return new CurveResult(x, fit, lo, hi, w, nb);
    }

    @Override
    public TuningTable tune(FitKey model, nearfit.tui.results.HeldOutChoice choice, String groupColumn, JobControl control) {
        tuneCalls.incrementAndGet();
        control.progress(0.5);
        // k = 1 to 50: RMSE falls from 9 to 4 at k = 15, rises to 4.4 at k = 30, then jumps above 4.5, so with
        // SE 0.5 the lowest k is 15 and the one-SE k is 30.
        int kmax = 50;
        double[] rmse = new double[kmax];
        double[] se = new double[kmax];
        double[] none = new double[kmax];
        java.util.Arrays.fill(none, Double.NaN);
        for (int k = 1; k <= kmax; k++) {
            rmse[k - 1] = k <= 15 ? 4 + (15 - k) * (5.0 / 14) : k <= 30 ? 4 + (k - 15) * (0.4 / 15) : 4.6 + (k - 30) * 0.02;
            se[k - 1] = 0.5;
        }
        // The table names the scheme asked for, as the core's does, so the header can say where k came from.
        nearfit.knn.HeldOutScheme scheme = TuningCriterion.schemeOf(choice);
        return new TuningTable(scheme.describe(), 1000, 1000, rmse, se, none, none, none, none, none, none, 15, 30,
                scheme, choice == nearfit.tui.results.HeldOutChoice.LEAVE_ONE_OUT ? 1000 : 5, scheme.seOverBlocks());
    }

    @Override
    public FlaggedRows flags(FitKey model, String groupColumn, String shownCondition, JobControl control) {
        List<FlaggedRow> rows = new ArrayList<>();
        rows.add(new FlaggedRow(41, 43, "2026-03-02T10:10:00Z", "T02", List.of(12.5), 300, 1900, -1600, -7.5));
        rows.add(new FlaggedRow(7, 9, "2026-03-01T01:10:00Z", "T01", List.of(5.0), 900, 400, 500, 4.1));
        int n = 1000;
        int[] ids = new int[n];
        double[] z = new double[n];
        boolean[] flagged = new boolean[n];
        for (int i = 0; i < n; i++) {
            ids[i] = i;
        }
        z[41] = -7.5;
        z[7] = 4.1;
        flagged[41] = true;
        flagged[7] = true;
        // The residual columns are not read by the screen; the RMSE shown is the one given here.
        double[] zeros = new double[n];
        FlagResult f = new FlagResult(ids, zeros, zeros, z, flagged, rows.size(), 0, 1, FlagScale.LOCAL_SD, 3.5);
        return new FlaggedRows(f, 85.25, rows);
    }

    @Override
    public PlotCells plot(PlotScene scene, int width, int height) {
        Cells strip = scene.curve() == null ? new TextCells(width, 1, "", ' ')
                : new TextCells(width, 1, "width " + scene.curve().width()[0], scene.ascii() ? '=' : '\u2581');
        return new PlotCells(new TextCells(width, height, "plot " + scene.model().response() + " vs " + scene.request().displayInput()
                + (scene.curve() == null ? " (no curve)" : " curve fit " + scene.curve().fit()[0]), '\u28ff'), strip);
    }

    @Override
    public Cells tuningChart(TuningFigures tuning, int currentK, int width, int height, boolean ascii) {
        return new TextCells(width, height, "chart best " + tuning.bestK(), '.');
    }

    @Override
    public void writePng(PlotScene scene, int width, int height, OutputStream out) throws IOException {
        out.write(("PNG " + width + "x" + height).getBytes(java.nio.charset.StandardCharsets.US_ASCII));
    }

    /** Cells with a label on the first row and a fill character on the last. */
    public record TextCells(int width, int height, String label, char fill) implements Cells {
        @Override
        public int codePoint(int col, int row) {
            if (row == 0 && col < label.length()) {
                return label.charAt(col);
            }
            return row == height - 1 ? fill : ' ';
        }

        @Override
        public Ink ink(int col, int row) {
            return row == height - 1 ? Ink.POINTS_3 : Ink.LABEL;
        }
    }
}
