package nearfit.tui.results;

import java.util.List;

/**
 * One flagged row: its leave-one-out residual is far from the others'.
 *
 * @param row      the row index in the table
 * @param line     the row's source value: its 1-based CSV line, or its Parquet file and row index packed as
 *                 {@link nearfit.table.RowSource} packs them (shown through {@link FlaggedRows#origin})
 * @param time     the row's time as ISO 8601 text, empty when there is no time column
 * @param group    the row's group label, empty when no group column is chosen
 * @param inputs   the row's input values, in model-input order
 * @param response the observed response
 * @param fit      the leave-one-out estimate
 * @param residual response minus fit
 * @param z        the modified z-score of the residual (Iglewicz and Hoaglin 1993)
 */
public record FlaggedRow(int row, long line, String time, String group, List<Double> inputs, double response,
        double fit, double residual, double z) {
    /** Copies the inputs so that the record stays immutable. */
    public FlaggedRow {
        inputs = List.copyOf(inputs);
    }
}
