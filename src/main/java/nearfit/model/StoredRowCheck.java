package nearfit.model;

import nearfit.knn.InputTransform;
import nearfit.knn.KnnSettings;
import nearfit.table.RowSource;

/**
 * The checks of a model file's stored rows against its manifest, made before the engine sees them:
 * every stored input is finite; a number response is finite or missing (a missing one makes its row
 * unusable, as a missing cell does in a CSV file); at least one row, and at least k rows, are usable;
 * and the stored scaling (and whitening) turn every usable row into finite coordinates, since a
 * non-finite coordinate would stall the index search. Each failure is an
 * {@link IllegalArgumentException} that names the entry or field and the stored row, with the row's
 * origin as its source names it (a CSV line, or a Parquet file and row index).
 */
final class StoredRowCheck {
    private StoredRowCheck() {
    }

    static void check(ReferenceRows rows, ModelColumns columns, KnnSettings settings, double[] center,
                      double[] spread, double[] whitening, RowSource origin) {
        int n = rows.size();
        double[][] inputs = rows.inputs();
        int d = inputs.length;
        for (int j = 0; j < d; j++) {
            double[] x = inputs[j];
            for (int i = 0; i < n; i++) {
                if (!Double.isFinite(x[i])) {
                    throw new IllegalArgumentException("entry input." + j + " (" + columns.inputs().get(j) + ") holds "
                            + x[i] + " at " + rowName(rows, i, origin) + "; stored inputs must be finite");
                }
            }
        }
        int usable = usableRows(rows, columns, origin);
        if (usable == 0) {
            throw new IllegalArgumentException("the model holds no usable reference rows (every stored row misses "
                    + "its response " + columns.response() + ")");
        }
        if (settings.k() > usable) {
            throw new IllegalArgumentException("manifest field \"k\" is " + settings.k() + "; it must not exceed the "
                    + usable + " usable reference rows");
        }
        checkCoordinates(rows, columns, settings, center, spread, whitening, origin);
    }

    private static int usableRows(ReferenceRows rows, ModelColumns columns, RowSource origin) {
        double[] y = rows.response();
        if (y == null) {
            return rows.size(); // codes are checked against their dictionary: all 0 or more
        }
        int usable = 0;
        for (int i = 0; i < y.length; i++) {
            if (Double.isInfinite(y[i])) {
                throw new IllegalArgumentException("entry response (" + columns.response() + ") holds " + y[i]
                        + " at " + rowName(rows, i, origin) + "; a stored response is finite or missing (NaN)");
            }
            if (!Double.isNaN(y[i])) {
                usable++;
            }
        }
        return usable;
    }

    /** Applies the stored transform row by row (no n×d copy) and names the parameter that overflows. */
    private static void checkCoordinates(ReferenceRows rows, ModelColumns columns, KnnSettings settings,
                                         double[] center, double[] spread, double[] whitening,
                                         RowSource origin) {
        int d = center.length;
        double[][] inputs = rows.inputs();
        InputTransform scaledOnly = new InputTransform(settings.scaling(), center, spread, null);
        InputTransform full = whitening == null ? null : new InputTransform(scaledOnly.scaling(), center, spread,
                whitening);
        double[] raw = new double[d];
        double[] out = new double[d];
        for (int i = 0; i < rows.size(); i++) {
            for (int j = 0; j < d; j++) {
                raw[j] = inputs[j][i];
            }
            scaledOnly.apply(raw, out);
            for (int j = 0; j < d; j++) {
                if (!Double.isFinite(out[j])) {
                    throw new IllegalArgumentException("manifest field \"scaling.spread[" + j + "]\" is " + spread[j]
                            + ", which makes input " + columns.inputs().get(j) + " of " + rowName(rows, i, origin)
                            + " infinite once scaled");
                }
            }
            if (full != null) {
                full.apply(raw, out);
                for (int j = 0; j < d; j++) {
                    if (!Double.isFinite(out[j])) {
                        throw new IllegalArgumentException("manifest field \"scaling.whitening\" makes coordinate "
                                + j + " of " + rowName(rows, i, origin) + " infinite");
                    }
                }
            }
        }
    }

    /** "stored row 4 (source line 1099)"; for Parquet rows "(source row 7)" or "(source row part-1.parquet:7)". */
    private static String rowName(ReferenceRows rows, int i, RowSource origin) {
        return "stored row " + (i + 1) + " (source " + origin.heading() + " " + origin.label(rows.sourceLines()[i]) + ")";
    }
}
