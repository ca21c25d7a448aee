package nearfit.cli;

import java.io.IOException;
import java.io.Writer;
import java.nio.file.Path;
import java.util.Collection;

import it.unimi.dsi.fastutil.ints.IntArrays;
import nearfit.knn.FlagResult;
import nearfit.knn.Flags;
import nearfit.model.ModelColumns;
import nearfit.model.ReferenceRows;
import nearfit.model.ResultCsv;
import nearfit.model.RestoredModel;
import nearfit.table.NearfitException;

/**
 * {@code predict --loo}: the leave-one-out fit, residual and z of every reference row, from the rows
 * stored in the model, in source line order. The file named must be the model's reference file
 * (same SHA-256), so that the line numbers refer to it.
 */
final class LeaveOneOutCsv {
    private LeaveOneOutCsv() {
    }

    static void write(RestoredModel model, String file, Path target, boolean force, Collection<Path> inputs,
                      java.io.PrintWriter stdout) {
        requireReferenceFile(model, file);
        if (model.stored().columns().categoryResponse()) {
            throw new NearfitException("--loo: needs a number response; " + model.stored().columns().response()
                    + " is a category");
        }
        // under the reference scale, the neighbours' stored held-out residuals (an older file: their leave-one-out ones)
        double[] heldOut = model.zBasis() instanceof nearfit.knn.ZBasis.NeighbourResiduals r ? r.residuals() : null;
        FlagResult flags = Flags.leaveOneOut(model.engine(), heldOut, nearfit.knn.Progress.NONE);
        CommandOutput.text(target, force, inputs, stdout, w -> print(model, flags, w));
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
        ResultCsv csv = new ResultCsv(w);
        csv.header(ResultCsv.rowColumns(null, columns.group(), columns.inputs(), columns.response(), false));
        for (int i : order) {
            int p = positions[i];
            csv.whole(lines[p]);
            if (columns.group() != null) {
                int g = rows.groupCodes()[p];
                csv.text(g < 0 ? "" : columns.groupLabels().get(g));
            }
            for (double[] input : rows.inputs()) {
                csv.number(input[p]);
            }
            // Leave-one-out gives no band: its cells stay empty, so the columns are predict's.
            csv.number(rows.response()[p]).number(flags.looFit()[i]).empty().empty()
                    .number(flags.residual()[i]).number(flags.z()[i]);
            csv.endRow();
        }
        csv.flush();
    }
}
