package nearfit.cli;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Collection;

import it.unimi.dsi.fastutil.ints.IntArrays;
import nearfit.knn.FlagResult;
import nearfit.knn.Flags;
import nearfit.model.ModelColumns;
import nearfit.model.ReferenceRows;
import nearfit.model.ResultCsv;
import nearfit.model.ResultParquet;
import nearfit.model.ResultSink;
import nearfit.model.RestoredModel;
import nearfit.model.SourceInfo;
import nearfit.table.NearfitException;
import nearfit.table.RowSource;

/**
 * {@code predict --loo}: the leave-one-out fit, residual and z of every reference row, from the rows
 * stored in the model, in source order, with predict's columns (a CSV's {@code line}; a Parquet file's
 * {@code row}; a data set's {@code file, row}), as CSV or, when the output name ends in {@code .parquet}, as
 * Parquet. The file named must be the model's reference (same SHA-256; for a Parquet data set, every file
 * the rows come from), so that the lines and row indexes refer to it.
 */
final class LeaveOneOutCsv {
    private LeaveOneOutCsv() {
    }

    static void write(RestoredModel model, String file, Path target, boolean force, Collection<Path> inputs,
                      java.io.PrintWriter stdout) {
        requireReference(model.stored().source(), file);
        if (model.stored().columns().categoryResponse()) {
            throw new NearfitException("--loo: needs a number response; " + model.stored().columns().response()
                    + " is a category");
        }
        // under the reference scale, the neighbours' stored held-out residuals (an older file: their leave-one-out ones)
        double[] heldOut = model.zBasis() instanceof nearfit.knn.ZBasis.NeighbourResiduals r ? r.residuals() : null;
        FlagResult flags = Flags.leaveOneOut(model.engine(), heldOut, nearfit.knn.Progress.NONE);
        if (PredictionCsv.isParquet(target)) {
            CommandOutput.bytes(target, force, inputs, stdout, out -> {
                java.io.OutputStream buffered = new java.io.BufferedOutputStream(out, 1 << 16);
                print(model, flags, new ResultParquet(buffered, "nearfit " + ToolVersion.get()));
            });
            return;
        }
        CommandOutput.text(target, force, inputs, stdout,
                w -> print(model, flags, CommandOutput.csv(w, target, stdout)));
    }

    private static void requireReference(SourceInfo source, String file) {
        if (source.parquetFiles() != null && source.sha256() == null) {
            requireDataSet(source, file);
            return;
        }
        String expected = source.sha256();
        if ("-".equals(file) || expected == null) {
            throw new NearfitException("--loo: needs the reference file by name, and a model fitted on a named file");
        }
        String actual = SourceTable.sha256Of(ArgumentPath.of(file), file);
        if (!expected.equals(actual)) {
            throw NearfitException.inFile(file, "--loo: is not the model's reference file "
                    + source.name() + " (its SHA-256 differs)");
        }
    }

    /**
     * A model fitted on a folder of Parquet files: {@code file} must be a folder holding each file the reference
     * rows come from, at the same path within it and with the same SHA-256. Files added since do not matter: no
     * reference row points at them.
     */
    private static void requireDataSet(SourceInfo source, String file) {
        Path folder = "-".equals(file) ? null : ArgumentPath.of(file);
        if (folder == null || !Files.isDirectory(folder)) {
            throw NearfitException.inFile(file, "--loo: is not the model's reference data set " + source.name()
                    + " (the model was fitted on a folder of Parquet files)");
        }
        String fitted = source.name().endsWith("/") ? source.name() : source.name() + "/";
        String given = file.endsWith("/") ? file : file + "/";
        for (SourceInfo.SourceFile f : source.parquetFiles()) {
            String within = f.name().startsWith(fitted) ? f.name().substring(fitted.length()) : f.name();
            Path path = folder.resolve(within);
            String shown = given + within;
            if (!Files.isRegularFile(path)) {
                throw NearfitException.inFile(shown, "--loo: no such file; the model's reference rows come from "
                        + f.name());
            }
            if (!f.sha256().equals(SourceTable.sha256Of(path, shown))) {
                throw NearfitException.inFile(shown, "--loo: is not the file the model's reference rows come from ("
                        + f.name() + "; its SHA-256 differs)");
            }
        }
    }

    private static void print(RestoredModel model, FlagResult flags, ResultSink sink) throws IOException {
        ModelColumns columns = model.stored().columns();
        ReferenceRows rows = model.stored().rows();
        RowSource origin = model.stored().source().rowSource();
        int[] positions = flags.rowIds();
        long[] lines = rows.sourceLines();
        int[] order = new int[positions.length];
        for (int i = 0; i < order.length; i++) {
            order[i] = i;
        }
        // Source order: by line, or by file and then row index (the packed value's order).
        IntArrays.quickSort(order, (a, b) -> Long.compare(lines[positions[a]], lines[positions[b]]));
        sink.header(ResultCsv.rowColumns(origin, null, columns.group(), columns.inputs(), columns.response(), false,
                false));
        for (int i : order) {
            int p = positions[i];
            ResultCsv.origin(sink, origin, lines[p]);
            if (columns.group() != null) {
                int g = rows.groupCodes()[p];
                sink.text(g < 0 ? "" : columns.groupLabels().get(g));
            }
            for (double[] input : rows.inputs()) {
                sink.number(input[p]);
            }
            // Leave-one-out gives no band: its cells stay empty, so the columns are predict's.
            sink.number(rows.response()[p]).number(flags.looFit()[i]).empty().empty()
                    .number(flags.residual()[i]).number(flags.z()[i]);
            sink.endRow();
        }
        sink.finish();
    }
}
