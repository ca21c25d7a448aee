package nearfit.tui.results;

import java.util.List;
import java.util.Map;
import nearfit.table.LoadNotes;

/**
 * What a frame shows besides the state and the results: facts about the table that the explorer looked up
 * once and keeps.
 *
 * @param source      the file as the user named it
 * @param totalRows   rows in the file
 * @param columns     the table's columns
 * @param heldValues  the held value of each held input, in its units
 * @param request     the curve request of the current state, {@code null} when it cannot be made (no rows)
 * @param groupLabels labels of the group column, empty without one
 * @param classLabels labels of a category response, empty for a number response
 * @param loading     load progress from 0 to 1, NaN once loaded
 * @param notes       what the loader found in the file
 */
public record FrameInput(String source, long totalRows, List<ColumnInfo> columns, Map<String, Double> heldValues,
        CurveRequest request, List<String> groupLabels, List<String> classLabels, double loading,
        LoadNotes notes) {
    public FrameInput {
        columns = List.copyOf(columns);
        heldValues = Map.copyOf(heldValues);
        groupLabels = List.copyOf(groupLabels);
        classLabels = List.copyOf(classLabels);
    }
}
