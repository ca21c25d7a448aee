package nearfit.cli;

import java.io.BufferedWriter;
import java.io.IOException;
import java.io.OutputStream;
import java.io.OutputStreamWriter;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.time.Instant;
import java.util.Collection;
import java.util.List;

import nearfit.model.CsvCells;
import nearfit.model.SafeOutput;
import nearfit.table.NearfitException;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVPrinter;

/**
 * Writes scored rows as CSV (RFC 4180 quoting by Commons CSV; text cells neutralised by
 * {@link CsvCells}): {@code line}, the file's first time column (when it has one and it is not an
 * input), the group, the inputs, the response, then {@code fit, band_lo,
 * band_hi, resid, z} for a number response or {@code class, share} for a category response. Times
 * are written in ISO 8601 (UTC).
 */
final class PredictionCsv {
    /** Which rows of a block to write. */
    @FunctionalInterface
    interface RowFilter {
        boolean keep(ScoredRows.Block block, int i);
    }

    /** Writes the CSV to the writer it is given. */
    @FunctionalInterface
    interface Body {
        void writeTo(Writer w) throws IOException;
    }

    private final CSVPrinter csv;
    private final ScoredRows source;
    private final List<String> classLabels;
    /** Whether the time column is written on its own (it is not one of the inputs). */
    private final boolean timeColumn;

    /** Starts a CSV of {@code source}'s rows on {@code w} and writes its header. */
    PredictionCsv(Writer w, ScoredRows source, String responseName, List<String> classLabels) throws IOException {
        this.csv = new CSVPrinter(w, CSVFormat.RFC4180.builder().setRecordSeparator('\n').get());
        this.source = source;
        this.classLabels = classLabels;
        this.timeColumn = source.time() != null && !source.inputNames().contains(source.time().name());
        header(responseName);
    }

    /** Scores every row of {@code s} block by block and writes those {@code filter} keeps. */
    static void write(ScoredRows s, String responseName, List<String> classLabels, Path target, boolean force,
                      Collection<Path> inputs, Writer stdout, RowFilter filter) {
        write(target, force, inputs, stdout, w -> {
            PredictionCsv csv = new PredictionCsv(w, s, responseName, classLabels);
            s.forEachBlock(b -> csv.rows(b, filter));
            csv.flush();
        });
    }

    /** Runs {@code body} on {@code target} through {@link SafeOutput}, or on {@code stdout} when target is null. */
    static void write(Path target, boolean force, Collection<Path> inputs, Writer stdout, Body body) {
        if (target == null) {
            try {
                body.writeTo(stdout);
            } catch (IOException e) {
                throw new NearfitException("cannot write to standard output: " + e.getMessage());
            }
            return;
        }
        SafeOutput.write(target, force, inputs, (OutputStream out) -> {
            Writer w = new BufferedWriter(new OutputStreamWriter(out, StandardCharsets.UTF_8), 1 << 16);
            body.writeTo(w);
            w.flush();
        });
    }

    /** Writes the rows of {@code block} that {@code filter} keeps. */
    void rows(ScoredRows.Block block, RowFilter filter) throws IOException {
        for (int i = 0; i < block.size(); i++) {
            if (filter.keep(block, i)) {
                record(block, i);
            }
        }
    }

    void flush() throws IOException {
        csv.flush();
    }

    private void header(String responseName) throws IOException {
        csv.print("line");
        if (timeColumn) {
            csv.print(CsvCells.text(source.time().name()));
        }
        if (source.group() != null) {
            csv.print(CsvCells.text(source.group().name()));
        }
        for (String name : source.inputNames()) {
            csv.print(CsvCells.text(name));
        }
        boolean hasResponse = source.hasResponse();
        if (hasResponse) {
            csv.print(CsvCells.text(responseName));
        }
        if (!source.categoryResponse()) {
            csv.print("fit");
            csv.print("band_lo");
            csv.print("band_hi");
            if (hasResponse) {
                csv.print("resid");
                csv.print("z");
            }
        } else {
            csv.print("class");
            csv.print("share");
        }
        csv.println();
    }

    private void record(ScoredRows.Block b, int i) throws IOException {
        csv.print(Long.toString(b.lines()[i]));
        if (timeColumn) {
            csv.print(cell(b.times()[i], true));
        }
        if (b.groups() != null) {
            int g = b.groups()[i];
            csv.print(g < 0 ? "" : CsvCells.text(source.group().labels().get(g)));
        }
        for (int j = 0; j < b.x().length; j++) {
            csv.print(cell(b.x()[j][i], source.timeInput(j)));
        }
        if (b.estimates() != null) {
            numbers(b, i);
        } else {
            if (b.actualClass() != null) {
                int a = b.actualClass()[i];
                csv.print(a < 0 ? "" : CsvCells.text(classLabels.get(a)));
            }
            int c = b.votes().winner()[i];
            csv.print(c < 0 ? "" : CsvCells.text(classLabels.get(c)));
            csv.print(CsvCells.number(b.votes().share()[i]));
        }
        csv.println();
    }

    private void numbers(ScoredRows.Block b, int i) throws IOException {
        double[] y = b.response();
        double fit = b.estimates().fit()[i];
        if (y != null) {
            csv.print(CsvCells.number(y[i]));
        }
        csv.print(CsvCells.number(fit));
        csv.print(CsvCells.number(b.estimates().bandLow()[i]));
        csv.print(CsvCells.number(b.estimates().bandHigh()[i]));
        if (y != null) {
            csv.print(CsvCells.number(y[i] - fit));
            csv.print(CsvCells.number(b.z()[i]));
        }
    }

    /** A number, or a time (epoch ms, exact in a double) in ISO 8601 UTC; empty when missing (NaN). */
    static String cell(double v, boolean time) {
        if (Double.isNaN(v)) {
            return "";
        }
        return time ? Instant.ofEpochMilli((long) v).toString() : CsvCells.number(v);
    }
}
