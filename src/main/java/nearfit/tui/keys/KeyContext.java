package nearfit.tui.keys;

import java.util.List;

import nearfit.tui.results.ColumnInfo;
import nearfit.tui.results.ColumnKind;
import nearfit.tui.results.Results;

/**
 * What a key press may consult besides the state: the columns, the latest results and the data's extent.
 *
 * @param columns     the table's columns
 * @param results     the latest results
 * @param dataFrom    the smallest value of the display input over the used rows
 * @param dataTo      the largest value
 * @param groupCount  labels in the group column, 0 without one
 * @param classCount  labels in a category response, 0 for a number response
 * @param hasTime     whether the table has a time column
 * @param loadLines   lines in the load-report panel
 */
public record KeyContext(List<ColumnInfo> columns, Results results, double dataFrom, double dataTo,
        int groupCount, int classCount, boolean hasTime, int loadLines) {
    public KeyContext {
        columns = List.copyOf(columns);
    }

    /** The kind of a column, or {@code null} when there is none of that name. */
    public ColumnKind kindOf(String name) {
        for (ColumnInfo c : columns) {
            if (c.name().equals(name)) {
                return c.kind();
            }
        }
        return null;
    }
}
