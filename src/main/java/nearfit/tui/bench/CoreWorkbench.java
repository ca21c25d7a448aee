package nearfit.tui.bench;

import java.io.IOException;
import java.io.OutputStream;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.concurrent.CancellationException;

import javax.imageio.ImageIO;

import nearfit.knn.CancelledException;
import nearfit.knn.ClassVote;
import nearfit.knn.Curve;
import nearfit.knn.Estimates;
import nearfit.knn.FlagResult;
import nearfit.knn.Flags;
import nearfit.knn.KnnModel;
import nearfit.knn.HeldOutBlocks;
import nearfit.knn.Tuning;
import nearfit.knn.TuningTable;
import nearfit.plot.CanvasKind;
import nearfit.plot.ComposedPlot;
import nearfit.plot.PngRenderer;
import nearfit.plot.PointLayer;
import nearfit.plot.ScatterComposer;
import nearfit.plot.Scene;
import nearfit.plot.TuningChart;
import nearfit.plot.TuningScene;
import nearfit.table.CategoryColumn;
import nearfit.table.Column;
import nearfit.table.CsvLoader;
import nearfit.table.LoadCancelledException;
import nearfit.table.LoadNotes;
import nearfit.table.LoadOptions;
import nearfit.table.NearfitException;
import nearfit.table.Table;
import nearfit.table.TimeColumn;
import nearfit.tui.keys.FitKey;
import nearfit.tui.results.HeldOutChoice;
import nearfit.tui.keys.PlotMode;
import nearfit.tui.results.Cells;
import nearfit.tui.results.ColumnInfo;
import nearfit.tui.results.ColumnKind;
import nearfit.tui.results.ComparedResiduals;
import nearfit.tui.results.CurveRequest;
import nearfit.tui.results.CurveResult;
import nearfit.tui.results.FlaggedRows;
import nearfit.tui.results.PlotCells;
import nearfit.tui.results.TuningFigures;

/**
 * The {@link Workbench} on the real core: the table package's loader and row conditions, the knn package's
 * fits, curves, tuning and flags, and the plot package's scatter, strip, tuning chart and PNG renderer.
 * The explorer's own code only moves values between them.
 */
public final class CoreWorkbench implements Workbench {
    /** Largest k the tuning panel covers: enough for the ladder's useful range on a site log (common practice). */
    static final int TUNING_KMAX = 200;

    private final Table table;
    private final String source;
    private final List<ColumnInfo> columns;
    private final String timeColumn;
    private final WorkbenchCache references;
    private final ScenePoints points;
    private final LoadNotes notes;
    private PointLayer pointLayer;

    private CoreWorkbench(Table table, String source) {
        this.table = table;
        this.source = source;
        List<ColumnInfo> cols = new ArrayList<>();
        String time = null;
        for (Column c : table.columns()) {
            ColumnKind kind = switch (c.type()) {
                case NUMBER -> ColumnKind.NUMBER;
                case TIME -> ColumnKind.TIME;
                case CATEGORY -> ColumnKind.CATEGORY;
                case TEXT -> ColumnKind.TEXT;
            };
            if (kind == ColumnKind.TIME && time == null) {
                time = c.name();
            }
            cols.add(new ColumnInfo(c.name(), kind, c.missingCount()));
        }
        this.columns = List.copyOf(cols);
        this.timeColumn = time;
        this.references = new WorkbenchCache(table);
        this.points = new ScenePoints(table, references);
        this.notes = LoadNotes.of(table);
    }

    /** Loads a file with the table package's loader, reporting progress and stopping when cancelled. */
    public static Workbench open(Path file, String shownName, JobControl control) {
        LoadOptions options = LoadOptions.builder()
                .progress((bytes, total, rows) -> {
                    if (total > 0) {
                        control.progress((double) bytes / total);
                    }
                    control.rows(rows);
                })
                .cancelSignal(control::cancelled)
                .build();
        try {
            return new CoreWorkbench(CsvLoader.load(file, shownName, options), shownName);
        } catch (LoadCancelledException e) {
            throw new CancellationException("loading cancelled");
        }
    }

