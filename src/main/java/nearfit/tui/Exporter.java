package nearfit.tui;

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

import nearfit.model.CsvCells;
import nearfit.model.SafeOutput;
import nearfit.table.NearfitException;

/**
 * Writes the export menu's files through {@link SafeOutput}: atomically, never over the input, and over an
 * existing file only once the user confirmed. CSV cells go through {@link CsvCells}.
 */
final class Exporter {
    /** PNG size when the file name does not say, in pixels. */
    static final int PNG_WIDTH = 1200;
    static final int PNG_HEIGHT = 800;
    /** Plain-text plot size, in characters. */
    static final int TEXT_WIDTH = 100;
    static final int TEXT_HEIGHT = 32;
    private static final Pattern SIZED = Pattern.compile("(.+?)\\s+(\\d{2,5})x(\\d{2,5})");

    private final Workbench workbench;

    Exporter(Workbench workbench) {
        this.workbench = workbench;
    }

    /** Writes the file, or asks for confirmation when it exists; the returned state says what happened. */
    ViewState export(Effect.Export x, ViewState s, Results r, FrameInput in) {
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
        PlotScene scene = ScreenPainter.scene(s, r, in, new Look(false, false));
        return switch (kind) {
            case CURVE_CSV -> out -> curveCsv(s, require(r.curve(), "the curve"), out);
            case FLAGS_CSV -> out -> flagsCsv(s, require(r.flags(), "the flagged rows"), out);
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
        Writer w = new OutputStreamWriter(out, StandardCharsets.UTF_8);
        w.write(cell(s.displayInput()) + ",fit,band_low,band_high,window_width,neighbours\r\n");
        for (int i = 0; i < c.size(); i++) {
            w.write(CsvCells.number(c.x()[i]) + "," + CsvCells.number(c.fit()[i]) + ","
                    + CsvCells.number(c.bandLow()[i]) + "," + CsvCells.number(c.bandHigh()[i]) + ","
                    + CsvCells.number(c.width()[i]) + "," + c.neighbours()[i] + "\r\n");
        }
        w.flush();
    }

    static void flagsCsv(ViewState s, FlaggedRows f, OutputStream out) throws IOException {
        Writer w = new OutputStreamWriter(out, StandardCharsets.UTF_8);
        StringBuilder head = new StringBuilder("line,time,group");
        for (String in : s.inputs()) {
            head.append(',').append(cell(in));
        }
        w.write(head.append(',').append(cell(s.response())).append(",fit,residual,z\r\n").toString());
        for (FlaggedRow row : f.rows()) {
            StringBuilder sb = new StringBuilder().append(row.line()).append(',').append(cell(row.time()))
                    .append(',').append(cell(row.group()));
            for (double v : row.inputs()) {
                sb.append(',').append(CsvCells.number(v));
            }
            sb.append(',').append(CsvCells.number(row.response())).append(',').append(CsvCells.number(row.fit()))
                    .append(',').append(CsvCells.number(row.residual())).append(',').append(CsvCells.number(row.z()));
            w.write(sb.append("\r\n").toString());
        }
        w.flush();
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

    /** A text cell: neutralised against formulas (OWASP), quoted as RFC 4180 asks when it holds , " or a line break. */
    static String cell(String text) {
        String t = CsvCells.text(text);
        if (t.indexOf(',') >= 0 || t.indexOf('"') >= 0 || t.indexOf('\n') >= 0 || t.indexOf('\r') >= 0) {
            return '"' + t.replace("\"", "\"\"") + '"';
        }
        return t;
    }
}
