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
 * {@link CsvCells}): {@code line}, the group, the inputs, the response, then {@code fit, band_lo,
 * band_hi, resid, z} for a number response or {@code class, share} for a category response. Times
 * are written in ISO 8601 (UTC).
 */
final class PredictionCsv {
    /** Which of the scored rows to write. */
    @FunctionalInterface
    interface RowFilter {
        boolean keep(int i);
    }

    private PredictionCsv() {
    }

    /** Writes to {@code target} through {@link SafeOutput}, or to {@code stdout} when target is null. */
    static void write(ScoredRows s, String responseName, List<String> classLabels, Path target, boolean force,
                      Collection<Path> inputs, Writer stdout, RowFilter filter) {
        if (target == null) {
            try {
                print(s, responseName, classLabels, stdout, filter);
            } catch (IOException e) {
                throw new NearfitException("cannot write to standard output: " + e.getMessage());
            }
            return;
        }
        SafeOutput.write(target, force, inputs, (OutputStream out) -> {
            Writer w = new BufferedWriter(new OutputStreamWriter(out, StandardCharsets.UTF_8), 1 << 16);
            print(s, responseName, classLabels, w, filter);
            w.flush();
        });
    }

    private static void print(ScoredRows s, String responseName, List<String> classLabels, Writer w,
                              RowFilter filter) throws IOException {
        CSVPrinter csv = new CSVPrinter(w, CSVFormat.RFC4180.builder().setRecordSeparator('\n').get());
        header(csv, s, responseName);
        for (int i = 0; i < s.read().rows().size(); i++) {
            if (filter.keep(i)) {
                record(csv, s, classLabels, i);
            }
        }
        csv.flush();
    }

    private static void header(CSVPrinter csv, ScoredRows s, String responseName) throws IOException {
        ScoredRows.ReadRows read = s.read();
        csv.print("line");
        if (read.group() != null) {
            csv.print(CsvCells.text(read.group().name()));
        }
        for (String name : read.inputNames()) {
            csv.print(CsvCells.text(name));
        }
        boolean hasResponse = read.response() != null || read.actualClass() != null;
        if (hasResponse) {
            csv.print(CsvCells.text(responseName));
        }
        if (s.estimates() != null) {
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

    private static void record(CSVPrinter csv, ScoredRows s, List<String> classLabels, int i) throws IOException {
        ScoredRows.ReadRows read = s.read();
        int row = read.rows().row(i);
        csv.print(Long.toString(read.lines()[i]));
        if (read.group() != null) {
            csv.print(read.group().code(row) < 0 ? "" : CsvCells.text(read.group().label(row)));
        }
        for (int j = 0; j < read.x().length; j++) {
            csv.print(cell(read.x()[j][i], read.timeInputs()[j]));
        }
        double[] y = read.response();
        if (s.estimates() != null) {
            double fit = s.estimates().fit()[i];
            if (y != null) {
                csv.print(CsvCells.number(y[i]));
            }
            csv.print(CsvCells.number(fit));
            csv.print(CsvCells.number(s.estimates().bandLow()[i]));
            csv.print(CsvCells.number(s.estimates().bandHigh()[i]));
            if (y != null) {
                csv.print(CsvCells.number(y[i] - fit));
                csv.print(CsvCells.number(s.z()[i]));
            }
        } else {
            if (read.actualClass() != null) {
                int a = read.actualClass()[i];
                csv.print(a < 0 ? "" : CsvCells.text(classLabels.get(a)));
            }
            int c = s.classes()[i];
            csv.print(c < 0 ? "" : CsvCells.text(classLabels.get(c)));
            csv.print(CsvCells.number(s.shares()[i]));
        }
        csv.println();
    }

    /** A number, or a time (epoch ms, exact in a double) in ISO 8601 UTC; empty when missing (NaN). */
    static String cell(double v, boolean time) {
        if (Double.isNaN(v)) {
            return "";
        }
        return time ? Instant.ofEpochMilli((long) v).toString() : CsvCells.number(v);
    }
}