    /** A workbench on a table already loaded; for tests and benchmarks. */
    public static Workbench of(Table table, String shownName) {
        return new CoreWorkbench(table, shownName);
    }

    @Override
    public String source() {
        return source;
    }

    @Override
    public long totalRows() {
        return table.rowCount();
    }

    @Override
    public LoadNotes loadNotes() {
        return notes;
    }

    @Override
    public List<ColumnInfo> columns() {
        return columns;
    }

    @Override
    public String timeColumn() {
        return timeColumn;
    }

    @Override
    public int rowsUsed(String condition) {
        return references.rows(condition).size();
    }

    @Override
    public double quantile(String column, String condition, double q) {
        return references.quantile(column, condition, q);
    }

    @Override
    public List<String> labels(String column) {
        return ((CategoryColumn) table.column(column)).labels();
    }

    @Override
    public CurveResult curve(FitKey m, CurveRequest q, JobControl control) {
        KnnModel model = references.model(m, q.compare() ? q.groupColumn() : null, q.group());
        int d = m.inputs().size();
        int display = m.inputs().indexOf(q.displayInput());
        double[] held = new double[d];
        for (int j = 0; j < d; j++) {
            held[j] = j == display ? Double.NaN : q.held().getOrDefault(m.inputs().get(j), Double.NaN);
        }
        double[] x = new double[q.steps()];
        for (int i = 0; i < x.length; i++) {
            x[i] = q.at(i);
        }
        try {
            if (model.data().isCategory()) {
                return voteCurve(model, display, held, x, Math.max(0, q.responseClass()), control);
            }
            Curve c = model.curve(display, held, x, JobProgress.progress(control));
            Estimates e = c.estimates();
            // With a group compared, its rows' residuals against the others' fit come with the curve, for the
            // plot of residuals.
            ComparedResiduals compared = q.compare() && q.group() >= 0 && q.groupColumn() != null
                    ? references.compared(m, q.groupColumn(), q.group()) : null;
            return new CurveResult(x, e.fit(), e.bandLow(), e.bandHigh(), e.windowWidth(), e.neighbourCount(),
                    compared);
        } catch (CancelledException e) {
            throw new CancellationException("curve superseded");
        }
    }

    /** The vote share of one class along the display input; no band or window width for a category. */
    private static CurveResult voteCurve(KnnModel model, int display, double[] held, double[] x, int cls,
            JobControl control) {
        int n = x.length;
        double[] share = new double[n];
        double[] none = new double[n];
        Arrays.fill(none, Double.NaN);
        int[] count = new int[n];
        double[] point = held.clone();
        for (int i = 0; i < n; i++) {
            if (control.cancelled()) {
                throw new CancellationException("curve superseded");
            }
            point[display] = x[i];
            ClassVote v = model.vote(point);
            share[i] = cls < v.shares().length ? v.shares()[cls] : Double.NaN;
            count[i] = v.neighbourCount();
        }
        return new CurveResult(x, share, none, none.clone(), none.clone(), count);
    }

    @Override
    public TuningTable tune(FitKey m, HeldOutChoice choice, String groupColumn, JobControl control) {
        KnnModel model = references.model(m.withK(1), null, -1);
        HeldOutBlocks blocks = blocks(model, choice, groupColumn);
        boolean loo = choice == HeldOutChoice.LEAVE_ONE_OUT;
        if (!loo && blocks.largest() >= model.data().size()) {
            // One group (or day) holds every reference row: nothing outside it is left to predict a row from. The
            // table is leave-one-out's, which its scheme says, and the tuning panel says why: not a failure.
            blocks = blocks(model, HeldOutChoice.LEAVE_ONE_OUT, null);
            loo = true;
        }
        int kmax = Math.min(TUNING_KMAX, model.data().size() - (loo ? 1 : blocks.largest()));
        if (kmax < 1) {
            throw new NearfitException(loo ? "tuning needs at least two reference rows"
                    : "tuning " + choice.words() + ": one block holds all " + model.data().size() + " reference rows");
        }
        try {
            return Tuning.heldOut(model, kmax, blocks, -1, Tuning.DEFAULT_SEED, JobProgress.progress(control));
        } catch (CancelledException e) {
            throw new CancellationException("tuning superseded");
        }
    }

