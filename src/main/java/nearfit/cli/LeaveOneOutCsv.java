package nearfit.cli;

import java.io.BufferedWriter;
import java.io.IOException;
import java.io.OutputStreamWriter;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.Collection;
import java.util.List;

import it.unimi.dsi.fastutil.ints.IntArrays;
import nearfit.knn.FlagResult;
import nearfit.knn.Flags;
import nearfit.model.CsvCells;
import nearfit.model.ModelColumns;
import nearfit.model.ReferenceRows;
import nearfit.model.RestoredModel;
import nearfit.model.SafeOutput;
import nearfit.table.NearfitException;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVPrinter;

/**
 * {@code predict --loo}: the leave-one-out fit, residual and z of every reference row, from the rows
 * stored in the model, in source line order. The file named must be the model's reference file
 * (same SHA-256), so that the line numbers refer to it.
 */
final class LeaveOneOutCsv {
    private LeaveOneOutCsv() {
    }

    static void write(RestoredModel model, String file, Path target, boolean force, Collection<Path> inputs,
                      Writer stdout) {
        requireReferenceFile(model, file);
        if (model.stored().columns().categoryResponse()) {
            throw new NearfitException("--loo: needs a number response; " + model.stored().columns().response()
                    + " is a category");
        }
        FlagResult flags = Flags.leaveOneOut(model.engine(), nearfit.knn.Progress.NONE);
        if (target == null) {
            try {
                print(model, flags, stdout);
            } catch (IOException e) {
                throw new NearfitException("cannot write to standard output: " + e.getMessage());
            }
            return;
        }
        SafeOutput.write(target, force, inputs, out -> {
            Writer w = new BufferedWriter(new OutputStreamWriter(out, StandardCharsets.UTF_8), 1 << 16);
            print(model, flags, w);
            w.flush();
        });
    }

    private static void requireReferenceFile(RestoredModel model, String file) {
        String expected = model.stored().source().sha256();
        if ("-".equals(file) || expected == null) {
            throw new NearfitException("--loo: needs the reference file by name, and a model fitted on a named file");
        }
        String actual = SourceTable.sha256Of(ArgumentPath.of(file), file);
        if (!expected.equals(actual)) {
            throw NearfitException.inFile(file, "--loo: is not the model's reference file "
                    + model.stored().source().name() + " (its SHA-256 differs)");
        }
    }

    private static void print(RestoredModel model, FlagResult flags, Writer w) throws IOException {
        ModelColumns columns = model.stored().columns();
        ReferenceRows rows = model.stored().rows();
        int[] positions = flags.rowIds();
        long[] lines = rows.sourceLines();
        int[] order = new int[positions.length];
        for (int i = 0; i < order.length; i++) {
            order[i] = i;
        }
        IntArrays.quickSort(order, (a, b) -> Long.compare(lines[positions[a]], lines[positions[b]]));
        CSVPrinter csv = new CSVPrinter(w, CSVFormat.RFC4180.builder().setRecordSeparator('\n').get());
        csv.print("line");
        if (columns.group() != null) {
            csv.print(CsvCells.text(columns.group()));
        }
        for (String input : columns.inputs()) {
            csv.print(CsvCells.text(input));
        }
        for (String name : List.of(CsvCells.text(columns.response()), "fit", "band_lo", "band_hi", "resid", "z")) {
            csv.print(name);
        }
        csv.println();
        for (int i : order) {
            int p = positions[i];
            csv.print(Long.toString(lines[p]));
            if (columns.group() != null) {
                int g = rows.groupCodes()[p];
                csv.print(g < 0 ? "" : CsvCells.text(columns.groupLabels().get(g)));
            }
            for (double[] input : rows.inputs()) {
                csv.print(CsvCells.number(input[p]));
            }
            csv.print(CsvCells.number(rows.response()[p]));
            csv.print(CsvCells.number(flags.looFit()[i]));
            csv.print("");
            csv.print("");
            csv.print(CsvCells.number(flags.residual()[i]));
            csv.print(CsvCells.number(flags.z()[i]));
            csv.println();
        }
        csv.flush();
    }
}
