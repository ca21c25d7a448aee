package nearfit.cli;

import java.io.PrintWriter;
import java.util.List;

import nearfit.knn.ReferenceData;
import nearfit.table.CategoryColumn;
import nearfit.table.Column;
import nearfit.table.NumericColumn;
import nearfit.table.RowSet;

/**
 * The reference rows a command fits on, copied from the table into the engine's arrays: the file
 * loaded, the row condition applied, the inputs and the response as {@link ReferenceData} (rows with
 * a missing value left out by the engine), and the group column when one is named.
 *
 * @param source         the loaded file
 * @param data           the engine's reference rows; its row ids are table rows
 * @param responseLabels the dictionary of a category response, or empty for a number response
 * @param group          the group column, or {@code null}
 */
record ReferenceInput(SourceTable source, ReferenceData data, List<String> responseLabels, CategoryColumn group) {
    /**
     * Loads the file and builds the reference rows for the command's options, also keeping the time column a
     * held-out scheme needs: {@code timeColumn} (the {@code --time} column, or null) or, with {@code firstTime},
     * the file's first time column. {@code digest}: the file's SHA-256 is wanted (fit records it in the model).
     */
    static ReferenceInput load(String file, ColumnOptions columns, ModelOptions model, PrintWriter err,
                               String timeColumn, boolean firstTime, boolean digest) {
        List<String> inputs = columns.inputs();
        model.validate();
        ColumnRequest request = ColumnRequest.NONE.require("-x", inputs).require("-y", columns.response())
                .require("--group", model.group).where(model.where);
        if (timeColumn != null) {
            request = request.require("--time", timeColumn);
        }
        SourceTable source = SourceTable.load(file, request, firstTime, digest, model.threads(), model.quiet, err);
        RowSet rows = source.rows(model.where);
        double[][] x = new double[inputs.size()][];
        for (int j = 0; j < x.length; j++) {
            x[j] = SourceTable.values(source.numeric("-x", inputs.get(j)), rows);
        }
        String[] names = inputs.toArray(new String[0]);
        int[] ids = rows.toArray();
        CategoryColumn group = model.group == null ? null : source.category("--group", model.group.trim());
        Column y = source.column("-y", columns.response());
        if (y instanceof CategoryColumn c) {
            int[] codes = new int[ids.length];
            for (int i = 0; i < ids.length; i++) {
                codes[i] = c.code(ids[i]);
            }
            return new ReferenceInput(source, ReferenceData.category(names, x, c.name(), codes,
                    c.labels().size(), ids), c.labels(), group);
        }
        NumericColumn n = source.numeric("-y", columns.response());
        return new ReferenceInput(source, ReferenceData.numeric(names, x, n.name(), SourceTable.values(n, rows), ids),
                List.of(), group);
    }

    /** A one-line account of the rows used, for standard error. */
    String describe() {
        String dropped = data.droppedRows() == 0 ? "" : " (" + data.droppedRows() + " left out for a missing value)";
        return data.size() + " reference rows from " + source.name() + dropped;
    }
}