    /**
     * The blocks of a choice over the model's reference rows, with each row's time and group looked up by its
     * table row (the model's canonical order is not the table's).
     */
    private HeldOutBlocks blocks(KnnModel model, HeldOutChoice choice, String groupColumn) {
        long[] times = null;
        int[] groups = null;
        if (choice == HeldOutChoice.DAYS) {
            if (timeColumn == null) {
                throw new NearfitException("tuning by days: the file has no time column");
            }
            times = HeldOutBlocks.timesOf(model.data(), (TimeColumn) table.column(timeColumn));
        }
        if (choice == HeldOutChoice.GROUP) {
            if (groupColumn == null) {
                throw new NearfitException("tuning by group: choose a group column with g");
            }
            groups = HeldOutBlocks.groupsOf(model.data(), (CategoryColumn) table.column(groupColumn));
        }
        return HeldOutBlocks.of(TuningCriterion.schemeOf(choice), model.data().size(), groups, times);
    }

    @Override
    public FlaggedRows flags(FitKey m, String groupColumn, String shownCondition, JobControl control) {
        KnnModel model = references.model(m, null, -1);
        if (model.data().isCategory()) {
            return FlagListing.forCategory();
        }
        // The same settings give the same flags, so a new shown condition only filters the kept ones.
        FlagResult f = references.flags(m);
        if (f == null) {
            try {
                f = Flags.leaveOneOut(model, JobProgress.progress(control));
            } catch (CancelledException e) {
                throw new CancellationException("flags superseded");
            }
            references.keepFlags(m, f);
        }
        nearfit.table.RowSet shown = shownCondition.equals(m.condition()) ? null : references.rows(shownCondition);
        return FlagListing.of(table, model, f, timeColumn, groupColumn, shown);
    }

    @Override
    public synchronized PlotCells plot(PlotScene scene, int width, int height) {
        CanvasKind kind = scene.ascii() ? CanvasKind.ASCII : CanvasKind.BRAILLE;
        Scene drawn = points.scene(scene);
        // The points are binned once per data, range and size; a new curve, band, flags or crosshair is drawn
        // over a copy of them.
        if (pointLayer == null || pointLayer.width() != width || pointLayer.height() != height
                || pointLayer.kind() != kind || !pointLayer.fits(drawn)) {
            pointLayer = ScatterComposer.points(drawn, width, height, kind);
        }
        ComposedPlot composed = ScatterComposer.compose(drawn, pointLayer);
        Cells strip;
        CurveResult c = scene.curve();
        if (c != null && scene.mode() != PlotMode.RESIDUALS_OVER_TIME && !allNaN(c.width())) {
            boolean time = table.column(scene.request().displayInput()).type() == nearfit.table.ColumnType.TIME;
            strip = new GridCells(StripLabel.strip(composed.frame(), width, c.x(), c.width(), time, kind));
        } else {
            strip = new GridCells(nearfit.plot.CellGrid.builder(width, 1).build());
        }
        return new PlotCells(new GridCells(composed.grid()), strip);
    }

    private static boolean allNaN(double[] v) {
        for (double d : v) {
            if (!Double.isNaN(d)) {
                return false;
            }
        }
        return true;
    }

    @Override
    public Cells tuningChart(TuningFigures t, int currentK, int width, int height, boolean ascii) {
        double[] k = new double[t.kmax()];
        for (int i = 0; i < k.length; i++) {
            k[i] = i + 1;
        }
        TuningScene s = new TuningScene(k, t.values(), t.se(), t.bestK(), t.oneSeK(), "");
        return new GridCells(TuningChart.compose(s, width, height, ascii ? CanvasKind.ASCII : CanvasKind.BRAILLE));
    }

    @Override
    public void writePng(PlotScene scene, int width, int height, OutputStream out) throws IOException {
        if (!ImageIO.write(PngRenderer.render(points.scene(scene), width, height), "png", out)) {
            throw new IOException("no PNG writer in this Java runtime");
        }
    }
}
