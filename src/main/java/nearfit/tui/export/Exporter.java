package nearfit.tui.export;

import java.io.IOException;
import java.io.OutputStream;
import java.io.OutputStreamWriter;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

import nearfit.model.ResultCsv;
import nearfit.model.SafeOutput;
import nearfit.table.NearfitException;
import nearfit.tui.bench.PlotScene;
import nearfit.tui.bench.Workbench;
import nearfit.tui.keys.Ask;
import nearfit.tui.keys.Effect;
import nearfit.tui.keys.ExportKind;
import nearfit.tui.keys.Overlay;
import nearfit.tui.keys.ViewState;
import nearfit.tui.results.Cells;
import nearfit.tui.results.ColumnInfo;
import nearfit.tui.results.ColumnKind;
import nearfit.tui.results.CurveResult;
import nearfit.tui.results.FlaggedRow;
import nearfit.tui.results.FlaggedRows;
import nearfit.tui.results.FrameInput;
import nearfit.tui.results.Results;

/**
 * Writes the export menu's files through {@link SafeOutput}: atomically, never over the input, and over an
 * existing file only once the user confirmed. CSV files go through {@link ResultCsv}, the tool's one CSV writer, so
 * they have the columns of {@code predict}.
 */
public final class Exporter {
    /** PNG size when the file name does not say, in pixels. */
    static final int PNG_WIDTH = 1200;
    static final int PNG_HEIGHT = 800;
    /** Plain-text plot size, in characters. */
    static final int TEXT_WIDTH = 100;
    static final int TEXT_HEIGHT = 32;
    private static final Pattern SIZED = Pattern.compile("(.+?)\\s+(\\d{2,5})x(\\d{2,5})");

    private final Workbench workbench;

    public Exporter(Workbench workbench) {
        this.workbench = workbench;
    }

    /** Writes the file, or asks for confirmation when it exists; the returned state says what happened. */
    public ViewState export(Effect.Export x, ViewState s, Results r, FrameInput in) {
        String file = x.file();
        int w = PNG_WIDTH;
        int h = PNG_HEIGHT;
        Matcher m = SIZED.matcher(file);
        if (x.kind() == ExportKind.PNG && m.matches()) {
            file = m.group(1);
            w = Integer.parseInt(m.group(2));
            h = Integer.parseInt(m.group(3));
        }
        Path target = Path.of(file);
        if (!x.force() && Files.exists(target)) {
            return s.edit().overlay(Overlay.CONFIRM).ask(Ask.FILE).typed(x.file()).export(x.kind()).build();
        }
        try {
            SafeOutput.write(target, x.force(), List.of(Path.of(workbench.source())), content(x.kind(), s, r, in, w, h));
            return s.edit().close().message("wrote " + file).build();
        } catch (NearfitException e) {
            return s.edit().close().warning(e.getMessage()).build();
        } catch (IllegalStateException e) {
            return s.edit().close().warning(e.getMessage()).build();
        }
    }

    private SafeOutput.Content content(ExportKind kind, ViewState s, Results r, FrameInput in, int w, int h) {
        if (in.request() == null) {
            throw new IllegalStateException("no rows to export: change the row condition");
        }
        PlotScene scene = PlotScene.of(s, r, in, false);
        return switch (kind) {
            case CURVE_CSV -> out -> curveCsv(s, require(r.curve(), "the curve"), out);
            case FLAGS_CSV -> out -> flagsCsv(s, timeInputs(s), require(r.flags(), "the flagged rows"), out);
            case PNG -> out -> workbench.writePng(scene, w, h, out);
            case TEXT -> out -> text(workbench.plot(scene, TEXT_WIDTH, TEXT_HEIGHT).plot(), out);
        };
    }

    private static <T> T require(T value, String what) {
        if (value == null) {
            throw new IllegalStateException(what + " is still being computed; export again in a moment");
        }
        return value;
    }

    static void curveCsv(ViewState s, CurveResult c, OutputStream out) throws IOException {
        ResultCsv csv = ResultCsv.on(out);
        csv.header(ResultCsv.curveColumns(s.displayInput()));
        for (int i = 0; i < c.size(); i++) {
            csv.number(c.x()[i]).number(c.fit()[i]).number(c.bandLow()[i]).number(c.bandHigh()[i])
                    .number(c.width()[i]).whole(c.neighbours()[i]);
            csv.endRow();
        }
        csv.flush();
    }

    /**
     * The flagged rows with predict's columns: the origin ({@code line}; {@code row}, or {@code file, row} for a
     * Parquet data set), the time column only when there is one and it is not an input,
     * the group column only when one is chosen, band cells empty (leave-one-out gives no band), times as ISO 8601.
     */
    static void flagsCsv(ViewState s, TimeInputs times, FlaggedRows f, OutputStream out) throws IOException {
        ResultCsv csv = ResultCsv.on(out);
        String time = times.column() == null || s.inputs().contains(times.column()) ? null : times.column();
        csv.header(ResultCsv.rowColumns(f.source(), time, s.groupColumn(), s.inputs(), s.response(), false, false));
        for (FlaggedRow row : f.rows()) {
            ResultCsv.origin(csv, f.source(), row.line());
            if (time != null) {
                csv.text(row.time());
            }
            if (s.groupColumn() != null) {
                csv.text(row.group());
            }
            for (int j = 0; j < row.inputs().size(); j++) {
                double v = row.inputs().get(j);
                if (times.isTime(j)) {
                    csv.time(v);
                } else {
                    csv.number(v);
                }
            }
            csv.number(row.response()).number(row.fit()).empty().empty().number(row.residual()).number(row.z());
            csv.endRow();
        }
        csv.flush();
    }

    /** The file's time column (or {@code null}) and which model inputs are times, written as ISO 8601. */
    record TimeInputs(String column, boolean[] inputIsTime) {
        boolean isTime(int j) {
            return j < inputIsTime.length && inputIsTime[j];
        }
    }

    private TimeInputs timeInputs(ViewState s) {
        boolean[] time = new boolean[s.inputs().size()];
        for (ColumnInfo c : workbench.columns()) {
            int j = s.inputs().indexOf(c.name());
            if (j >= 0) {
                time[j] = c.kind() == ColumnKind.TIME;
            }
        }
        return new TimeInputs(workbench.timeColumn(), time);
    }

    static void text(Cells cells, OutputStream out) throws IOException {
        Writer w = new OutputStreamWriter(out, StandardCharsets.UTF_8);
        for (int r = 0; r < cells.height(); r++) {
            StringBuilder sb = new StringBuilder();
            for (int c = 0; c < cells.width(); c++) {
                sb.appendCodePoint(cells.codePoint(c, r));
            }
            w.write(sb.toString().stripTrailing());
            w.write('\n');
        }
        w.flush();
    }
}
