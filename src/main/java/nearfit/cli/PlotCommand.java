package nearfit.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.Callable;

import javax.imageio.ImageIO;

import nearfit.knn.Band;
import nearfit.knn.Curve;
import nearfit.knn.EstimateKind;
import nearfit.knn.FlagResult;
import nearfit.knn.Flags;
import nearfit.knn.KnnModel;
import nearfit.knn.KnnSettings;
import nearfit.knn.ReferenceData;
import nearfit.plot.CanvasKind;
import nearfit.plot.ComposedPlot;
import nearfit.plot.Palette;
import nearfit.plot.PngRenderer;
import nearfit.plot.ScatterComposer;
import nearfit.plot.Scene;
import nearfit.plot.TextRenderer;
import nearfit.table.NearfitException;
import nearfit.table.SortedValues;
import nearfit.table.TimeColumn;
import nearfit.table.VisibleText;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

/**
 * {@code nearfit plot}: the response against the display input with the fitted curve, the band and
 * the flagged rows, as braille (or ASCII) text on standard output or as a PNG picture. With several
 * inputs the curve is drawn along the display input with the others held at their medians.
 */
@Command(name = "plot", mixinStandardHelpOptions = true, sortOptions = false,
        description = "Plot the response against the first -x input with the k-nearest-neighbour curve, its band "
                + "and the flagged rows: text on standard output (braille; plain when not a terminal) or --png.")
final class PlotCommand implements Callable<Integer> {
    /** Default text size in cells and picture size in pixels. */
    static final int[] TEXT_SIZE = {100, 30};
    static final int[] PNG_SIZE = {1200, 800};
    /** Curve points across the display input's range. */
    static final int CURVE_POINTS = 400;

    @Parameters(index = "0", paramLabel = "FILE", description = "CSV file (plain or gzip), Parquet file, or folder of Parquet files; - for standard input.")
    String file;

    @Mixin
    ColumnOptions columns;

    @Mixin
    KOption k;

    @Option(names = "--size", paramLabel = "WxH", converter = OptionNumbers.Size.class,
            description = "Text: cells (default 100x30); PNG: pixels (default 1200x800).")
    OptionNumbers.PlotSize size;

    @Option(names = "--ascii", description = "ASCII characters instead of braille.")
    boolean ascii;

    @Option(names = "--png", paramLabel = "OUT.png", description = "Write a PNG picture instead of text "
            + "(- writes it to standard output).")
    Path png;

    @Mixin
    TuningOptions tuning;

    @Mixin
    ModelOptions model;

    @Override
    public Integer call() {
        int chosenK = k.value();
        int[] dims = size == null ? (png == null ? TEXT_SIZE : PNG_SIZE)
                : png == null ? sizeWithin(20, 1000) : sizeWithin(120, 8000);
        tuning.validate();
        List<Path> inputs = "-".equals(file) ? List.of() : List.of(ArgumentPath.of(file));
        CommandOutput.check(png, model.force, inputs);
        PrintWriter err = model.err();
        boolean auto = chosenK == OptionNumbers.K_AUTO;
        ReferenceInput input = ReferenceInput.load(file, columns, model, err, auto ? tuning.timeColumn() : null,
                auto && tuning.wantsFirstTime(), false);
        nearfit.knn.HeldOutBlocks blocks = auto ? tuning.blocks(input.data(), input.source().table(), input.group())
                : null;
        Scene scene = scene(input, tuning.fit(input.data(), blocks, model.settings(1,
                KnnSettings.DEFAULT_FLAG_THRESHOLD), chosenK, err, model.quiet).engine());
        if (png != null) {
            byte[] picture = pngBytes(scene, dims);
            CommandOutput.bytes(png, model.force, inputs, model.out(), out -> out.write(picture));
            return 0;
        }
        ComposedPlot plot = ScatterComposer.compose(scene, dims[0], dims[1], ascii ? CanvasKind.ASCII : CanvasKind.BRAILLE);
        PrintWriter out = model.out();
        // Escape codes only for a terminal; a pipe or a file gets plain text.
        out.print(System.console() != null ? TextRenderer.ansi(plot.grid(), Palette.night())
                : TextRenderer.plain(plot.grid()));
        out.flush();
        return 0;
    }

