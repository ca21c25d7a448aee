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
import nearfit.table.NumericColumn;
import nearfit.table.TimeColumn;
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
        for (int i = 0; i < s.rows().size(); i++) {
            if (filter.keep(i)) {
                record(csv, s, classLabels, i);
            }
        }
        csv.flush();
    }

    private static void header(CSVPrinter csv, ScoredRows s, String responseName) throws IOException {
        csv.print("line");
        if (s.group() != null) {
            csv.print(CsvCells.text(s.group().name()));
        }
        for (NumericColumn c : s.inputs()) {
            csv.print(CsvCells.text(c.name()));
        }
        boolean hasResponse = s.response() != null || s.actualClass() != null;
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
        int row = s.rows().row(i);
        csv.print(Long.toString(s.source().table().lineOf(row)));
        if (s.group() != null) {
            csv.print(s.group().code(row) < 0 ? "" : CsvCells.text(s.group().label(row)));
        }
        for (NumericColumn c : s.inputs()) {
            csv.print(cell(c, row));
        }
        if (s.estimates() != null) {
            double fit = s.estimates().fit()[i];
            if (s.response() != null) {
                csv.print(CsvCells.number(s.response()[i]));
            }
            csv.print(CsvCells.number(fit));
            csv.print(CsvCells.number(s.estimates().bandLow()[i]));
            csv.print(CsvCells.number(s.estimates().bandHigh()[i]));
            if (s.response() != null) {
                csv.print(CsvCells.number(s.response()[i] - fit));
                csv.print(CsvCells.number(s.z()[i]));
            }
        } else {
            if (s.actualClass() != null) {
                int a = s.actualClass()[i];
                csv.print(a < 0 ? "" : CsvCells.text(classLabels.get(a)));
            }
            int c = s.classes()[i];
            csv.print(c < 0 ? "" : CsvCells.text(classLabels.get(c)));
            csv.print(CsvCells.number(s.shares()[i]));
        }
        csv.println();
    }

    /** A number, or a time in ISO 8601 UTC; empty when missing. */
    static String cell(NumericColumn c, int row) {
        if (c.isMissing(row)) {
            return "";
        }
        if (c instanceof TimeColumn t) {
            return Instant.ofEpochMilli(t.epochMillis(row)).toString();
        }
        return CsvCells.number(c.asDouble(row));
    }
}
