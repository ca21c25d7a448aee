package nearfit.model;

/**
 * The reference rows of a model, column by column as primitive arrays.
 *
 * <p>Invariants: every array has {@link #size()} elements; {@code inputs[j][i]} is input j of row i
 * in the inputs' own units (unscaled); exactly one of {@code response} and {@code responseCodes} is
 * non-null; {@code groupCodes} is {@code null} when the model has no group column, and a code of -1
 * marks a missing group. The arrays are shared, not copied: treat them as read-only.
 *
 * @param inputs        input values, one array per input column
 * @param response      number responses, or {@code null} for a category response
 * @param responseCodes class codes of a category response, or {@code null}
 * @param groupCodes    group codes, or {@code null}
 * @param sourceLines   each row's source value: its 1-based CSV line, or for Parquet rows its file and row index
 *                      as {@link nearfit.table.RowSource} packs them (read through {@link SourceInfo#rowSource()})
 */
public record ReferenceRows(double[][] inputs, double[] response, int[] responseCodes, int[] groupCodes,
                            long[] sourceLines) {
    /** Checks the invariants. */
    public ReferenceRows {
        int n = sourceLines.length;
        if (inputs.length == 0) {
            throw new IllegalArgumentException("reference rows need at least one input");
        }
        for (double[] column : inputs) {
            requireLength(column.length, n, "an input");
        }
        if ((response == null) == (responseCodes == null)) {
            throw new IllegalArgumentException("a reference has either number or category responses");
        }
        requireLength(response != null ? response.length : responseCodes.length, n, "the response");
        if (groupCodes != null) {
            requireLength(groupCodes.length, n, "the group");
        }
    }

    /** The number of reference rows. */
    public int size() {
        return sourceLines.length;
    }

    private static void requireLength(int length, int n, String what) {
        if (length != n) {
            throw new IllegalArgumentException(what + " has " + length + " values for " + n + " rows");
        }
    }
}