    /**
     * The PNG encoded in memory (a few hundred KB), so the file is written by plain stream writes: an image
     * stream over the file itself, left open by a failed write, was closed again by the image library's
     * own shutdown hook and printed a stack trace after the one-line error.
     */
    private static byte[] pngBytes(Scene scene, int[] dims) {
        java.io.ByteArrayOutputStream bytes = new java.io.ByteArrayOutputStream(1 << 18);
        try {
            ImageIO.setUseCache(false);
            if (!ImageIO.write(PngRenderer.render(scene, dims[0], dims[1]), "png", bytes)) {
                throw new NearfitException("--png: no PNG writer in this Java runtime");
            }
        } catch (java.io.IOException e) {
            throw new NearfitException("--png: cannot encode the picture: " + e.getMessage());
        }
        return bytes.toByteArray();
    }

    private Scene scene(ReferenceInput input, KnnModel engine) {
        ReferenceData data = engine.data();
        double[] x = data.input(0);
        Scene.Builder b = Scene.builder(x, data.isCategory() ? classesAsNumbers(data) : data.response());
        String title = "k = " + engine.settings().k() + (engine.settings().estimate() == EstimateKind.MEDIAN ? ", median" : "")
                + ", " + data.size() + " rows"
                + (model.where == null ? "" : ", " + model.where.trim());
        // Names come from the file: control characters are made visible before they reach a terminal.
        b.labels(VisibleText.of(title), VisibleText.of(data.inputNames()[0]), VisibleText.of(data.responseName()));
        if (input.source().table().column(data.inputNames()[0]) instanceof TimeColumn) {
            b.timeAxis();
        }
        if (data.isCategory()) {
            return b.classes(data.classes()).build();
        }
        Curve curve = engine.curve(0, heldAtMedians(data), grid(x), nearfit.knn.Progress.NONE);
        b.curve(curve.x(), curve.estimates().fit());
        if (engine.settings().band() != Band.NONE) {
            b.band(curve.x(), curve.estimates().bandLow(), curve.estimates().bandHigh(), Scene.BandStyle.SHADED);
        }
        if (data.size() > engine.settings().k() + 1) {
            FlagResult flags = Flags.leaveOneOut(engine, TerminalProgress.of(model.err(),
                    "flags", model.quiet));
            b.flags(flaggedOf(x, flags), flaggedOf(data.response(), flags));
        }
        return b.build();
    }

    /** The other inputs held at their medians (Hyndman and Fan definition 7); the display slot is unused. */
    private static double[] heldAtMedians(ReferenceData data) {
        double[] held = new double[data.dimensions()];
        for (int j = 1; j < held.length; j++) {
            held[j] = SortedValues.of(data.input(j)).median();
        }
        return held;
    }

    /** Evenly spaced points over the display input's range. */
    private static double[] grid(double[] x) {
        double lo = Double.POSITIVE_INFINITY;
        double hi = Double.NEGATIVE_INFINITY;
        for (double v : x) {
            lo = Math.min(lo, v);
            hi = Math.max(hi, v);
        }
        if (!(lo <= hi)) {
            throw new NearfitException("-x: no rows to plot");
        }
        double[] g = new double[CURVE_POINTS];
        for (int i = 0; i < g.length; i++) {
            g[i] = lo + (hi - lo) * i / (g.length - 1);
        }
        return g;
    }

    private static double[] flaggedOf(double[] values, FlagResult flags) {
        double[] out = new double[flags.flaggedCount()];
        int at = 0;
        for (int i = 0; i < values.length; i++) {
            if (flags.flagged()[i]) {
                out[at++] = values[i];
            }
        }
        return out;
    }

    private static double[] classesAsNumbers(ReferenceData data) {
        double[] y = new double[data.size()];
        for (int i = 0; i < y.length; i++) {
            y[i] = data.classes()[i];
        }
        return y;
    }

    /** The --size given, each side from {@code least} to {@code most} (text: cells; PNG: pixels). */
    private int[] sizeWithin(int least, int most) {
        if (size.width() < least || size.height() < least || size.width() > most || size.height() > most) {
            throw new NearfitException("--size: \"" + size.width() + "x" + size.height()
                    + "\" is not WIDTHxHEIGHT with each from " + least + " to " + most);
        }
        return new int[] {size.width(), size.height()};
    }
}
